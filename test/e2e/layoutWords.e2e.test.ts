// The app's layout, notices, words and exports in a real browser (issue 10, defects 4-7): cells apply on commit, notices
// collapse in a strip of fixed height, one word per idea, exports match the command line's head and columns and carry the
// project's name and date, a located duplicate asks, the map comes first and frames the array. Screenshots at 1440 x 900
// and 1280 x 720. Expected values: the demo is an invented scene (assets/demo/scenario.ts); sizes are this project's choices.
import { mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readCsv } from '../../core/csv';
import { runCliInProcess } from '../helpers/cli';
import { chromiumAvailable, openPage, SCREENSHOT_FOLDER, startWebApp, type WebApp } from '../helpers/webApp';

const mustRun = process.env.CI === 'true';
const run = chromiumAvailable() || mustRun;
const SHOTS = join(SCREENSHOT_FOLDER, 'layout-words');

interface Box { x: number; y: number; width: number; height: number }

async function box(page: Page, testId: string): Promise<Box> {
  const found = await page.locator(`[data-testid="${testId}"]`).first().boundingBox();
  if (found === null) throw new Error(`${testId} is not on screen`);
  return found;
}

function overlaps(a: Box, b: Box): boolean {
  return a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
}

async function demoLoaded(page: Page): Promise<void> {
  await page.waitForFunction(() => document.querySelectorAll('[data-testid^="event-row-"]').length >= 15, undefined, { timeout: 120_000 });
  await page.locator('[data-testid="busy"]').waitFor({ state: 'hidden', timeout: 120_000 });
}

async function fixX(page: Page, row: number): Promise<string> {
  // Columns of the Events table: #, time, verdict · status, x (m), y (m), semi-axes, log.
  return (await page.locator(`[data-testid="event-row-${row}"] td`).nth(3).textContent()) ?? '';
}

async function shot(page: Page, name: string): Promise<void> {
  const size = page.viewportSize();
  await page.screenshot({ path: join(SHOTS, `${size?.width}x${size?.height}-${name}.png`) });
}

/** A screenshot of each tab in turn, then back to the recording. */
async function shotTabs(page: Page, tabs: readonly string[]): Promise<void> {
  for (const tab of tabs) {
    await page.locator(`[data-testid="tab-${tab}"]`).click();
    await shot(page, `08-tab-${tab}`);
  }
  await page.locator('[data-testid="tab-recording"]').click();
}

/** The CSV's `#` head lines and its rows. */
function csvParts(text: string): { head: string[]; table: ReturnType<typeof readCsv> } {
  return { head: text.split('\n').filter((line) => line.startsWith('#')), table: readCsv(text, 'log.csv') };
}

