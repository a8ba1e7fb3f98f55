import { describe, expect, it } from 'vitest';
import { fnv1a64Hex } from '../../../core/audio';
import { deploymentChannelIndices, deploymentContentHash, type DeploymentLayout } from '../../../core/deployment';
import { parseArrayCsv } from '../../../core/project';
import { expectWhenceError } from '../../helpers/expectWhenceError';

const layout = { tableName: 'deployment.csv', microphones: [{ label: 'N1', recorderIndex: 0, indexInRecorder: 0 }, { label: 'E1', recorderIndex: 1, indexInRecorder: 0 }, { label: 'S1', recorderIndex: 1, indexInRecorder: 1 }] } as DeploymentLayout;

describe('deploymentContentHash()', () => {
  it('deploymentContentHash() is FNV-1a 64 over the table text and the files\' hashes, one line each, as UTF-16 code units', () => {
    // Expected: fnv1a64Hex (tested against the published FNV vectors in test/core/audio) over the same bytes built by hand
    const text = 'r,f\na1b2\n0011';
    const bytes = Uint8Array.from([...text].flatMap((char) => [char.charCodeAt(0), 0]));
    expect(deploymentContentHash('r,f', ['a1b2', '0011'])).toBe(fnv1a64Hex(bytes));
    expect(deploymentContentHash('r,f', ['0011', 'a1b2'])).not.toBe(deploymentContentHash('r,f', ['a1b2', '0011']));
    expect(deploymentContentHash('r,f ', ['a1b2', '0011'])).not.toBe(deploymentContentHash('r,f', ['a1b2', '0011']));
  });
});

describe('deploymentChannelIndices()', () => {
  it('deploymentChannelIndices() gives each array microphone its deployment channel by label, whatever the array\'s channel column', () => {
    // Expected: the positions of the labels in the layout's microphone list (N1 0, E1 1, S1 2)
    const geometry = parseArrayCsv('channel,label,x_m,y_m\n1,S1,0,30\n2,N1,0,0\n3,E1,30,0\n', 'array.csv');
    expect(deploymentChannelIndices(layout, geometry)).toEqual([2, 0, 1]);
  });

  it('deploymentChannelIndices() refuses an array microphone that is on no recorder, naming it', () => {
    const geometry = parseArrayCsv('channel,label,x_m,y_m\n1,N1,0,0\n2,W9,-30,0\n3,E1,30,0\n', 'array.csv');
    expectWhenceError(() => deploymentChannelIndices(layout, geometry), 'microphone-not-deployed', ["'W9'", 'deployment.csv', "microphone column must use the array table's labels"]);
  });
});
