// The app worker's deployment handling (renderer/worker/deploymentSession) on simulated deployments (core/simulate, invented
// test scenes) written to a folder and read back as Blobs: opening, overview passes, the clock fit (calibration or shared sounds) and locating, against
// the simulated truth, a synchronized multichannel file of the same scene and the command line's own code path.
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readWavInfo } from '../../../core/audio';
import { clockNominalSeconds, clockRelativeTo, deploymentChannelIndices } from '../../../core/deployment';
import { median } from '../../../core/locate';
import { maxOf } from '../../../core/units';
import { envelopeFromFrames, envelopeFromSource, envelopePreviewFromFrames, spectrogramFromFrames, spectrogramFromSource } from '../../../core/overview';
import { parseArrayCsv } from '../../../core/project';
import { manualEvent } from '../../../core/detect';
import { locateEvent, runPipeline, type LocateContext } from '../../../core/pipeline';
import { settingsFromOptions } from '../../../main/cli/commands/locate';
import { chooseSpeed } from '../../../main/cli/mediumOptions';
import { useWasmFft } from '../../../main/dsp';
import { openFileByteSource } from '../../../main/io';
import { writeDeploymentScene, writeSceneWav, type WrittenDeployment } from '../../../main/simulate';
import { openDeploymentSession, type DeploymentSource } from '../../../renderer/worker/deploymentSession';
import type { SyncClocksParams } from '../../../renderer/worker/protocol';
import { spanCorrelations } from '../../../renderer/worker/spanCorrelations';
import { runCliInProcess } from '../../helpers/cli';
import { clockFitErrors, DEPLOYMENT_CLOCKS, deploymentScene } from '../../helpers/deploymentScenes';

const ORIGIN = { dayMilliseconds: Date.UTC(2026, 4, 14), secondsOfDay: 5 * 3600 };
let folder: string;

/** The folder as the app's folder picker hands it over: each file with its path below the picked folder, as a Blob. */
function picked(pickedFolder: string, tableName = 'deployment.csv'): DeploymentSource {
  const files = readdirSync(pickedFolder, { recursive: true, withFileTypes: true }).filter((entry) => entry.isFile()).map((entry) => {
    const path = relative(pickedFolder, join(entry.parentPath, entry.name));
    return { path, blob: new Blob([readFileSync(join(pickedFolder, path))]) };
  });
  return { kind: 'deployment', table: { name: tableName, text: readFileSync(join(pickedFolder, tableName), 'utf8') }, files };
}

beforeAll(() => { folder = mkdtempSync(join(tmpdir(), 'whence-worker-deployment-')); });
afterAll(() => rmSync(folder, { recursive: true, force: true }));