describe.runIf(run)('layout, notices, words and exports in a browser', () => {
  let app: WebApp;
  let page: Page;

  beforeAll(async () => {
    mkdirSync(SHOTS, { recursive: true });
    app = await startWebApp(5393);
    page = await openPage(app);
    await demoLoaded(page);
  }, 300_000);

  afterAll(async () => {
    await app?.close();
  });

  it('defect 4: an array cell applies on Enter, not on each keystroke, and raises no notice while typed', async () => {
    await page.locator('[data-testid="event-row-1"]').click();
    const before = await fixX(page, 1);
    const microphone = page.locator('[data-testid="map-microphone-1"]');
    const eastBefore = await microphone.getAttribute('data-east-meters');
    const cell = page.locator('[data-testid="microphone-cell-2-east"]');
    await cell.click();
    await cell.press('Control+A');
    for (const key of ['3', '7', '.', '9', 'x']) {
      await page.keyboard.type(key, { delay: 40 });
      await page.waitForTimeout(150);
      // Nothing moves and nothing is announced while the cell is typed in (an "x" makes it wrong: its message is beside it).
      expect(await microphone.getAttribute('data-east-meters')).toBe(eastBefore);
      expect(await fixX(page, 1)).toBe(before);
      expect(await page.locator('[data-testid="notice-error"], [data-testid="notice-warning"]').count()).toBe(0);
    }
    await expect.poll(() => page.locator('[data-testid="microphone-message-2"]').textContent()).toMatch(/\S/);
    await shot(page, '04a-cell-typed-wrong');
    await page.keyboard.press('Backspace');
    await page.keyboard.press('Enter');
    await expect.poll(() => microphone.getAttribute('data-east-meters'), { timeout: 10_000 }).toBe('37.9');
    await expect.poll(() => fixX(page, 1), { timeout: 10_000 }).not.toBe(before);
    // Back to the demo's own value, committed by leaving the cell.
    await cell.fill('36');
    await cell.press('Tab');
    await expect.poll(() => microphone.getAttribute('data-east-meters'), { timeout: 10_000 }).toBe('36');
    await expect.poll(() => fixX(page, 1), { timeout: 10_000 }).toBe(before);
  }, 90_000);

  it('defect 4: the same message twice is one notice with a count, in a strip that never pushes the panels down', async () => {
    const bodyTop = (await box(page, 'workspace-body')).y;
    const stripHeight = (await box(page, 'notices')).height;
    const folder = mkdtempSync(join(tmpdir(), 'whence-e2e-'));
    writeFileSync(join(folder, 'broken.wav'), 'RIFF\u0000\u0000\u0000\u0000WAVEnot really audio');
    for (let i = 0; i < 3; i++) {
      const chooser = page.waitForEvent('filechooser');
      await page.locator('[data-testid="open-recording"]').click();
      await (await chooser).setFiles(join(folder, 'broken.wav'));
      await expect.poll(() => page.locator('[data-testid="notice-error"]').first().getAttribute('data-count'), { timeout: 15_000 }).toBe(String(i + 1));
    }
    expect(await page.locator('[data-testid="notice-error"]').count()).toBe(1);
    expect(await page.locator('[data-testid="notice-count"]').first().textContent()).toBe('×3');
    expect((await box(page, 'workspace-body')).y).toBe(bodyTop);
    expect((await box(page, 'notices')).height).toBe(stripHeight);
    await shot(page, '04b-notice-repeated');
    await page.locator('[data-testid="notice-error"] button[aria-label="Dismiss"]').click();
  }, 90_000);

  it('defect 5: one word per idea: events counted from 1, Settings, ok, semi-axes, independent delays', async () => {
    expect(await page.locator('[data-testid="event-row-0"] td').first().textContent()).toBe('1');
    expect(await page.locator('[data-testid="recording-event-0"] td').first().textContent()).toBe('1');
    expect(await page.locator('[data-testid="tab-settings"]').textContent()).toBe('Settings');
    expect(await page.locator('[data-testid="events-panel"] thead').textContent()).toContain('95 % semi-axes (m)');
    const statuses = await page.locator('[data-testid="events-panel"] .status').allTextContents();
    for (const status of statuses) expect(['ok', 'inconsistent', 'ambiguous', 'ill-conditioned', 'insufficient', 'invalid-input']).toContain(status);
    const logAll = page.locator('[data-testid="events-log-all"]');
    expect(await logAll.textContent()).toMatch(/^Log \d+ ok fix(es)?$/);
    const body = await page.locator('body').innerText();
    for (const stale of [/Conditions/, /Sounds found/, /\bfixed\b/, /\bsounds? found\b/]) expect(body).not.toMatch(stale);

    // The correlations and the fix log count the same thing: independent delays (pairs_used).
    await logAll.click();
    await expect.poll(() => logAll.textContent()).toBe('Every ok fix is logged');
    expect(await logAll.isDisabled()).toBe(true);
    await page.locator('[data-testid="event-row-1"]').click();
    await page.locator('[data-testid="tab-correlations"]').click();
    const facts = page.locator('[data-testid="correlations-view"] .cv-facts');
    await expect.poll(() => facts.textContent(), { timeout: 15_000 }).toMatch(/→ \d+ independent delays used in the fix/);
    const independent = /→ (\d+) independent delays/.exec((await facts.textContent()) ?? '')![1];
    const headers = await page.locator('[data-testid="fixlog-panel"] thead tr:last-child th').allTextContents();
    const column = headers.indexOf('Delays used');
    expect(column).toBeGreaterThan(0);
    const row = page.locator('[data-testid^="fixlog-row-"]').filter({ has: page.locator('td.fl-event button', { hasText: /^2$/ }) });
    expect(await row.locator('td').nth(column).textContent()).toBe(independent);
    await shot(page, '05-tab-correlations');
    await page.locator('[data-testid="tab-recording"]').click();

    // The command line says "ok" too.
    const cli = await runCliInProcess(['locate', 'assets/demo/out/demo-recording.wav', '--array', 'assets/demo/out/demo-array.csv', '--origin', '51.92503,14.08512,96.4', '--temperature', '14', '--humidity', '85', '--pressure', '100.9', '--temperature-sigma', '1', '--height', '0.3', '--workers', '0']);
    expect(cli.exitCode).toBe(0);
    expect(cli.stderr).toMatch(/\d+ events found, \d+ ok/);
    expect(cli.stderr).not.toMatch(/\bfixed\b/);
    writeFileSync(join(SHOTS, 'cli-log.csv'), cli.stdout);
  }, 180_000);

  it('defect 6: the exported CSV has the command line\'s head and columns, no repeated boilerplate, and the project\'s name and date', async () => {
    const project = ((await page.locator('[data-testid="project-name"]').textContent()) ?? '').replace(/ •$/, '');
    const downloadPromise = page.waitForEvent('download');
    await page.locator('[data-testid="fixlog-export-csv"]').click();
    const download = await downloadPromise;
    const date = new Date();
    const today = `${date.getFullYear()}-${String(date.getMonth() + 1).padStart(2, '0')}-${String(date.getDate()).padStart(2, '0')}`;
    expect(download.suggestedFilename()).toBe(`${project.trim().replace(/\s+/g, '-')}-log-${today}.csv`);
    const appPath = join(SHOTS, 'app-log.csv');
    await download.saveAs(appPath);
    const appCsv = csvParts(readFileSync(appPath, 'utf8'));
    const cliCsv = csvParts(readFileSync(join(SHOTS, 'cli-log.csv'), 'utf8'));
    expect(appCsv.table.header).toEqual(cliCsv.table.header);
    expect(appCsv.head).toEqual(cliCsv.head);
    expect(appCsv.head.filter((line) => /exported from the fix log|note: event \d/.test(line))).toEqual([]);
    // Each row's warnings are the command line's for the same event: nothing repeated that the command line does not write.
    const column = (name: string) => cliCsv.table.header.indexOf(name);
    const cliByArrival = new Map(cliCsv.table.rows.map((row) => [row.cells[column('arrival_s')], row.cells]));
    for (const row of appCsv.table.rows) {
      expect(row.cells[column('warnings')]).toBe(cliByArrival.get(row.cells[column('arrival_s')])![column('warnings')]);
      expect(row.cells[column('label')]).toBe('');
    }
    const geo = page.waitForEvent('download');
    await page.locator('[data-testid="fixlog-export-geojson"]').click();
    expect((await geo).suggestedFilename()).toBe(`${project.trim().replace(/\s+/g, '-')}-log-${today}.geojson`);
    await shot(page, '06a-log-exported');
  }, 90_000);

  it('defect 6: locating a selection of a logged event asks to replace its fix or keep both', async () => {
    const rows = page.locator('[data-testid^="fixlog-row-"]');
    const count = await rows.count();
    await page.locator('[data-testid="event-row-2"]').click();
    await page.locator('[data-testid="locate-selection"]').click();
    const dialog = page.locator('[data-testid="confirm-dialog"]');
    await dialog.waitFor({ state: 'visible', timeout: 10_000 });
    expect(await page.locator('[data-testid="confirm-text"]').textContent()).toMatch(/holds event 3 .*already in the fix log\. Replace its fix with the new one, or keep both\?/);
    await shot(page, '06b-duplicate-question');
    await page.locator('[data-testid="confirm-replace"]').click();
    await expect.poll(() => page.locator('[data-testid="notice-info"], [data-testid="notice-warning"]').last().textContent(), { timeout: 30_000 }).toMatch(/replaces the logged fix of event 3/);
    expect(await rows.count()).toBe(count);
    await page.locator('[data-testid="event-row-2"]').click();
    await page.locator('[data-testid="locate-selection"]').click();
    await dialog.waitFor({ state: 'visible', timeout: 10_000 });
    await page.locator('[data-testid="confirm-keep-both"]').click();
    await expect.poll(() => rows.count(), { timeout: 30_000 }).toBe(count + 1);
  }, 90_000);

  it('defect 7: at 1440 x 900 the map is the largest panel, the microphone table and the fix log\'s key columns need no sideways scrolling', async () => {
    const map = await box(page, 'map-area');
    for (const panel of ['panel-left', 'panel-right', 'panel-bottom']) {
      const other = await box(page, panel);
      expect(map.width * map.height, panel).toBeGreaterThan(other.width * other.height);
    }
    await page.locator('[data-testid="tab-microphones"]').click();
    const scroll = page.locator('[data-testid="microphones-panel"] .mic-scroll');
    expect(await scroll.evaluate((element) => element.scrollWidth <= element.clientWidth)).toBe(true);
    const tableBox = (await scroll.boundingBox())!;
    for (const testId of ['microphone-cell-1-label', 'microphone-cell-1-east', 'microphone-cell-1-north', 'microphone-cell-1-sigma', 'microphone-remove-1']) {
      const cell = await box(page, testId);
      expect(cell.x + cell.width, testId).toBeLessThanOrEqual(tableBox.x + tableBox.width + 0.5);
    }
    expect(await page.locator('[data-testid="events-panel"]').evaluate((element) => element.scrollWidth <= element.clientWidth)).toBe(true);
    const logScroll = (await page.locator('[data-testid="fixlog-panel"] .fl-scroll').boundingBox())!;
    const headers = page.locator('[data-testid="fixlog-panel"] thead tr:last-child th');
    for (const name of ['Keep', '#', 'Verdict', 'E (m)', 'N (m)', 'a × b (m)']) {
      const header = (await headers.filter({ hasText: new RegExp(`^${name.replace(/[()×]/g, '.')}$`) }).first().boundingBox())!;
      expect(header.x + header.width, name).toBeLessThanOrEqual(logScroll.x + logScroll.width + 0.5);
    }
    await shot(page, '07a-layout');
  }, 60_000);

  it('defect 7: Fit frames the array and near fixes; a far fix gets an edge marker and is brought into view when chosen', async () => {
    await page.locator('[data-testid="map-fit"]').click();
    const view = page.locator('[data-testid="map-view"]');
    const stage = await box(page, 'map-stage');
    const metersAcross = Number(await view.getAttribute('data-meters-per-pixel')) * stage.width;
    // The array spans about 73 m east and 79 m north; the dog barks some 270 m away (assets/demo/scenario.ts).
    expect(metersAcross).toBeLessThan(250);
    for (let i = 0; i < 6; i++) {
      const mic = page.locator(`[data-testid="map-microphone-${i}"]`);
      const x = Number(await mic.getAttribute('data-x-pixels'));
      const y = Number(await mic.getAttribute('data-y-pixels'));
      expect(x > 0 && x < stage.width && y > 0 && y < stage.height, `microphone ${i + 1} in view`).toBe(true);
    }
    const edge = page.locator('[data-testid^="map-edge-marker-"]');
    expect(await edge.count()).toBeGreaterThanOrEqual(1);
    const far = (await edge.first().getAttribute('data-ids'))!.split(' ')[0]!;
    expect(Number(await edge.first().getAttribute('data-distance-meters'))).toBeGreaterThan(150);
    await shot(page, '07b-fit-edge-marker');
    await page.locator(`[data-testid="event-row-${far.replace('event-', '')}"]`).click();
    const fix = page.locator(`[data-testid="map-fix-${far}"]`);
    await expect.poll(async () => {
      const x = Number(await fix.getAttribute('data-x-pixels'));
      const y = Number(await fix.getAttribute('data-y-pixels'));
      return x > 0 && x < stage.width && y > 0 && y < stage.height;
    }, { timeout: 5_000 }).toBe(true);
    // Nothing floats over the map's content: the controls sit in a bar above it, the legend in a strip below it.
    const legend = await box(page, 'map-legend-fixes');
    expect(overlaps(legend, stage)).toBe(false);
    expect(overlaps(await box(page, 'map-north-arrow'), stage)).toBe(false);
    expect(overlaps(await box(page, 'map-fit'), stage)).toBe(false);
    expect(await page.locator('[data-testid="map-legend-fixes"]').textContent()).toMatch(/firm.*act on it.*doubtful.*check it.*unusable.*do not act on it/);
    await shot(page, '07c-far-fix-chosen');
    await page.locator('[data-testid="map-fit"]').click();
  }, 60_000);

  it('defect 7: the SRP layer is normalised to its peak, which is marked near the chosen fix', async () => {
    await page.locator('[data-testid="event-row-1"]').click();
    await page.locator('[data-testid="map-layer"]').selectOption('srp');
    const legend = page.locator('[data-testid="map-legend-overlay"]');
    await expect.poll(() => legend.count(), { timeout: 15_000 }).toBe(1);
    expect(Number(await legend.getAttribute('data-max-value'))).toBeCloseTo(1, 9);
    const peak = page.locator('[data-testid="map-srp-peak"]');
    await expect.poll(() => peak.count(), { timeout: 15_000 }).toBe(1);
    const fixPosition = [Number(await page.locator('[data-testid="event-row-1"] td').nth(3).textContent()), Number(await page.locator('[data-testid="event-row-1"] td').nth(4).textContent())];
    // The grid is 150 cells over three array spans (about 1.6 m a cell): the peak lies within two cells of the fix (once the
    // chosen event's correlations have arrived: until then the layer shows the previous event's).
    await expect.poll(async () => Math.hypot(Number(await peak.getAttribute('data-east-meters')) - fixPosition[0]!, Number(await peak.getAttribute('data-north-meters')) - fixPosition[1]!), { timeout: 15_000 }).toBeLessThan(3.2);
    await shot(page, '07d-layer-srp');
    await page.locator('[data-testid="map-layer"]').selectOption('precision');
    await shot(page, '07e-layer-precision');
    await page.locator('[data-testid="map-layer"]').selectOption('none');
  }, 120_000);

  it('defect 7: panels resize and collapse, giving the map the room', async () => {
    const mapBefore = await box(page, 'map-area');
    const left = await box(page, 'panel-left');
    const splitter = await box(page, 'splitter-left');
    await page.mouse.move(splitter.x + splitter.width / 2, splitter.y + 200);
    await page.mouse.down();
    await page.mouse.move(splitter.x - 80, splitter.y + 200, { steps: 5 });
    await page.mouse.up();
    // The pointer went from the splitter's middle to 80 px left of its edge: about 83 px, within a few pixels of pointer slop.
    expect(Math.abs((await box(page, 'panel-left')).width - (left.width - 83))).toBeLessThan(8);
    expect(Math.abs((await box(page, 'map-area')).width - (mapBefore.width + 83))).toBeLessThan(8);
    await page.locator('[data-testid="collapse-right"]').click();
    await page.locator('[data-testid="collapse-bottom"]').click();
    expect((await box(page, 'panel-right')).width).toBeLessThan(40);
    expect((await box(page, 'map-area')).height).toBeGreaterThan(mapBefore.height + 150);
    await shot(page, '07f-panels-collapsed');
    await page.locator('[data-testid="collapse-right"]').click();
    await page.locator('[data-testid="collapse-bottom"]').click();
    await page.mouse.move(splitter.x - 80 + splitter.width / 2, splitter.y + 200);
    await page.mouse.down();
    await page.mouse.move(splitter.x + splitter.width / 2, splitter.y + 200, { steps: 5 });
    await page.mouse.up();
    await shotTabs(page, ['settings', 'microphones', 'safety']);
  }, 180_000);

  it('defect 7: at 1280 x 720 three recording lanes and the map are in view', async () => {
    await page.setViewportSize({ width: 1280, height: 720 });
    await page.waitForTimeout(500);
    const stage = await box(page, 'map-stage');
    expect(stage.width).toBeGreaterThan(400);
    expect(stage.height).toBeGreaterThan(150);
    const lanes = await box(page, 'recording-overview');
    const bottom = await page.locator('[data-testid="panel-bottom"] > .tab-body').boundingBox();
    const visibleBottom = Math.min(bottom!.y + bottom!.height, 720);
    // Time axis 38 px (the demo has a start time), lanes 44 px for six channels (renderer/recording/drawRecording.ts).
    expect((visibleBottom - lanes.y - 38) / 44).toBeGreaterThanOrEqual(3);
    await shot(page, '07g-small-window');
    await shotTabs(page, ['settings', 'microphones', 'correlations', 'safety']);
    await page.locator('[data-testid="map-layer"]').selectOption('srp');
    await shot(page, '08-layer-srp');
    await page.locator('[data-testid="map-layer"]').selectOption('none');
    await page.setViewportSize({ width: 1440, height: 900 });
  }, 180_000);
});
