// The project document: read (JSON parse, migrate, validate), write (validate, stable JSON) and a new empty one.
// Units as in schema.ts; the file is UTF-8 JSON with a schemaVersion, validated with zod on every load and save.
import { z } from 'zod';
import { WhenceError } from '../errors';
import { printableText } from '../text';
import { WHENCE_VERSION } from '../version';
import { CURRENT_PROJECT_SCHEMA_VERSION, migrateProjectData } from './migrations';
import { projectDocumentSchemaV3 } from './schema';

export type ProjectDocument = z.infer<typeof projectDocumentSchemaV3>;
export type ProjectMedium = ProjectDocument['medium'];
export type ProjectSettings = ProjectDocument['settings'];
export type ProjectArray = ProjectDocument['array'];
export type RecordingReference = NonNullable<ProjectDocument['recording']>;
export type RecordingIdentity = FixLogEntry['recording'];
export type FixQuality = NonNullable<FixLogEntry['quality']>;
export type FixLogEntry = ProjectDocument['fixes'][number];
export type MapView = NonNullable<ProjectDocument['view']>;

/** The schema of the version this Whence writes. */
export const projectDocumentSchema = projectDocumentSchemaV3;

export interface ReadProjectResult {
  document: ProjectDocument;
  /** The schema version the file was written with (less than the current one when it was migrated). */
  fromSchemaVersion: number;
  /** What each applied migration changed, oldest first. */
  migrationSteps: string[];
}

/** "array.microphones[2].eastMeters" from zod's path. */
export function formatFieldPath(path: readonly PropertyKey[]): string {
  return path.reduce<string>((text, key) => (typeof key === 'number' ? `${text}[${key}]` : text === '' ? String(key) : `${text}.${String(key)}`), '');
}

/** The first problem zod found, as "field: what is wrong"; `describePath` names a field path (default: dotted, or `the document`). */
export function firstIssueText(error: z.ZodError, describePath: (path: readonly PropertyKey[]) => string = (path) => formatFieldPath(path) || 'the document'): string {
  const issue = error.issues[0];
  if (issue === undefined) return 'the document does not match the project schema';
  const where = describePath(issue.path);
  const what = issue.message.replace(/, received undefined$/, ', but it is missing');
  return `${where}: ${what}`;
}

function invalid(fileName: string, error: z.ZodError): WhenceError {
  return new WhenceError('project-invalid', `${fileName} is not a valid Whence project: ${firstIssueText(error)}. Correct that field (the file is JSON text), or open its backup (${fileName}.bak) if there is one.`);
}

/** Parses a project file's text: JSON, then migration to the current version, then validation. */
export function readProjectText(text: string, fileName: string): ReadProjectResult {
  let parsed: unknown;
  try {
    parsed = JSON.parse(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text);
  } catch (error) {
    // JSON.parse quotes the file's bytes: escaped and short.
    const reason = printableText(error instanceof Error ? error.message : String(error), 120);
    throw new WhenceError('project-corrupt', `${fileName} could not be read as a Whence project: its JSON text is broken (${reason}). The file may be truncated or damaged; open its backup (${fileName}.bak) or the recovery copy if there is one.`);
  }
  if (typeof parsed !== 'object' || parsed === null || Array.isArray(parsed)) {
    throw new WhenceError('project-invalid', `${fileName} is not a Whence project: it holds JSON ${Array.isArray(parsed) ? 'array' : typeof parsed === 'object' ? 'null' : typeof parsed} where a project object is expected. Check that you chose a .whence project file.`);
  }
  const migrated = migrateProjectData(parsed as Record<string, unknown>, fileName);
  const result = projectDocumentSchema.safeParse(migrated.data);
  if (!result.success) throw invalid(fileName, result.error);
  return { document: result.data, fromSchemaVersion: migrated.fromVersion, migrationSteps: migrated.steps };
}

/** Parses a project file's text to the current document; WhenceError project-corrupt, project-too-new or project-invalid. */
export function parseProjectDocument(text: string, fileName: string): ProjectDocument {
  return readProjectText(text, fileName).document;
}

/** Validates a document (as it is about to be written) without serializing it; project-invalid names the first bad field. */
export function validateProjectDocument(document: unknown, what = 'The project'): ProjectDocument {
  const result = projectDocumentSchema.safeParse(document);
  if (!result.success) throw new WhenceError('project-invalid', `${what} cannot be saved: ${firstIssueText(result.error)}. This is a fault in Whence; please report it. Your work is still open.`);
  return result.data;
}

/** The file text of a document: validated, keys in schema order, two-space indented, stamped with this Whence's version. */
export function serializeProjectDocument(document: ProjectDocument): string {
  const { schemaVersion, name, writtenBy: _previous, ...rest } = validateProjectDocument(document);
  return `${JSON.stringify({ schemaVersion, name, writtenBy: `Whence ${WHENCE_VERSION}`, ...rest }, null, 2)}\n`;
}

/** Temperature sigma of a new project, whose temperature is not yet known (as the command line assumes). */
export const UNKNOWN_TEMPERATURE_SIGMA_KELVIN = 5;

/** A new project: no array, no recording, no fixes; air at 20 °C (to be set), 2-D, 95 % confidence, PHAT, automatic band. */
export function emptyProjectDocument(name: string): ProjectDocument {
  return {
    schemaVersion: CURRENT_PROJECT_SCHEMA_VERSION,
    name,
    array: { microphones: [] },
    medium: { medium: 'air', temperatureCelsius: 20, model: 'cramer', temperatureSigmaKelvin: UNKNOWN_TEMPERATURE_SIGMA_KELVIN },
    settings: { dimensions: 2, confidence: 0.95, weighting: 'phat', bandHz: 'automatic' },
    fixes: [],
  };
}
