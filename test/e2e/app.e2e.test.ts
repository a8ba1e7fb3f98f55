// The app in a real browser (web mode, Debian's Chromium via playwright-core): the demo opens and shows its fixes;
// editing and dragging a microphone move the fix; a selected span is located into the log; the exported log matches
// the command line; a corrupt recording and a bad cell give messages and lose nothing. Screenshots at 1440 x 900.
// Expected values: the demo is an invented scene (core/simulate); counts are the sounds the synthesis placed, and the
// exported rows are compared with the command line's own output on the same files (self-consistency), no outside reference.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readCsv } from '../../core/csv';
import { speedOfSoundAirCramer } from '../../core/medium';
import { buildCliOnce } from '../helpers/cli';
import { chromiumAvailable, openPage, SCREENSHOT_FOLDER, startWebApp, type WebApp } from '../helpers/webApp';

const mustRun = process.env.CI === 'true';
const run = chromiumAvailable() || mustRun;

async function demoLoaded(page: Page): Promise<number> {
  await page.waitForFunction(() => document.querySelectorAll('[data-testid^="event-row-"]').length >= 15, undefined, { timeout: 90_000 });
  return page.locator('[data-testid^="event-row-"]').count();
}

/** A checksum of every canvas the map draws into (Konva layers), to tell that a layer changed the picture. */
async function mapCanvasChecksum(page: Page): Promise<number> {
  return page.locator('[data-testid="map-stage"]').evaluate((stage) => {
    let sum = 0;
    for (const canvas of Array.from(stage.querySelectorAll('canvas'))) {
      const pixels = canvas.getContext('2d')?.getImageData(0, 0, canvas.width, canvas.height).data ?? new Uint8ClampedArray();
      for (let i = 0; i < pixels.length; i += 1) sum = (sum * 31 + pixels[i]!) % 2_147_483_647;
    }
    return sum;
  });
}

async function firstFixX(page: Page): Promise<string> {
  // Columns: #, time, verdict · status, x (m), ...
  return (await page.locator('[data-testid="event-row-1"] td').nth(3).textContent()) ?? '';
}