describe('openDeploymentSession() on a deployment with synchronized clocks', () => {
  // Six recorders whose clocks are exact (offset 0, drift 0), each with a file split, recorder 3 with a gap: every frame
  // outside the gap is the synchronized multichannel file's frame (the same scene rendered whole).
  const RECORDER_SECONDS = 12;
  const GAP = { fromSeconds: 7, toSeconds: 8.5 };
  const scene = deploymentScene({ recorderSeconds: RECORDER_SECONDS, splitSeconds: 5, gap: GAP, calibrationSeconds: [2], soundSeconds: [4, 6.5, 9.5] });
  scene.spec.scene.durationSeconds = RECORDER_SECONDS;
  scene.spec.recorders = scene.spec.recorders.map((recorder) => ({ ...recorder, clock: { offsetSeconds: 0, drift: 0, clockStartSeconds: 0 } }));
  let source: DeploymentSource;
  let multichannelPath: string;

  beforeAll(async () => {
    mkdirSync(join(folder, 'synchronized'));
    await writeDeploymentScene(scene.spec, join(folder, 'synchronized'), { origin: ORIGIN });
    source = picked(join(folder, 'synchronized'));
    multichannelPath = join(folder, 'synchronized.wav');
    await writeSceneWav(scene.spec.scene, multichannelPath);
  }, 120_000);

  it('opens the picked files into the virtual recording with its layout and a content hash of table and files', async () => {
    const session = await openDeploymentSession(source);
    expect(session.layout.recorders.map((r) => r.name)).toEqual(['R1', 'R2', 'R3', 'R4', 'R5', 'R6']);
    expect(session.layout.recorders[2]!.gaps).toHaveLength(1);
    expect(session.info.channelCount).toBe(6);
    expect(session.info.frameCount).toBe(RECORDER_SECONDS * 48_000); // every recorder starts at 0 and records 12 s (the scene)
    expect(session.info.startTime?.isoLocal).toBe('2026-05-14T05:00:00.000');
    expect(session.contentHash).toMatch(/^[0-9a-f]{16}$/);
    // the same table and files give the same hash; another table text (a renamed microphone) another
    expect((await openDeploymentSession(picked(join(folder, 'synchronized')))).contentHash).toBe(session.contentHash);
    const renamed = { ...source, table: { ...source.table, text: source.table.text.replace(',M6', ',M6b') } };
    expect((await openDeploymentSession(renamed)).contentHash).not.toBe(session.contentHash);
    await session.close();
  });

  it('the overview envelope, preview and spectrogram of the deployment are the multichannel file\'s, its gap silent', async () => {
    const session = await openDeploymentSession(source);
    const file = await openFileByteSource(multichannelPath);
    const info = await readWavInfo(file);
    expect(info.frameCount).toBe(session.info.frameCount);
    const pass = session.passRecording();
    const options = { blockFrames: 48_000, baseBucketFrames: 480 };
    const fromDeployment = await envelopeFromFrames(pass, options);
    await pass.close();
    const fromFile = await envelopeFromSource(file, info, options);
    const level = fromDeployment.levels[0]!;
    expect(level.bucketCount).toBe(fromFile.levels[0]!.bucketCount);
    const gapBuckets = (b: number) => (b + 1) * 480 > GAP.fromSeconds * 48_000 && b * 480 < GAP.toSeconds * 48_000;
    let compared = 0;
    for (let c = 0; c < 6; c++) {
      for (let b = 0; b < level.bucketCount; b++) {
        if (c === 2 && gapBuckets(b)) {
          // in the gap the recorder's channel reads as silence (never invented)
          if (b * 480 >= GAP.fromSeconds * 48_000 && (b + 1) * 480 <= GAP.toSeconds * 48_000) expect([level.min[c]![b], level.max[c]![b]]).toEqual([0, 0]);
          continue;
        }
        // the same 24-bit samples: one code (2^-23, Microsoft WAVE PCM, common practice) at most where a sound's sub-sample
        // placement is computed from the file's start rather than the scene's
        expect(Math.abs(level.min[c]![b]! - fromFile.levels[0]!.min[c]![b]!)).toBeLessThanOrEqual(2 ** -23 + 1e-9);
        expect(Math.abs(level.max[c]![b]! - fromFile.levels[0]!.max[c]![b]!)).toBeLessThanOrEqual(2 ** -23 + 1e-9);
        compared++;
      }
    }
    expect(compared).toBeGreaterThan(6 * 1100);
    // the preview samples the same recording: its first column's block is the file's first 2048 frames
    const preview = await envelopePreviewFromFrames(session.recording(), { columns: 16 });
    expect(preview.frameCount).toBe(info.frameCount);
    expect(preview.levels[0]!.bucketCount).toBe(16);
    // a spectrogram over 2 s around a sound (no gap), read whole and per column
    const request = { startSeconds: 5.5, endSeconds: 6.9, widthPixels: 64, heightPixels: 32 };
    for (const contiguousLimitFrames of [2 ** 19, 1]) {
      const deploymentSpectrogram = await spectrogramFromFrames(session.recording(), request, { contiguousLimitFrames });
      const fileSpectrogram = await spectrogramFromSource(file, info, request, { contiguousLimitFrames });
      expect(deploymentSpectrogram.columnCount).toBe(fileSpectrogram.columnCount);
      let largest = 0;
      deploymentSpectrogram.decibels.forEach((db, i) => { largest = Math.max(largest, Math.abs(db - fileSpectrogram.decibels[i]!)); });
      expect(largest).toBeLessThan(0.01); // dB; the same samples to one 24-bit code
    }
    await file.close();
    await session.close();
  });
});

