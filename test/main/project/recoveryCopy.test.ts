import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { emptyProjectDocument } from '../../../core/project';
import { CORRUPT_RECOVERY_FILE_NAME, createRecoveryStore, RECOVERY_FILE_NAME } from '../../../main/project';

const clock = () => new Date('2024-05-14T22:10:00.000Z');
const recoveryFolder = (): string => join(mkdtempSync(join(tmpdir(), 'whence-userdata-')), 'recovery');

describe('createRecoveryStore()', () => {
  // Expected values: the behaviour this project specifies (what is kept and discarded, when); no outside reference.
  it('gives back the unsaved document, with when it was kept and where it was saved before, until it is discarded', async () => {
    const folder = recoveryFolder();
    const store = createRecoveryStore(folder, clock);
    const document = emptyProjectDocument('unsaved pond survey');
    document.array.microphones.push({ channel: 1, label: 'A', eastMeters: 1, northMeters: 2, upMeters: 0, surveySigmaMeters: 0.1 });
    await store.write(document, '/surveys/pond.whence');
    const copy = await store.take();
    expect(copy).not.toBeNull();
    expect(copy!.document.array.microphones).toEqual(document.array.microphones);
    expect(copy!.document.name).toBe('unsaved pond survey');
    expect(copy!.savedAtIso).toBe('2024-05-14T22:10:00.000Z');
    expect(copy!.projectPath).toBe('/surveys/pond.whence');
    // A second crash before the user chose: the same copy is offered again, by a store started afresh.
    const again = await createRecoveryStore(folder, clock).take();
    expect(again?.document.name).toBe('unsaved pond survey');
    expect(readdirSync(folder)).toEqual([RECOVERY_FILE_NAME]);
    await store.discard();
    expect(await store.take()).toBeNull();
  });

  it('has nothing to give when nothing was kept', async () => {
    expect(await createRecoveryStore(recoveryFolder(), clock).take()).toBeNull();
  });

  it('sets a damaged recovery copy aside instead of failing', async () => {
    const folder = recoveryFolder();
    mkdirSync(folder, { recursive: true });
    writeFileSync(join(folder, RECOVERY_FILE_NAME), '{"kind":"whence-recovery","recoveryVersion":1,"savedAtIso":"x","document":{"schem');
    const store = createRecoveryStore(folder, clock);
    expect(await store.take()).toBeNull();
    expect(readdirSync(folder)).toEqual([CORRUPT_RECOVERY_FILE_NAME]);
    expect(await store.take()).toBeNull();
  });

  it('discardIfSaved() removes the copy only when it holds the document just saved', async () => {
    const folder = recoveryFolder();
    const store = createRecoveryStore(folder, clock);
    const saved = emptyProjectDocument('saved');
    await store.write(emptyProjectDocument('newer, unsaved'));
    await store.discardIfSaved(saved);
    expect(existsSync(join(folder, RECOVERY_FILE_NAME))).toBe(true);
    await store.write(saved);
    await store.discardIfSaved({ ...saved, writtenBy: 'Whence 0.0.1' });
    expect(existsSync(join(folder, RECOVERY_FILE_NAME))).toBe(false);
  });

  it('discard() removes the copy and is harmless when there is none', async () => {
    const folder = recoveryFolder();
    const store = createRecoveryStore(folder, clock);
    await store.discard();
    await store.write(emptyProjectDocument('x'));
    await store.discard();
    expect(await store.take()).toBeNull();
  });

  it('keeps the last of many writes made at once, atomically, with no temporary file left', async () => {
    const folder = recoveryFolder();
    const store = createRecoveryStore(folder, clock);
    await Promise.all(Array.from({ length: 8 }, (_, index) => store.write(emptyProjectDocument(`edit ${index}`))));
    expect(readdirSync(folder)).toEqual([RECOVERY_FILE_NAME]);
    expect(JSON.parse(readFileSync(join(folder, RECOVERY_FILE_NAME), 'utf8')).document.name).toBe('edit 7');
  });
});
