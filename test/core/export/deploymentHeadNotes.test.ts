import { describe, expect, it } from 'vitest';
import type { DeploymentLayout } from '../../../core/deployment';
import { CLOCKS_NOT_FITTED_NOTE, deploymentHeadNotes } from '../../../core/export';

// Expected values: the survey log head this project specifies for a deployment (issue 9 item 4: the head records the clock
// fits), for an invented layout of three recorders, one stamped by file name and one with a gap.
type HeadLayout = Pick<DeploymentLayout, 'tableName' | 'origin' | 'recorders' | 'microphones'>;
const file = (startSource: string) => ({ startSource }) as DeploymentLayout['recorders'][number]['files'][number];
const LAYOUT = {
  tableName: 'season.csv',
  origin: { dayMilliseconds: Date.UTC(2026, 4, 14), secondsOfDay: 5 * 3600 + 0.25 },
  recorders: [
    { name: 'N', files: [file('bext TimeReference'), file('bext TimeReference')], gaps: [] },
    { name: 'E', files: [file('file name')], gaps: [{ fromSeconds: 1, toSeconds: 2 }] },
    { name: 'S', files: [file('bext TimeReference')], gaps: [] },
  ],
  microphones: [{ label: 'N1' }, { label: 'E1' }, { label: 'E2' }, { label: 'S1' }],
} as unknown as HeadLayout;

describe('deploymentHeadNotes()', () => {
  it('names the table, counts recorders, microphones, start-time sources and gaps, and says the clocks were not fitted', () => {
    expect(deploymentHeadNotes(LAYOUT)).toEqual([
      'deployment: season.csv, 3 recorders, 4 microphones; time_s from its earliest start 2026-05-14T05:00:00.250',
      'file start times: 3 from bext TimeReference, 1 from file name; 1 gap between files (silent, flagged on the events they touch)',
      CLOCKS_NOT_FITTED_NOTE,
    ]);
  });

  it('ends with the clock fit\'s head lines in place of the not-fitted line', () => {
    const notes = deploymentHeadNotes(LAYOUT, ['clock time base: recorder \'N\' is the reference', 'clock N: reference']);
    expect(notes.slice(2)).toEqual(['clock time base: recorder \'N\' is the reference', 'clock N: reference']);
    expect(notes).not.toContain(CLOCKS_NOT_FITTED_NOTE);
  });
});
