import { mkdirSync, mkdtempSync, realpathSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { createUserFileGrants } from '../../../main/electron/userFileGrants';

// Expected behaviour: the Electron security checklist (the renderer reaches only what the user gave it); no outside values.
function folderWithFiles() {
  const folder = realpathSync(mkdtempSync(join(tmpdir(), 'whence-grants-')));
  mkdirSync(join(folder, 'sub'));
  writeFileSync(join(folder, 'chosen.wav'), 'x');
  writeFileSync(join(folder, 'secret.wav'), 'x');
  return folder;
}

describe('createUserFileGrants()', () => {
  it('grants exactly the files given, whatever spelling of the same path is asked for later', async () => {
    const folder = folderWithFiles();
    const grants = createUserFileGrants();
    await grants.grant(join(folder, 'chosen.wav'));
    await expect(grants.require(join(folder, 'chosen.wav'))).resolves.toBe(join(folder, 'chosen.wav'));
    expect(await grants.isGranted(`${folder}/sub/../chosen.wav`)).toBe(true);
    expect(await grants.isGranted(`${folder}//chosen.wav`)).toBe(true);
    expect(await grants.isGranted(join(folder, 'secret.wav'))).toBe(false);
    expect(await grants.isGranted(`${folder}/chosen.wav/../secret.wav`)).toBe(false);
    expect(await grants.isGranted(folder)).toBe(false);
  });

  it('refuses with path-not-chosen, naming the path and how to open it', async () => {
    const grants = createUserFileGrants();
    await expect(grants.require('/etc/passwd.wav')).rejects.toMatchObject({
      code: 'path-not-chosen',
      message: expect.stringMatching(/^Whence reads only files you chose: \/etc\/passwd\.wav was not chosen .* Open it with File > Open, or drop it on the window\.$/),
    });
  });

  it('follows links: a link to a chosen file is that file, a link from a chosen name to another file is not', async () => {
    const folder = folderWithFiles();
    const grants = createUserFileGrants();
    await grants.grant(join(folder, 'chosen.wav'));
    symlinkSync(join(folder, 'chosen.wav'), join(folder, 'sub', 'to-chosen.wav'));
    symlinkSync(join(folder, 'secret.wav'), join(folder, 'sub', 'to-secret.wav'));
    expect(await grants.isGranted(join(folder, 'sub', 'to-chosen.wav'))).toBe(true);
    expect(await grants.isGranted(join(folder, 'sub', 'to-secret.wav'))).toBe(false);
  });

  it('grants nothing for an empty path or one with a NUL, and refuses such a request', async () => {
    const folder = folderWithFiles();
    const grants = createUserFileGrants();
    await grants.grant('');
    await grants.grant(`${join(folder, 'chosen.wav')}\0`);
    expect(await grants.isGranted(join(folder, 'chosen.wav'))).toBe(false);
    await grants.grant(join(folder, 'chosen.wav'));
    expect(await grants.isGranted(`${join(folder, 'chosen.wav')}\0.txt`)).toBe(false);
  });

  it('records the path before its first await, so a request right after a drop finds it', async () => {
    const grants = createUserFileGrants({ realpath: () => new Promise(() => undefined) });
    void grants.grant('/data/dropped.wav');
    expect(await Promise.race([grants.isGranted('/data/dropped.wav'), new Promise((resolve) => setTimeout(() => resolve('timeout'), 50))])).toBe(true);
  });

  it('forgets the oldest grants beyond its limit', async () => {
    const grants = createUserFileGrants({ maxGrants: 2, realpath: async () => { throw new Error('no such file'); } });
    for (const name of ['a', 'b', 'c']) await grants.grant(`/data/${name}.wav`);
    expect(await grants.isGranted('/data/a.wav')).toBe(false);
    expect(await grants.isGranted('/data/c.wav')).toBe(true);
  });
});