describe('openDeploymentSession() on a deployment with clock offsets and drifts', () => {
  // The clock truth of test/helpers/deploymentScenes (offsets up to 2 s, drifts up to ±50 ppm); 50 s per recorder, a file
  // split each, a gap in recorder 3, calibration clicks at the start and at the end 6 s apart (each alone in its 3 s search
  // span plus the largest clock offset), test sounds in between.
  const scene = deploymentScene({ recorderSeconds: 50, splitSeconds: 16, gap: { fromSeconds: 20.5, toSeconds: 22 }, calibrationSeconds: [4, 10, 16, 34, 40, 46], soundSeconds: [19.5, 24, 27, 30] });
  let written: WrittenDeployment;
  let source: DeploymentSource;
  let arrayText: string;
  let calibrationText: string;

  beforeAll(async () => {
    // the table in a subfolder of the picked folder, its recordings beside it: paths relative to the table's own folder
    mkdirSync(join(folder, 'clocked', 'site'), { recursive: true });
    written = await writeDeploymentScene(scene.spec, join(folder, 'clocked', 'site'), { origin: ORIGIN, calibrationSoundIds: scene.calibrationIds });
    source = picked(join(folder, 'clocked'), 'site/deployment.csv');
    arrayText = readFileSync(written.arrayPath, 'utf8');
    calibrationText = readFileSync(written.calibrationPath!, 'utf8');
    await useWasmFft(); // as the app's worker and `whence locate` do
  }, 180_000);

  const syncParams = () => ({ calibration: { name: 'site/calibration.csv', text: calibrationText }, geometry: parseArrayCsv(arrayText, 'array.csv'), speedMetersPerSecond: 343 });

  it('syncClocks() recovers every recorder\'s offset within 20 µs and drift within 0.5 ppm (issue 9), and prints what whence sync prints', async () => {
    const session = await openDeploymentSession(source);
    const report = await session.syncClocks(syncParams());
    expect(report.tableName).toBe('calibration.csv');
    expect(report.recorders.map((r) => r.name)).toEqual(['R1', 'R2', 'R3', 'R4', 'R5', 'R6']);
    expect(report.recorders[0]!.reference).toBe(true);
    clockFitErrors(report.recorders).forEach(({ offsetErrorSeconds, driftErrorPpm }) => {
      expect(offsetErrorSeconds).toBeLessThan(20e-6); // issue 9's bound
      expect(driftErrorPpm).toBeLessThan(0.5); // issue 9's bound
    });
    report.recorders.forEach((recorder) => {
      expect(recorder.soundCount).toBe(6); // every recorder heard the six calibration clicks
      expect(recorder.warning).toBeUndefined();
    });
    expect(report.sounds.map((s) => s.label)).toEqual(scene.calibrationIds);
    expect(report.sounds.every((s) => s.residuals.length === 6 && s.residuals.every((r) => Math.abs(r.residualSeconds) < 50e-6))).toBe(true);
    // the fitted clocks are in use: the recording now reads through them
    expect(session.recording().clocks.map((clock) => clock.offsetSeconds)).toEqual(report.recorders.map((r) => r.offsetSeconds));
    // lines: exactly the fit as `whence sync` prints it for the same files; headLines: the clock notes of `whence locate --deployment`
    const cli = await runCliInProcess(['sync', '--deployment', written.deploymentPath, '--array', written.arrayPath, '--calibration', written.calibrationPath!, '--sound-speed', '343']);
    expect(cli.exitCode, cli.stderr).toBe(0);
    const printed = cli.stdout.trimEnd().split('\n');
    expect(printed.slice(printed.findIndex((line) => line.startsWith('time base:')))).toEqual(report.lines);
    const cliJson = JSON.parse((await runCliInProcess(['sync', '--deployment', written.deploymentPath, '--array', written.arrayPath, '--calibration', written.calibrationPath!, '--sound-speed', '343', '--json'])).stdout) as Record<string, unknown>;
    for (const key of Object.keys(report.headJson)) expect(report.headJson[key]).toEqual(cliJson[key]);
    expect(report.headLines[0]).toMatch(/^clock time base: /);
    expect(report.headLines.slice(1)).toHaveLength(6);
    // clearClocks: back to the files' own stamps
    await session.clearClocks();
    expect(session.recording().clocks.every((clock) => clock.offsetSeconds === 0 && clock.drift === 0)).toBe(true);
    await session.close();
  }, 180_000);

  it('run on the fitted deployment gives the fixes whence locate --deployment gives for the same files (same events within 1 mm), and correlations the same pair delays', async () => {
    const session = await openDeploymentSession(source);
    const report = await session.syncClocks(syncParams());
    const values = { 'sound-speed': '343', height: '1' };
    const geometry = parseArrayCsv(arrayText, 'array.csv');
    const context: LocateContext = { geometry, channelIndexOfMicrophone: deploymentChannelIndices(session.layout, geometry), settings: settingsFromOptions(values, chooseSpeed(values)) };
    const result = await runPipeline(session.recording(), context);
    const cli = await runCliInProcess(['locate', '--deployment', written.deploymentPath, '--array', written.arrayPath, '--calibration', written.calibrationPath!, '--sound-speed', '343', '--height', '1', '--json']);
    expect(cli.exitCode, cli.stderr).toBe(0);
    const log = JSON.parse(cli.stdout) as { log: { notes: string[] }; fixes: Array<{ event: string; time_s?: number; x_m?: number; y_m?: number; status: string }> };
    expect(log.log.notes.filter((note) => note.startsWith('clock '))).toEqual(report.headLines);
    expect(result.located.length).toBe(log.fixes.length);
    expect(result.located.length).toBeGreaterThanOrEqual(4); // the test sounds (calibration clicks are found too)
    result.located.forEach((located, i) => {
      const fix = log.fixes[i]!;
      expect(fix.status).toBe(located.solve.status);
      expect(Math.abs(fix.time_s! - located.emissionTimeSeconds!)).toBeLessThan(1e-3);
      if (located.solve.fix === undefined) return;
      expect(Math.hypot(fix.x_m! - located.solve.fix.eastMeters, fix.y_m! - located.solve.fix.northMeters)).toBeLessThan(1e-3); // the brief's 1 mm
    });
    // and the fixes are where the sounds were: each source's event (emission time on R1's clock, the time base) against its
    // simulated place; median over the ten sounds within 1 cm (test/e2e/deployment.test.ts: inside the array at ~20 dB SNR)
    const errors = scene.spec.scene.sources.map((sound) => {
      const onReference = clockNominalSeconds(DEPLOYMENT_CLOCKS[0]!, sound.emissionTimeSeconds);
      const located = result.located.find((event) => Math.abs(event.emissionTimeSeconds! - onReference) < 0.05);
      return located?.solve.fix === undefined ? Number.POSITIVE_INFINITY : Math.hypot(located.solve.fix.eastMeters - sound.eastMeters, located.solve.fix.northMeters - sound.northMeters);
    });
    expect(median(errors)).toBeLessThan(0.01);
    // the correlation plots of each calibration click's window: every pair's delay on true time, as the fix's pairs are
    const gaps: number[] = [];
    for (const id of scene.calibrationIds) {
      const sound = scene.spec.scene.sources.find((s) => s.id === id)!;
      const onReference = clockNominalSeconds(DEPLOYMENT_CLOCKS[0]!, sound.emissionTimeSeconds);
      const located = result.located.find((event) => Math.abs(event.emissionTimeSeconds! - onReference) < 0.05)!;
      const plots = await spanCorrelations(session.recording(), { context, startSeconds: located.windowStartSeconds, endSeconds: located.windowEndSeconds, bandHz: located.bandHz, atSeconds: located.firstArrivalSeconds, channelSeconds: located.event.onsetSeconds });
      for (const pair of plots.pairs) {
        // expected: the fix's own delay of the pair (core/pipeline locateEvent, aligned by alignPairs) over the same window
        const fixed = located.pairs.find((p) => p.indexA === pair.indexA && p.indexB === pair.indexB);
        if (fixed !== undefined) gaps.push(Math.abs(pair.delaySeconds - fixed.delaySeconds));
      }
    }
    expect(gaps.length).toBeGreaterThanOrEqual(6 * 14); // most of the 15 pairs of each of the six clicks
    // the plots' window is untapered where the fix's is tapered: a fraction of a microsecond apart (a sample is 20.8 µs)
    expect(maxOf(gaps)).toBeLessThan(1e-6);
    // a span located by hand (the worker's locateSpan) around the second calibration click: its fix is the run's
    const click = result.located.find((event) => Math.abs(event.emissionTimeSeconds! - clockNominalSeconds(DEPLOYMENT_CLOCKS[0]!, 10)) < 0.05)!;
    const byHand = await locateEvent(session.recording(), manualEvent(click.windowStartSeconds, click.windowEndSeconds, session.info.channelCount, 99), context);
    expect(Math.hypot(byHand.solve.fix!.eastMeters - click.solve.fix!.eastMeters, byHand.solve.fix!.northMeters - click.solve.fix!.northMeters)).toBeLessThan(0.01); // the run's fix (pooled timing aside), to 1 cm
    await session.close();
  }, 300_000);
});

