// The recovery copy of unsaved work, in the app's data folder: written atomically after each change (the page debounces),
// offered back on every start until the user restores or discards it (the page writes none while it is on offer).
import { mkdir, readFile, rename, unlink } from 'node:fs/promises';
import { join } from 'node:path';
import { z } from 'zod';
import type { RecoveryCopy } from '../../core/contract';
import { readProjectText, serializeProjectDocument, type ProjectDocument } from '../../core/project';
import { errorCode, writeFileAtomic } from '../files';

export const RECOVERY_FILE_NAME = 'recovery.json';
export const CORRUPT_RECOVERY_FILE_NAME = 'recovery.corrupt.json';

const recoveryFileSchema = z.object({
  kind: z.literal('whence-recovery'),
  recoveryVersion: z.literal(1),
  savedAtIso: z.string(),
  projectPath: z.string().optional(),
  document: z.record(z.string(), z.unknown()),
});

export interface RecoveryStore {
  /** Replaces the recovery copy with this document (and where it was last saved, if it was). */
  write(document: ProjectDocument, projectPath?: string): Promise<void>;
  /**
   * The recovery copy, left in place: a second crash before the user chose offers it again. Null when there is none or it
   * is unreadable (a damaged copy is set aside as CORRUPT_RECOVERY_FILE_NAME).
   */
  take(): Promise<RecoveryCopy | null>;
  discard(): Promise<void>;
  /** Removes the recovery copy if it holds exactly this document (just saved); a newer unsaved change is kept. */
  discardIfSaved(savedDocument: ProjectDocument): Promise<void>;
}

function documentKey(document: ProjectDocument): string {
  const { writtenBy: _ignored, ...rest } = JSON.parse(serializeProjectDocument(document)) as ProjectDocument;
  return JSON.stringify(rest);
}

async function removeIfPresent(path: string): Promise<void> {
  await unlink(path).catch((error: unknown) => {
    if (errorCode(error) !== 'ENOENT') throw error;
  });
}

/** A recovery store in `folder` (created when first written); `clock` stamps each copy. */
export function createRecoveryStore(folder: string, clock: () => Date = () => new Date()): RecoveryStore {
  const currentPath = join(folder, RECOVERY_FILE_NAME);
  let queue: Promise<unknown> = Promise.resolve();
  // One operation at a time: a write never races a take or another write.
  const serial = <T>(operation: () => Promise<T>): Promise<T> => {
    const next = queue.then(operation, operation);
    queue = next.catch(() => undefined);
    return next;
  };

  async function readCurrent(): Promise<{ copy: RecoveryCopy } | 'none' | 'corrupt'> {
    let text: string;
    try {
      text = await readFile(currentPath, 'utf8');
    } catch (error) {
      if (errorCode(error) === 'ENOENT') return 'none';
      throw error;
    }
    try {
      const file = recoveryFileSchema.parse(JSON.parse(text));
      const { document } = readProjectText(JSON.stringify(file.document), 'the recovery copy');
      const copy: RecoveryCopy = { document, savedAtIso: file.savedAtIso };
      if (file.projectPath !== undefined) copy.projectPath = file.projectPath;
      return { copy };
    } catch {
      return 'corrupt';
    }
  }

  return {
    write: (document, projectPath) => serial(async () => {
      const file = { kind: 'whence-recovery', recoveryVersion: 1, savedAtIso: clock().toISOString(), projectPath, document: JSON.parse(serializeProjectDocument(document)) as unknown };
      await mkdir(folder, { recursive: true });
      await writeFileAtomic(currentPath, `${JSON.stringify(file)}\n`);
    }),
    take: () => serial(async () => {
      const current = await readCurrent();
      if (current === 'none') return null;
      if (current === 'corrupt') {
        await rename(currentPath, join(folder, CORRUPT_RECOVERY_FILE_NAME));
        return null;
      }
      return current.copy;
    }),
    discard: () => serial(() => removeIfPresent(currentPath)),
    discardIfSaved: (savedDocument) => serial(async () => {
      const current = await readCurrent();
      if (typeof current === 'object' && documentKey(current.copy.document) === documentKey(savedDocument)) await removeIfPresent(currentPath);
    }),
  };
}
