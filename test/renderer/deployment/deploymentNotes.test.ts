import { beforeAll, describe, expect, it } from 'vitest';
import type { DeploymentClockReport, DeploymentLayout } from '../../../core/deployment';
import { CLOCKS_NOT_FITTED_NOTE } from '../../../core/export';
import { deploymentErrorHint, deploymentLogNotes, deploymentOpenedText } from '../../../renderer/deployment/deploymentNotes';
import { nameTimeProblem } from '../../../renderer/deployment/OpenDeploymentDialog';
import { fixtureLayout } from './layoutFixture';

// Expected values: the head lines `whence locate --deployment` writes (main/cli/deploymentOptions.ts, through core/export)
// for the invented fixture deployment, and this project's texts.
let layout: DeploymentLayout;
beforeAll(async () => { layout = await fixtureLayout(); });

describe('deploymentLogNotes()', () => {
  it('writes the deployment, its start-time sources and gaps, then that the clocks are the files\' own', () => {
    expect(deploymentLogNotes(layout, { kind: 'files' })).toEqual([
      'deployment: deployment.csv, 2 recorders, 2 microphones; time_s from its earliest start 2026-05-14T05:00:00.000',
      'file start times: 4 from bext TimeReference; 1 gap between files (silent, flagged on the events they touch)',
      CLOCKS_NOT_FITTED_NOTE,
    ]);
  });

  it('ends with the clock fit\'s own head lines once fitted', () => {
    const report = { headLines: ['clock time base: recorder \'A\' is the reference', 'clock A: reference, offset 0.000000 s'] } as DeploymentClockReport;
    expect(deploymentLogNotes(layout, { kind: 'fitted', report }).slice(2)).toEqual(report.headLines);
  });
});

describe('deploymentOpenedText()', () => {
  it('counts recorders, files, microphones and gaps and says which clocks are in use', () => {
    expect(deploymentOpenedText(layout)).toBe('Opened the deployment deployment.csv: 2 recorders, 4 files, 2 microphones, 3.00 s from 2026-05-14 05:00:00.000; 1 gap. It is read through the files\' own clocks until you fit them (Clock fit).');
  });
});

describe('deploymentErrorHint()', () => {
  it('says where the app takes a file-name time pattern, and to pick the whole folder when files were not found', () => {
    expect(deploymentErrorHint('no-start-time')).toMatch(/Open deployment… under "Start times in file names"/);
    expect(deploymentErrorHint('deployment-file-not-picked')).toMatch(/^Pick the folder/);
    expect(deploymentErrorHint('csv')).toBe('');
    expect(deploymentErrorHint(undefined)).toBe('');
  });
});

describe('nameTimeProblem()', () => {
  it('accepts an empty or complete pattern and names the missing fields of an incomplete one', () => {
    expect(nameTimeProblem('')).toBeUndefined();
    expect(nameTimeProblem('REC_YYYYMMDD_hhmmss*')).toBeUndefined();
    expect(nameTimeProblem('REC_hhmmss')).toMatch(/^The pattern 'REC_hhmmss' lacks YYYY, MM, DD;/);
  });
});