describe('openDeploymentSession() syncClocks() from shared sounds (sounds every recorder heard, places unknown)', () => {
  // The clock truth of test/helpers/deploymentScenes; nine loud clicks 6 s apart (each alone in its 3 s search span plus
  // the largest clock offset) at the six calibration places of deploymentScenes, listed by rough time only; no gap.
  const CLICK_SECONDS = [4, 10, 16, 22, 28, 34, 40, 46, 52];
  const scene = deploymentScene({ recorderSeconds: 58, splitSeconds: 20, calibrationSeconds: CLICK_SECONDS, soundSeconds: [] });
  let written: WrittenDeployment;
  let source: DeploymentSource;
  let arrayText: string;
  let sharedText: string;
  const sharedPath = () => join(folder, 'shared', 'shared.csv');

  beforeAll(async () => {
    mkdirSync(join(folder, 'shared'), { recursive: true });
    written = await writeDeploymentScene(scene.spec, join(folder, 'shared'), { origin: ORIGIN, sharedSoundIds: scene.calibrationIds });
    // the table as the simulator writes it, under the name the command line is given below
    sharedText = readFileSync(written.sharedSoundsPath!, 'utf8');
    writeFileSync(sharedPath(), sharedText);
    source = picked(join(folder, 'shared'));
    arrayText = readFileSync(written.arrayPath, 'utf8');
  }, 180_000);

  const sharedParams = (offsetSigmaSeconds?: number): SyncClocksParams => ({
    sharedSounds: { name: 'shared.csv', text: sharedText }, geometry: parseArrayCsv(arrayText, 'array.csv'), speedMetersPerSecond: 343,
    ...(offsetSigmaSeconds !== undefined ? { offsetSigmaSeconds } : {}),
  });

  it('recovers every clock within 20 µs and 0.5 ppm and within 3 sigmas, each sound\'s place within 3 sigmas of the simulated truth, and gives what whence sync --shared-sounds gives', async () => {
    const session = await openDeploymentSession(source);
    const report = await session.syncClocks(sharedParams());
    expect(report.kind).toBe('shared-sounds');
    expect(report.tableName).toBe('shared.csv');
    expect(report.recorders[0]!.reference).toBe(true);
    report.recorders.forEach((recorder, r) => {
      // expected: the simulated clock seen from the reference recorder's (R1's) clock, what a fit with R1 fixed recovers
      const truth = clockRelativeTo(DEPLOYMENT_CLOCKS[r]!, DEPLOYMENT_CLOCKS[0]!);
      expect(recorder.offsetPriorSigmaSeconds).toBe(1); // the command line's default for bext TimeReference stamps (core/deployment DEFAULT_OFFSET_SIGMA_SECONDS)
      expect(recorder.soundCount).toBe(CLICK_SECONDS.length);
      expect(recorder.warning).toBeUndefined();
      if (recorder.reference) return;
      expect(Math.abs(recorder.offsetSeconds - truth.offsetSeconds)).toBeLessThan(20e-6); // issue 9's bound (met here: at most 11 µs)
      expect(Math.abs(recorder.driftPpm - truth.drift * 1e6)).toBeLessThan(0.5); // issue 9's bound (met here: at most 0.29 ppm)
      expect(Math.abs(recorder.offsetSeconds - truth.offsetSeconds)).toBeLessThan(3 * recorder.offsetSigmaSeconds); // within 3 of the fit's own sigmas
      expect(Math.abs(recorder.driftPpm - truth.drift * 1e6)).toBeLessThan(3 * recorder.driftSigmaPpm);
    });
    // every sound's fitted place against where the scene put it (its emission on R1's clock is the fitted time)
    expect(report.sounds.map((s) => s.label)).toEqual(scene.calibrationIds);
    for (const sound of report.sounds) {
      const truth = scene.spec.scene.sources.find((s) => s.id === sound.label)!;
      const place = sound.place!;
      expect(Math.abs(place.eastMeters - truth.eastMeters)).toBeLessThan(3 * place.sigmaEastMeters);
      expect(Math.abs(place.northMeters - truth.northMeters)).toBeLessThan(3 * place.sigmaNorthMeters);
      expect(Math.abs(place.upMeters - truth.upMeters)).toBeLessThan(3 * place.sigmaUpMeters);
      // a sound's arrivals are placed from its loudest microphone's onset, found in 2 ms frames (core/deployment
      // calibrationArrivals): a shift common to all its arrivals that its emission time takes up (moving no clock), so the
      // emission time is only good to that frame, whatever its sigma says
      expect(Math.abs(sound.timeSeconds - clockNominalSeconds(DEPLOYMENT_CLOCKS[0]!, truth.emissionTimeSeconds))).toBeLessThan(2e-3);
      expect(sound.residuals).toHaveLength(6);
    }
    // the fitted clocks are in use
    expect(session.recording().clocks.map((clock) => clock.offsetSeconds)).toEqual(report.recorders.map((r) => r.offsetSeconds));
    // lines: exactly what `whence sync --shared-sounds` prints for the same files; headJson its --json; headLines the clock
    // notes `whence locate --deployment --shared-sounds` writes in the survey log's head
    const common = ['--deployment', written.deploymentPath, '--array', written.arrayPath, '--shared-sounds', sharedPath(), '--sound-speed', '343'];
    const cli = await runCliInProcess(['sync', ...common]);
    expect(cli.exitCode, cli.stderr).toBe(0);
    const printed = cli.stdout.trimEnd().split('\n');
    expect(printed.slice(printed.findIndex((line) => line.startsWith('time base:')))).toEqual(report.lines);
    expect(report.lines).toContain('shared sounds (places fitted):');
    const cliJson = JSON.parse((await runCliInProcess(['sync', ...common, '--json'])).stdout) as Record<string, unknown>;
    for (const key of Object.keys(report.headJson)) expect(report.headJson[key]).toEqual(cliJson[key]);
    const log = await runCliInProcess(['locate', ...common, '--from', '3', '--to', '6', '--json']);
    expect(log.exitCode, log.stderr).toBe(0);
    expect((JSON.parse(log.stdout) as { log: { notes: string[] } }).log.notes.filter((note) => note.startsWith('clock '))).toEqual(report.headLines);
    expect(report.headLines[0]).toMatch(/^clock time base: .*shared sounds/);
    await session.close();
  }, 300_000);

  it('takes the offset prior as --offset-sigma does (seconds), and refuses one out of range or two tables at once', async () => {
    const session = await openDeploymentSession(source);
    const report = await session.syncClocks(sharedParams(0.5));
    expect(report.recorders.every((r) => r.offsetPriorSigmaSeconds === 0.5)).toBe(true);
    const cli = await runCliInProcess(['sync', '--deployment', written.deploymentPath, '--array', written.arrayPath, '--shared-sounds', sharedPath(), '--sound-speed', '343', '--offset-sigma', '0.5']);
    const printed = cli.stdout.trimEnd().split('\n');
    expect(printed.slice(printed.findIndex((line) => line.startsWith('time base:')))).toEqual(report.lines);
    await expect(session.syncClocks(sharedParams(0))).rejects.toMatchObject({ code: 'invalid-offset-sigma', message: expect.stringMatching(/offset prior must be 0\.1 ms to 3600 s/) });
    const both = { ...sharedParams(), calibration: { name: 'c.csv', text: 'time,x_m,y_m\n4,0,0\n' } } as unknown as SyncClocksParams;
    await expect(session.syncClocks(both)).rejects.toMatchObject({ code: 'clock-fit-two-tables', message: expect.stringMatching(/either a calibration table .* or a shared-sound table/) });
    // the clocks of the first fit are still in use after the refusals
    expect(session.recording().clocks.map((clock) => clock.offsetSeconds)).toEqual(report.recorders.map((r) => r.offsetSeconds));
    await session.close();
  }, 120_000);
});