describe.runIf(run)('the app in a browser', () => {
  let app: WebApp;
  let page: Page;

  beforeAll(async () => {
    app = await startWebApp(5391);
    page = await openPage(app);
  }, 240_000);

  afterAll(async () => {
    await app?.close();
  });

  it('opens the demo and shows where its sounds came from, without typing anything', async () => {
    const rows = await demoLoaded(page);
    expect(rows).toBeGreaterThanOrEqual(15);
    expect(await page.locator('[data-testid^="map-fix-"]').count()).toBeGreaterThanOrEqual(15);
    await expect.poll(() => page.locator('[data-testid="event-row-1"] .status').textContent()).toBe('ok');
    await page.screenshot({ path: `${SCREENSHOT_FOLDER}/01-demo-opened.png` });
  }, 120_000);

  it('gives every fix of the demo a verdict in plain words, in the sounds table and on the map, with a legend for the fix colours', async () => {
    await demoLoaded(page);
    const cells = page.locator('[data-testid^="event-verdict-"]');
    const count = await cells.count();
    expect(count).toBe(await page.locator('[data-testid^="event-row-"]').count());
    for (let i = 0; i < count; i++) {
      const cell = cells.nth(i);
      expect(['firm', 'doubtful', 'unusable']).toContain(await cell.getAttribute('data-verdict'));
      // The grade and its one-sentence reason, e.g. "+ firm All microphones agree; small ellipse inside the array."
      expect(await cell.locator('.verdict-grade').textContent()).toMatch(/^[+△×] (firm|doubtful|unusable)$/);
      expect(await cell.locator('.verdict-reason').textContent()).toMatch(/^[A-Z].{8,80}\.$/);
    }
    // The demo's callers inside the array come out firm; those placed far outside it (assets/demo/scenario.ts) doubtful.
    expect(await page.locator('[data-testid^="event-verdict-"][data-verdict="firm"]').count()).toBeGreaterThanOrEqual(count / 3);
    expect(await page.locator('[data-testid^="event-verdict-"][data-verdict="doubtful"] .verdict-reason').allTextContents()).toContain('Outside the array: long ellipse.');
    // Map fixes carry their verdict's colour and marker, and the legend explains them.
    const fixes = page.locator('[data-testid^="map-fix-"]');
    for (let i = 0; i < (await fixes.count()); i++) {
      expect(['firm', 'doubtful', 'unusable']).toContain(await fixes.nth(i).getAttribute('data-verdict'));
      expect(['plus', 'triangle', 'cross']).toContain(await fixes.nth(i).getAttribute('data-marker'));
    }
    const legend = page.locator('[data-testid="map-legend-fixes"]');
    await legend.waitFor({ state: 'visible', timeout: 5_000 });
    expect(await legend.textContent()).toMatch(/firm.*act on it.*doubtful.*check it.*unusable.*do not act on it/);
    await page.screenshot({ path: `${SCREENSHOT_FOLDER}/01b-demo-verdicts.png` });
  }, 120_000);

  it('moves the fix when a microphone is typed in by hand, and again when one is dragged on the map', async () => {
    await page.locator('[data-testid="event-row-1"]').click();
    const before = await firstFixX(page);
    const east = page.locator('[data-testid="microphone-cell-2-east"]');
    await east.fill('37.5');
    await east.press('Tab');
    await expect.poll(() => firstFixX(page), { timeout: 10_000 }).not.toBe(before);
    const typed = await firstFixX(page);
    const stage = await page.locator('[data-testid="map-stage"]').boundingBox();
    const probe = page.locator('[data-testid="map-microphone-3"]');
    const x = Number(await probe.getAttribute('data-x-pixels'));
    const y = Number(await probe.getAttribute('data-y-pixels'));
    await page.mouse.move(stage!.x + x, stage!.y + y);
    await page.mouse.down();
    await page.mouse.move(stage!.x + x + 30, stage!.y + y + 20, { steps: 6 });
    await page.mouse.up();
    await expect.poll(() => firstFixX(page), { timeout: 10_000 }).not.toBe(typed);
    await page.screenshot({ path: `${SCREENSHOT_FOLDER}/02-microphone-moved.png` });
  }, 60_000);

  it('keeps a bad cell’s text with its message and leaves the array in use unchanged', async () => {
    const before = await firstFixX(page);
    const north = page.locator('[data-testid="microphone-cell-1-north"]');
    await north.fill('38,5 m');
    await north.press('Tab');
    await expect(page.locator('[data-testid="microphone-message-1"]').textContent()).resolves.toMatch(/\S/);
    expect(await north.inputValue()).toBe('38,5 m');
    expect(await firstFixX(page)).toBe(before);
    await page.screenshot({ path: `${SCREENSHOT_FOLDER}/03-bad-cell.png` });
    await north.fill('38.5');
    await north.press('Tab');
  }, 30_000);

  it('locates a selected span and adds its fix to the log', async () => {
    await page.locator('[data-testid="event-row-2"]').click();
    const logRowsBefore = await page.locator('[data-testid^="fixlog-row-"]').count();
    await page.locator('[data-testid="locate-selection"]').click();
    await expect.poll(() => page.locator('[data-testid^="fixlog-row-"]').count(), { timeout: 30_000 }).toBe(logRowsBefore + 1);
    // The logged fix keeps its verdict: grade and reason in the fix log.
    const verdict = page.locator('[data-testid^="fixlog-verdict-"]').last();
    expect(['firm', 'doubtful', 'unusable']).toContain(await verdict.getAttribute('data-verdict'));
    expect(await verdict.locator('.fl-verdict-reason').textContent()).toMatch(/^[A-Z].{8,80}\.$/);
    await page.screenshot({ path: `${SCREENSHOT_FOLDER}/04-selection-located.png` });
  }, 60_000);

  it('exports the log as CSV whose rows match the command line’s', async () => {
    // Back to the demo's own array, then log every fixed sound and export.
    await page.locator('[data-testid="open-demo"]').click();
    // The array typed and the fix logged above are unsaved work: the Demo button asks before it closes them.
    await page.locator('[data-testid="confirm-dialog"]').waitFor({ state: 'visible', timeout: 10_000 });
    await page.locator('[data-testid="confirm-discard"]').click();
    await page.locator('[data-testid="busy"]').waitFor({ state: 'visible', timeout: 10_000 }).catch(() => undefined);
    await page.locator('[data-testid="busy"]').waitFor({ state: 'hidden', timeout: 90_000 });
    await demoLoaded(page);
    await page.locator('[data-testid="events-log-all"]').click();
    await expect.poll(() => page.locator('[data-testid^="fixlog-row-"]').count()).toBeGreaterThanOrEqual(15);
    const downloadPromise = page.waitForEvent('download');
    await page.locator('[data-testid="fixlog-export-csv"]').click();
    const download = await downloadPromise;
    const folder = mkdtempSync(join(tmpdir(), 'whence-e2e-'));
    const appCsvPath = join(folder, 'app.csv');
    await download.saveAs(appCsvPath);
    const appTable = readCsv(readFileSync(appCsvPath, 'utf8'), 'app.csv');
    writeFileSync(join(SCREENSHOT_FOLDER, 'exported-log.csv'), readFileSync(appCsvPath));

    buildCliOnce();
    const cli = spawnSync(process.execPath, ['dist/cli/whence.mjs', 'locate', 'assets/demo/out/demo-recording.wav', '--array', 'assets/demo/out/demo-array.csv', '--origin', '51.92503,14.08512,96.4', '--temperature', '14', '--humidity', '85', '--pressure', '100.9', '--temperature-sigma', '1', '--height', '0.3'], { encoding: 'utf8' });
    expect(cli.status).toBe(0);
    writeFileSync(join(SCREENSHOT_FOLDER, 'cli-log.csv'), cli.stdout);
    const cliTable = readCsv(cli.stdout, 'cli.csv');
    expect(appTable.header).toEqual(cliTable.header);
    const column = (name: string) => cliTable.header.indexOf(name);
    const byTime = (table: typeof cliTable) => new Map(table.rows.map((row) => [row.cells[column('arrival_s')], row.cells]));
    const cliRows = byTime(cliTable);
    expect(appTable.rows.length).toBeGreaterThanOrEqual(15);
    for (const row of appTable.rows) {
      const match = cliRows.get(row.cells[column('arrival_s')]);
      expect(match, `the command line has the sound first heard at ${row.cells[column('arrival_s')]} s`).toBeDefined();
      expect(row.cells[column('status')]).toBe(match![column('status')]);
      // Same pipeline in a Web Worker and in Node: equal to well under a millimetre (different JavaScript engines).
      for (const name of ['x_m', 'y_m']) expect(Math.abs(Number(row.cells[column(name)]) - Number(match![column(name)])), name).toBeLessThan(1e-3);
      for (const name of ['semi_major_m', 'semi_minor_m']) expect(Number(row.cells[column(name)]) / Number(match![column(name)]), name).toBeCloseTo(1, 2);
      for (const name of ['lat', 'lon']) expect(Math.abs(Number(row.cells[column(name)]) - Number(match![column(name)])), name).toBeLessThan(1e-7);
    }
    await page.screenshot({ path: `${SCREENSHOT_FOLDER}/05-log-exported.png` });
  }, 180_000);

  it('reports a corrupt recording and keeps the one that was open', async () => {
    const rowsBefore = await page.locator('[data-testid^="event-row-"]').count();
    const folder = mkdtempSync(join(tmpdir(), 'whence-e2e-'));
    writeFileSync(join(folder, 'broken.wav'), 'RIFF\u0000\u0000\u0000\u0000WAVEnot really audio');
    const chooserPromise = page.waitForEvent('filechooser');
    await page.locator('[data-testid="open-recording"]').click();
    const chooser = await chooserPromise;
    await chooser.setFiles(join(folder, 'broken.wav'));
    await expect.poll(() => page.locator('[data-testid="notice-error"]').count(), { timeout: 15_000 }).toBeGreaterThan(0);
    expect(await page.locator('[data-testid="notice-error"]').first().textContent()).toMatch(/broken\.wav could not be opened/);
    expect(await page.locator('[data-testid^="event-row-"]').count()).toBe(rowsBefore);
    expect(await page.locator('[data-testid="notice-error"]').first().textContent()).toMatch(/recording in use are unchanged/);
    await page.screenshot({ path: `${SCREENSHOT_FOLDER}/06-corrupt-recording.png` });
    // The recording that was open is still in use: a sound's correlations can still be computed from it.
    await page.locator('[data-testid="event-row-3"]').click();
    await page.locator('[data-testid="tab-correlations"]').click();
    await page.locator('[data-testid="correlations-view"]').waitFor({ state: 'visible', timeout: 15_000 });
    // Six microphones make 15 pairs, each with its correlation card, and six autocorrelations (the demo's array).
    await expect.poll(() => page.locator('[data-testid^="correlation-pair-"]').count(), { timeout: 15_000 }).toBe(15);
    expect(await page.locator('[data-testid^="autocorrelation-"]').count()).toBe(6);
    expect(await page.locator('[data-testid="correlations-view"] .cv-facts').textContent()).toMatch(/15 pairs, \d+ kept \(\d+ dropped\) → \d+ independent delays used in the fix/);
    await page.screenshot({ path: `${SCREENSHOT_FOLDER}/07-tab-correlations.png` });

    // The cautions, as the README states them (DEVELOPERS.md, "Cautions").
    await page.locator('[data-testid="tab-safety"]').click();
    const safety = page.locator('[data-testid="safety-panel"]');
    await safety.waitFor({ state: 'visible', timeout: 5_000 });
    expect(await safety.locator('h2').textContent()).toBe('Before you act on a fix');
    expect(await safety.locator('li').count()).toBe(5);
    expect(await safety.textContent()).toMatch(/firm, doubtful or unusable/);
    expect(await safety.textContent()).toMatch(/hearing protection/);
    await page.screenshot({ path: `${SCREENSHOT_FOLDER}/07-tab-safety.png` });

    // The demo's air: 14 °C, 85 % RH, 100.9 kPa (assets/demo/scenario.ts), so Cramer's speed, to the 0.01 m/s shown.
    await page.locator('[data-testid="tab-settings"]').click();
    const speed = page.locator('[data-testid="settings-speed"]');
    await speed.waitFor({ state: 'visible', timeout: 5_000 });
    const demoSpeed = speedOfSoundAirCramer({ temperatureCelsius: 14, relativeHumidityPercent: 85, pressureKilopascals: 100.9 }).speedMetersPerSecond;
    expect(await speed.locator('strong').textContent()).toBe(`${demoSpeed.toFixed(2)} m/s`);
    expect(await speed.getAttribute('data-stale')).toBe('false');
    await page.screenshot({ path: `${SCREENSHOT_FOLDER}/07-tab-settings.png` });

    // Map layers: each draws a raster on the map's canvas and a legend of its own values.
    await page.locator('[data-testid="event-row-3"]').click();
    const withoutLayer = await mapCanvasChecksum(page);
    await page.locator('[data-testid="map-layer"]').selectOption('srp');
    const legend = page.locator('[data-testid="map-legend-overlay"]');
    await expect.poll(() => legend.count(), { timeout: 15_000 }).toBe(1);
    expect(await legend.locator('.map-legend-title').textContent()).toBe('SRP-PHAT of the selected event, normalised to its peak');
    const srpRange = [Number(await legend.getAttribute('data-min-value')), Number(await legend.getAttribute('data-max-value'))];
    expect(srpRange.every(Number.isFinite) && srpRange[0]! < srpRange[1]!).toBe(true);
    await expect.poll(() => mapCanvasChecksum(page), { timeout: 10_000 }).not.toBe(withoutLayer);
    const withSrp = await mapCanvasChecksum(page);
    await page.screenshot({ path: `${SCREENSHOT_FOLDER}/08-layer-srp.png` });

    await page.locator('[data-testid="map-layer"]').selectOption('precision');
    await expect.poll(() => legend.locator('.map-legend-title').textContent(), { timeout: 15_000 }).toMatch(/^expected 1-σ error, m \(arrival σ 50 µs\) \(log scale\)$/);
    const [smallest, largest] = [Number(await legend.getAttribute('data-min-value')), Number(await legend.getAttribute('data-max-value'))];
    // c·σ = 343 m/s × 50 µs ≈ 1.7 cm sets the scale (common practice): near the middle of six microphones the error is about
    // that (measured 1.4 cm); the colours span at most three decades (renderer/map/overlayRaster.ts).
    expect(smallest).toBeGreaterThan(0.005);
    expect(smallest).toBeLessThan(0.03);
    expect(largest / smallest).toBeGreaterThan(2);
    expect(largest / smallest).toBeLessThanOrEqual(1000 * (1 + 1e-9));
    await expect.poll(() => mapCanvasChecksum(page), { timeout: 10_000 }).not.toBe(withSrp);
    await page.screenshot({ path: `${SCREENSHOT_FOLDER}/09-layer-precision.png` });
  }, 90_000);
});
