// End to end: a scene heard by six separate recorders (core/simulate deployment: invented test scene), each with its own
// clock offset (up to 2 s) and drift (up to ±50 ppm), a file split each and a gap in one; `whence sync` and
// `whence locate --deployment` against the truth and against a synchronized multichannel file of the same scene.
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { clockNominalSeconds } from '../../core/deployment';
import { median } from '../../core/locate';
import { writeDeploymentScene, writeSceneWav, type WrittenDeployment } from '../../main/simulate';
import { runCliInProcess } from '../helpers/cli';
import { clockFitErrors, DEPLOYMENT_CLOCKS, deploymentScene } from '../helpers/deploymentScenes';

const scene = deploymentScene({ recorderSeconds: 110, splitSeconds: 40, gap: { fromSeconds: 55.5, toSeconds: 57.5 }, calibrationSeconds: [4, 10, 16, 92, 98, 104], soundSeconds: Array.from({ length: 17 }, (_, i) => 22 + 4 * i) });
let folder: string;
let written: WrittenDeployment;
let multichannelPath: string;

beforeAll(async () => {
  folder = mkdtempSync(join(tmpdir(), 'whence-deployment-'));
  written = await writeDeploymentScene(scene.spec, folder, { origin: { dayMilliseconds: Date.UTC(2026, 4, 14), secondsOfDay: 5 * 3600 }, calibrationSoundIds: scene.calibrationIds });
  multichannelPath = join(folder, 'multichannel.wav');
  await writeSceneWav(scene.spec.scene, multichannelPath);
}, 120_000);

afterAll(() => rmSync(folder, { recursive: true, force: true }));

interface LogFix { time_s?: number; x_m?: number; y_m?: number; status: string; local_time?: string }

/** Each test sound's fix (matched by emission time on the log's time base) and its horizontal error. */
function fixErrors(fixes: LogFix[], toLogSeconds: (trueSeconds: number) => number): number[] {
  return scene.spec.scene.sources.filter((s) => scene.soundIds.includes(s.id)).map((source) => {
    const matched = fixes.filter((fix) => fix.time_s !== undefined && Math.abs(fix.time_s - toLogSeconds(source.emissionTimeSeconds)) < 0.05);
    expect(matched).toHaveLength(1);
    return Math.hypot(matched[0]!.x_m! - source.eastMeters, matched[0]!.y_m! - source.northMeters);
  });
}

describe('recorder deployments end to end', () => {
  it('whence sync recovers every clock within 20 µs and 0.5 ppm of the truth (on the reference recorder\'s time)', async () => {
    const run = await runCliInProcess(['sync', '--deployment', written.deploymentPath, '--array', written.arrayPath, '--calibration', written.calibrationPath!, '--sound-speed', '343', '--json']);
    expect(run.exitCode, run.stderr).toBe(0);
    const fit = JSON.parse(run.stdout) as { recorders: Array<{ recorder: string; offsetSeconds: number; driftPpm: number; reference: boolean }>; startTimes: string[] };
    expect(fit.recorders.map((r) => r.recorder)).toEqual(['R1', 'R2', 'R3', 'R4', 'R5', 'R6']);
    expect(fit.recorders[0]!.reference).toBe(true);
    clockFitErrors(fit.recorders).forEach(({ offsetErrorSeconds, driftErrorPpm }) => {
      expect(offsetErrorSeconds).toBeLessThan(20e-6); // issue 9's bound
      expect(driftErrorPpm).toBeLessThan(0.5); // issue 9's bound
    });
    expect(fit.startTimes.every((line) => /bext TimeReference/.test(line))).toBe(true);
  }, 120_000);

  it('whence locate --deployment fixes the sounds in between as accurately as the synchronized multichannel file (median within 20 %)', async () => {
    const deployment = await runCliInProcess(['locate', '--deployment', written.deploymentPath, '--array', written.arrayPath, '--calibration', written.calibrationPath!, '--sound-speed', '343', '--height', '1', '--json']);
    expect(deployment.exitCode, deployment.stderr).toBe(0);
    const multichannel = await runCliInProcess(['locate', multichannelPath, '--array', written.arrayPath, '--sound-speed', '343', '--height', '1', '--json']);
    expect(multichannel.exitCode, multichannel.stderr).toBe(0);
    const deploymentLog = JSON.parse(deployment.stdout) as { log: { notes: string[] }; fixes: LogFix[] };
    // time_s counts from the deployment's earliest start on the reference recorder's (R1's) clock
    const deploymentErrors = fixErrors(deploymentLog.fixes, (t) => clockNominalSeconds(DEPLOYMENT_CLOCKS[0]!, t));
    const multichannelErrors = fixErrors((JSON.parse(multichannel.stdout) as { fixes: LogFix[] }).fixes, (t) => t);
    expect(median(deploymentErrors)).toBeLessThanOrEqual(1.2 * median(multichannelErrors)); // issue 9: within 20 %
    expect(median(deploymentErrors)).toBeLessThan(0.01); // inside the array at ~20 dB SNR (locatePipeline.test.ts: ≤ 0.1 m)
    expect(deploymentLog.log.notes.filter((note) => note.startsWith('clock R'))).toHaveLength(6);
    expect(deploymentLog.fixes.some((fix) => fix.local_time?.startsWith('2026-05-14T05:0'))).toBe(true);
  }, 300_000);

  it('spans located separately (--from/--to as seconds and local times) merge into one log; a log made with other settings is refused', async () => {
    const common = ['--deployment', written.deploymentPath, '--array', written.arrayPath, '--calibration', written.calibrationPath!, '--sound-speed', '343', '--height', '1'];
    const whole = await runCliInProcess(['locate', ...common, '--json']);
    const first = join(folder, 'span1.csv');
    const second = join(folder, 'span2.csv');
    expect((await runCliInProcess(['locate', ...common, '--to', '60', '--out', first])).exitCode).toBe(0);
    const secondRun = await runCliInProcess(['locate', ...common, '--from', '2026-05-14T05:00:55', '--out', second]);
    expect(secondRun.exitCode, secondRun.stderr).toBe(0);
    const merged = await runCliInProcess(['merge', first, second]);
    expect(merged.exitCode, merged.stderr).toBe(0);
    const rows = merged.stdout.split('\n').filter((line) => line !== '' && !line.startsWith('#')).slice(1);
    // the spans overlap by 5 s: events found twice are kept once, so the merged log has the whole run's events
    expect(rows).toHaveLength((JSON.parse(whole.stdout) as { fixes: unknown[] }).fixes.length);
    expect(merged.stdout).toMatch(/# note: merged 2 spans/);
    expect(merged.stdout.match(/# note: clock R\d/g)).toHaveLength(6);
    const otherArray = join(folder, 'other-height.csv');
    await runCliInProcess(['locate', ...common.map((arg) => (arg === '1' ? '2' : arg)), '--to', '30', '--out', otherArray]);
    const refused = await runCliInProcess(['merge', first, otherArray]);
    expect(refused.exitCode).toBe(1);
    expect(refused.stderr).toMatch(/does not belong with .*span1\.csv: their settings differ/);
    expect(readFileSync(first, 'utf8')).toMatch(/^# Whence/); // inputs untouched
  }, 300_000);
});
