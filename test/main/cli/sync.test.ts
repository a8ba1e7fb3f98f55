import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { runCliInProcess } from '../../helpers/cli';

const folder = mkdtempSync(join(tmpdir(), 'whence-sync-cli-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));
const array = join(folder, 'array.csv');
writeFileSync(array, 'channel,label,x_m,y_m\n1,N1,0,0\n2,E1,30,0\n3,S1,0,30\n');

describe('whence sync and locate --deployment refusals', () => {
  it('sync without --calibration or --array says what to give (usage, exit 2)', async () => {
    const noCalibration = await runCliInProcess(['sync', '--deployment', join(folder, 'd.csv'), '--array', array]);
    expect(noCalibration.exitCode).toBe(2);
    expect(noCalibration.stderr).toMatch(/needs --calibration/);
    const noArray = await runCliInProcess(['sync', '--deployment', join(folder, 'd.csv'), '--calibration', 'c.csv']);
    expect(noArray.stderr).toMatch(/needs --array/);
  });

  it('a table naming a missing file says which line and where files are looked for (exit 1)', async () => {
    const table = join(folder, 'deployment.csv');
    writeFileSync(table, 'recorder,file,file_channel,microphone\nnorth,north/missing.wav,1,N1\n');
    const run = await runCliInProcess(['locate', '--deployment', table, '--array', array, '--sound-speed', '343']);
    expect(run.exitCode).toBe(1);
    expect(run.stderr).toMatch(/deployment\.csv line 2: .*missing\.wav.*relative to the table's folder/);
  });

  it('locate --deployment refuses a recording given as well', async () => {
    const both = await runCliInProcess(['locate', 'x.wav', '--deployment', join(folder, 'deployment.csv'), '--array', array]);
    expect(both.exitCode).toBe(2);
    expect(both.stderr).toMatch(/reads the recordings the table lists/);
  });

  it('merge needs two logs and refuses a file that is not a survey log', async () => {
    expect((await runCliInProcess(['merge', array])).stderr).toMatch(/two or more survey logs/);
    const refused = await runCliInProcess(['merge', array, array]);
    expect(refused.exitCode).toBe(1);
    expect(refused.stderr).toMatch(/does not start with a Whence survey log head/);
  });
});
