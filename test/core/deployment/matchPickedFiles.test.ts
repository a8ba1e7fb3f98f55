import { describe, expect, it } from 'vitest';
import { matchPickedFiles, normalisePickedPath, parseDeploymentCsv } from '../../../core/deployment';
import { expectWhenceError } from '../../helpers/expectWhenceError';

// Expected values: the picked files each table line names (test-made tables and folders); '.', '..' and '\' are read as
// POSIX path resolution and Windows separators read them (common practice).
const table = (...files: string[]) => parseDeploymentCsv(['recorder,file,file_channel,microphone', ...files.map((file, i) => `R${i + 1},${file},1,M${i + 1}`)].join('\n') + '\n', 'deployment.csv');
const match = (files: string[], tablePath: string, picked: string[]) => Object.fromEntries([...matchPickedFiles(table(...files), tablePath, picked)].map(([file, index]) => [file, picked[index]]));

describe('normalisePickedPath()', () => {
  it('normalisePickedPath() drops ./ and empty components, turns backslashes into slashes, takes .. back and refuses climbing above the top', () => {
    expect(normalisePickedPath('./north//a.wav')).toBe('north/a.wav');
    expect(normalisePickedPath('north\\card1\\a.wav')).toBe('north/card1/a.wav');
    expect(normalisePickedPath('site/../audio/./a.wav')).toBe('audio/a.wav');
    expect(normalisePickedPath('../a.wav')).toBeUndefined();
  });
});

describe('matchPickedFiles()', () => {
  it('matchPickedFiles() matches exact relative paths, with ./ and backslashes, even where recorders share file names', () => {
    const picked = ['deployment.csv', 'north/REC_0001.WAV', 'south/REC_0001.WAV'];
    expect(match(['./north/REC_0001.WAV', 'south\\REC_0001.WAV'], 'deployment.csv', picked)).toEqual({ './north/REC_0001.WAV': 'north/REC_0001.WAV', 'south\\REC_0001.WAV': 'south/REC_0001.WAV' });
  });

  it('matchPickedFiles() resolves paths relative to the table\'s own folder within the picked folder, .. included', () => {
    const picked = ['site/deployment.csv', 'site/north/a.wav', 'audio/south/a.wav', 'north/a.wav'];
    expect(match(['north/a.wav', '../audio/south/a.wav'], 'site/deployment.csv', picked)).toEqual({ 'north/a.wav': 'site/north/a.wav', '../audio/south/a.wav': 'audio/south/a.wav' });
  });

  it('matchPickedFiles() matches a path by its end when the picked folder is above the table\'s, and an absolute path by its end', () => {
    const picked = ['season/site1/north/a.wav', 'season/site2/north/a.wav', 'season/site1/south/b.wav'];
    expect(match(['site1/north/a.wav', '/media/card/site1/south/b.wav'], 'deployment.csv', picked)).toEqual({ 'site1/north/a.wav': 'season/site1/north/a.wav', '/media/card/site1/south/b.wav': 'season/site1/south/b.wav' });
    expect(match(['C:\\field\\site2\\north\\a.wav'], 'deployment.csv', picked)).toEqual({ 'C:\\field\\site2\\north\\a.wav': 'season/site2/north/a.wav' });
  });

  it('matchPickedFiles() falls back to the unique base name (single files picked), then to a unique name differing only in case', () => {
    expect(match(['cards/north/N_001.wav', 'S_001.wav'], 'deployment.csv', ['N_001.wav', 'S_001.wav'])).toEqual({ 'cards/north/N_001.wav': 'N_001.wav', 'S_001.wav': 'S_001.wav' });
    expect(match(['n_001.wav'], 'deployment.csv', ['N_001.WAV'])).toEqual({ 'n_001.wav': 'N_001.WAV' });
  });

  it('matchPickedFiles() refuses a table file that matches no picked file, naming the line and saying what to pick', () => {
    expectWhenceError(() => matchPickedFiles(table('north/a.wav', 'south/missing.wav'), 'deployment.csv', ['north/a.wav']), 'deployment-file-not-picked', ['deployment.csv line 3: south/missing.wav', 'among the 1 picked file', 'Pick the folder that holds the table']);
    expectWhenceError(() => matchPickedFiles(table('a.wav'), 'deployment.csv', []), 'deployment-file-not-picked', ['line 2: a.wav', '0 picked files']);
    // ".." above the picked folder can still match by name, but not a file that is not there at all
    expectWhenceError(() => matchPickedFiles(table('../../b.wav'), 'deployment.csv', ['a.wav']), 'deployment-file-not-picked', ['line 2: ../../b.wav']);
  });

  it('matchPickedFiles() refuses a base name that two picked files share when no path tells them apart, naming both', () => {
    expectWhenceError(() => matchPickedFiles(table('REC_0001.WAV'), 'deployment.csv', ['north/REC_0001.WAV', 'south/REC_0001.WAV']), 'deployment-file-ambiguous', ['deployment.csv line 2: REC_0001.WAV matches 2 picked files', 'north/REC_0001.WAV, south/REC_0001.WAV', 'Pick the folder that holds the table']);
    expectWhenceError(() => matchPickedFiles(table('east/x.wav'), 'deployment.csv', ['a/x.wav', 'b/x.wav', 'c/x.wav', 'd/x.wav']), 'deployment-file-ambiguous', ['matches 4 picked files', 'c/x.wav, ...']);
  });
});
