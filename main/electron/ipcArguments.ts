// The zod schema of each host request's arguments (a tuple, so extra or missing arguments are refused).
// Sizes in bytes; paths are checked again against pathPolicy.ts by the services.
import { z } from 'zod';
import { MAX_EXPORT_TEXT_CHARS, MAX_RECORDING_READ_BYTES, type HostApi, type HostRequestMethod } from '../../core/contract';
import { projectDocumentSchema } from '../../core/project';

const path = z.string().min(1).max(4096).refine((text) => !text.includes('\0'), 'a path cannot contain a NUL character');
const handleId = z.string().min(1).max(200);
const offsetBytes = z.number().int().nonnegative().max(Number.MAX_SAFE_INTEGER);
const lengthBytes = z.number().int().nonnegative().max(MAX_RECORDING_READ_BYTES, `at most ${MAX_RECORDING_READ_BYTES} bytes (256 MiB) per read`);

const saveProjectRequest = z.strictObject({ document: projectDocumentSchema, path: path.optional(), saveAs: z.boolean().optional() });
const exportTextRequest = z.strictObject({
  suggestedName: z.string().min(1).max(255),
  text: z.string().max(MAX_EXPORT_TEXT_CHARS),
  kind: z.enum(['csv', 'json', 'geojson']),
});

export const IPC_ARGUMENTS = {
  openRecordingDialog: z.tuple([]),
  openRecordingPath: z.tuple([path]),
  readRecordingBytes: z.tuple([handleId, offsetBytes, lengthBytes]),
  closeRecording: z.tuple([handleId]),
  openArrayDialog: z.tuple([]),
  openArrayPath: z.tuple([path]),
  openProjectDialog: z.tuple([]),
  openProjectPath: z.tuple([path]),
  saveProject: z.tuple([saveProjectRequest]),
  exportText: z.tuple([exportTextRequest]),
  listRecentProjects: z.tuple([]),
  writeRecoveryCopy: z.tuple([projectDocumentSchema, path.optional()]),
  takeRecoveryCopy: z.tuple([]),
  discardRecoveryCopy: z.tuple([]),
  openDemo: z.tuple([]),
} satisfies { [K in HostRequestMethod]: z.ZodType<Parameters<HostApi[K]>> };
