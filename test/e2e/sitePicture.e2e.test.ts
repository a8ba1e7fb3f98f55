// The site picture in a real browser (web mode, Debian's Chromium via playwright-core): a PNG with a UTM world file and a
// plain PNG pinned by two points are drawn under the array where they belong (pixel colours read from the map's canvas
// beside each microphone), saved in the project and shown again after reopening; bad files leave the map as it was.
// Expected places: UTM through proj4 (an independent implementation, shared/check-values.md); the pictures are invented patterns.
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import proj4 from 'proj4';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { enuToGeodetic, type GeodeticPosition } from '../../core/geo';
import { chromiumAvailable, openPage, SCREENSHOT_FOLDER, startWebApp, type WebApp } from '../helpers/webApp';

const mustRun = process.env.CI === 'true';
const run = chromiumAvailable() || mustRun;

type Rgb = [number, number, number];
/** Quadrant colours: top-left, top-right, bottom-left, bottom-right (as drawn, before the picture is turned). */
const WORLD_COLOURS: Rgb[] = [[200, 30, 30], [30, 150, 60], [30, 70, 210], [230, 190, 20]];
const PINNED_COLOURS: Rgb[] = [[150, 40, 170], [20, 170, 170], [240, 120, 20], [90, 90, 90]];
const BACKGROUND: Rgb = [0xfb, 0xf9, 0xf4];
const UTM33 = proj4('+proj=longlat +datum=WGS84 +no_defs', '+proj=utm +zone=33 +datum=WGS84 +units=m +no_defs');

interface Microphone { eastMeters: number; northMeters: number; xPixels: number; yPixels: number }

async function demoLoaded(page: Page): Promise<void> {
  await page.waitForFunction(() => document.querySelectorAll('[data-testid^="event-row-"]').length >= 15, undefined, { timeout: 90_000 });
}

async function microphones(page: Page): Promise<Microphone[]> {
  return page.locator('[data-testid^="map-microphone-"]').evaluateAll((items) => items.map((item) => {
    const data = (item as HTMLElement).dataset;
    return { eastMeters: Number(data.eastMeters), northMeters: Number(data.northMeters), xPixels: Number(data.xPixels), yPixels: Number(data.yPixels) };
  }));
}

/** A PNG of four coloured quadrants split at (splitColumn, splitRow), drawn by the browser's own canvas. */
async function quadrantPng(page: Page, width: number, height: number, splitColumn: number, splitRow: number, colours: Rgb[]): Promise<Buffer> {
  const base64 = await page.evaluate(({ width, height, splitColumn, splitRow, colours }) => {
    const canvas = document.createElement('canvas');
    canvas.width = width;
    canvas.height = height;
    const context = canvas.getContext('2d')!;
    const boxes: Array<[number, number, number, number]> = [[0, 0, splitColumn, splitRow], [splitColumn, 0, width - splitColumn, splitRow], [0, splitRow, splitColumn, height - splitRow], [splitColumn, splitRow, width - splitColumn, height - splitRow]];
    boxes.forEach(([x, y, w, h], index) => {
      const [r, g, b] = colours[index]!;
      context.fillStyle = `rgb(${r}, ${g}, ${b})`;
      context.fillRect(x, y, w, h);
    });
    return canvas.toDataURL('image/png').split(',')[1]!;
  }, { width, height, splitColumn, splitRow, colours });
  return Buffer.from(base64, 'base64');
}

/** The most common colour in a 5 × 5 patch of the map's bottom layer (the picture, under grid lines) at a map pixel. */
async function mapColour(page: Page, xPixels: number, yPixels: number): Promise<Rgb> {
  return page.locator('[data-testid="map-stage"]').evaluate((stage, [x, y]) => {
    const canvas = stage.querySelector('canvas')!;
    const ratio = canvas.width / canvas.getBoundingClientRect().width;
    const context = canvas.getContext('2d')!;
    const data = context.getImageData(Math.round((x! - 2) * ratio), Math.round((y! - 2) * ratio), 5, 5).data;
    const counts = new Map<string, number>();
    for (let i = 0; i < data.length; i += 4) {
      const key = `${data[i]},${data[i + 1]},${data[i + 2]}`;
      counts.set(key, (counts.get(key) ?? 0) + 1);
    }
    const best = [...counts.entries()].sort((a, b) => b[1] - a[1])[0]![0];
    return best.split(',').map(Number) as [number, number, number];
  }, [xPixels, yPixels]);
}

async function mapFrame(page: Page) {
  const view = page.locator('[data-testid="map-view"]');
  const stage = await page.locator('[data-testid="map-stage"]').boundingBox();
  return {
    metersPerPixel: Number(await view.getAttribute('data-meters-per-pixel')),
    centerEast: Number(await view.getAttribute('data-center-east-meters')),
    centerNorth: Number(await view.getAttribute('data-center-north-meters')),
    width: stage!.width,
    height: stage!.height,
  };
}

/** Which quadrant colour (blended at `opacity` over the map's background) a colour is nearest to. */
function nearestQuadrant(colour: Rgb, colours: Rgb[], opacity: number): number {
  const blended = colours.map((c) => c.map((v, k) => opacity * v + (1 - opacity) * BACKGROUND[k]!));
  const distances = blended.map((c) => Math.hypot(c[0]! - colour[0], c[1]! - colour[1], c[2]! - colour[2]));
  const best = Math.min(...distances);
  return best < 20 ? distances.indexOf(best) : -1;
}

/**
 * Reads the map beside each microphone (12 px down-left, clear of its marker) and checks the colour there is the
 * quadrant `expected` gives for that ground point (undefined: too near a dividing line to judge). Returns the count checked.
 */
async function checkBesideMicrophones(page: Page, colours: Rgb[], expected: (eastMeters: number, northMeters: number) => number | undefined): Promise<number> {
  const frame = await mapFrame(page);
  const opacity = Number(await page.locator('[data-testid="map-site-picture"]').getAttribute('data-opacity'));
  let checked = 0;
  for (const mic of await microphones(page)) {
    const x = mic.xPixels - 12;
    const y = mic.yPixels + 12;
    const east = frame.centerEast + (x - frame.width / 2) * frame.metersPerPixel;
    const north = frame.centerNorth - (y - frame.height / 2) * frame.metersPerPixel;
    const quadrant = expected(east, north);
    if (quadrant === undefined) continue;
    expect(nearestQuadrant(await mapColour(page, x, y), colours, opacity), `colour beside the microphone at ${mic.eastMeters.toFixed(1)}, ${mic.northMeters.toFixed(1)} m`).toBe(quadrant);
    checked += 1;
  }
  return checked;
}

/**
 * The quadrant of the pinned picture (turned by `turn` about `centre`) under a ground point: 0 top-left ... 3 bottom-right,
 * undefined within 1.5 m of a dividing line or past the picture's edges (pixel picks are to 0.1 pixel, 0.05 m).
 */
function turnedQuadrant(east: number, north: number, centre: { east: number; north: number }, turn: number): number | undefined {
  const dx = east - centre.east;
  const dy = north - centre.north;
  const right = dx * Math.cos(turn) + dy * Math.sin(turn);
  const up = -dx * Math.sin(turn) + dy * Math.cos(turn);
  if (Math.abs(right) < 1.5 || Math.abs(up) < 1.5 || Math.abs(right) > 73 || Math.abs(up) > 48) return undefined;
  return (up > 0 ? 0 : 2) + (right > 0 ? 1 : 0);
}

describe.runIf(run)('the site picture under the map', () => {
  let app: WebApp;
  let page: Page;
  let origin: GeodeticPosition;
  let centre: { east: number; north: number };
  const folder = mkdtempSync(join(tmpdir(), 'whence-site-'));
  let savedProject = '';

  beforeAll(async () => {
    app = await startWebApp(5394);
    page = await openPage(app);
    origin = (JSON.parse(readFileSync('assets/demo/out/demo-project.whence', 'utf8')) as { array: { origin: GeodeticPosition } }).array.origin;
  }, 240_000);

  afterAll(async () => {
    await app?.close();
  });

  it('places a PNG with its UTM world file under the array, each microphone on the right quadrant', async () => {
    await demoLoaded(page);
    const mics = await microphones(page);
    centre = { east: mics.reduce((s, m) => s + m.eastMeters, 0) / mics.length, north: mics.reduce((s, m) => s + m.northMeters, 0) / mics.length };
    // 240 × 240 pixels of 0.5 m centred on the array; the quadrants meet at the array's centre (UTM zone 33 north).
    const centreGeo = enuToGeodetic({ eastMeters: centre.east, northMeters: centre.north, upMeters: 0 }, origin);
    const [centreEasting, centreNorthing] = UTM33.forward([centreGeo.longitudeDegrees, centreGeo.latitudeDegrees]) as [number, number];
    writeFileSync(join(folder, 'site.png'), await quadrantPng(page, 240, 240, 120, 120, WORLD_COLOURS));
    // World file: A, D, B, E, C, F with C, F the centre of the top-left pixel (ESRI convention).
    writeFileSync(join(folder, 'site.pgw'), ['0.5', '0', '0', '-0.5', (centreEasting - 60 + 0.25).toFixed(3), (centreNorthing + 60 - 0.25).toFixed(3)].join('\n'));

    await page.locator('[data-testid="site-picture-open"]').click();
    await page.locator('[data-testid="site-picture-files"]').setInputFiles([join(folder, 'site.png'), join(folder, 'site.pgw')]);
    await expect.poll(() => page.locator('[data-testid="site-picture-summary"]').textContent()).toMatch(/site\.png, 240 × 240 pixels, world file site\.pgw/);
    // The frame is guessed from the numbers and the array's origin: UTM, zone 33 north.
    expect(await page.locator('[data-testid="site-picture-frame"]').inputValue()).toBe('utm');
    expect(await page.locator('[data-testid="site-picture-utm-zone"]').inputValue()).toBe('33');
    await page.screenshot({ path: `${SCREENSHOT_FOLDER}/site-01-world-file-dialog.png` });
    await page.locator('[data-testid="site-picture-place"]').click();
    await page.locator('[data-testid="map-site-picture"]').waitFor({ state: 'attached', timeout: 10_000 });

    const checked = await checkBesideMicrophones(page, WORLD_COLOURS, (east, north) => {
      const geo = enuToGeodetic({ eastMeters: east, northMeters: north, upMeters: 0 }, origin);
      const [easting, northing] = UTM33.forward([geo.longitudeDegrees, geo.latitudeDegrees]) as [number, number];
      const dx = easting - centreEasting;
      const dy = northing - centreNorthing;
      if (Math.abs(dx) < 1.5 || Math.abs(dy) < 1.5 || Math.abs(dx) > 58 || Math.abs(dy) > 58) return undefined;
      return (dy > 0 ? 0 : 2) + (dx > 0 ? 1 : 0);
    });
    expect(checked).toBeGreaterThanOrEqual(4);
    await page.screenshot({ path: `${SCREENSHOT_FOLDER}/site-02-world-file-placed.png` });

    // Opacity: the slider changes how strongly the picture shows.
    await page.locator('[data-testid="site-picture-opacity"]').fill('40');
    await expect.poll(() => page.locator('[data-testid="map-site-picture"]').getAttribute('data-opacity')).toBe('0.4');
  }, 150_000);

  it('refuses a corrupt TIFF, a GeoTIFF in an unsupported CRS and an over-large picture, and leaves the map as it was', async () => {
    const before = await page.locator('[data-testid="map-site-picture"]').getAttribute('data-corners-pixels');
    writeFileSync(join(folder, 'broken.tif'), Buffer.concat([Buffer.from('II*\u0000'), Buffer.alloc(20, 7)]));
    // A PNG whose header claims 20 000 × 20 000 pixels (refused before decoding).
    const png = await quadrantPng(page, 8, 8, 4, 4, WORLD_COLOURS);
    png.writeUInt32BE(20_000, 16);
    png.writeUInt32BE(20_000, 20);
    writeFileSync(join(folder, 'huge.png'), png);
    const cases: Array<[string, RegExp]> = [
      ['broken.tif', /broken\.tif could not be read/],
      ['test/fixtures/sitePicture/site-epsg27700.tif', /is in EPSG:27700.*Reproject it/],
      ['huge.png', /20000 × 20000 pixels; a site picture may be at most 10000 pixels a side/],
    ];
    await page.locator('[data-testid="site-picture-replace"]').click();
    for (const [file, message] of cases) {
      await page.locator('[data-testid="site-picture-files"]').setInputFiles(file.includes('/') ? file : join(folder, file));
      await expect.poll(() => page.locator('[data-testid="site-picture-error"]').textContent(), { timeout: 10_000 }).toMatch(message);
      expect(await page.locator('[data-testid="site-picture-place"]').isDisabled()).toBe(true);
    }
    await page.screenshot({ path: `${SCREENSHOT_FOLDER}/site-03-unsupported-crs.png` });
    await page.locator('[data-testid="site-picture-cancel"]').click();
    expect(await page.locator('[data-testid="map-site-picture"]').getAttribute('data-corners-pixels')).toBe(before);
  }, 60_000);

  it('pins a plain picture by two clicked points, turned 30°, and draws it where the points say', async () => {
    // 300 × 200 pixels; the quadrants meet at pixel corner (150, 100), which is pinned between two points 0.5 m a pixel.
    writeFileSync(join(folder, 'sketch.png'), await quadrantPng(page, 300, 200, 150, 100, PINNED_COLOURS));
    const turn = Math.PI / 6;
    const metersPerPixel = 0.5;
    /** Ground position of a picture point (u, v in pixels from its top-left corner) under the intended placement. */
    const ground = (u: number, v: number) => {
      const right = (u - 150) * metersPerPixel;
      const up = -(v - 100) * metersPerPixel;
      return { east: centre.east + right * Math.cos(turn) - up * Math.sin(turn), north: centre.north + right * Math.sin(turn) + up * Math.cos(turn) };
    };
    await page.locator('[data-testid="site-picture-replace"]').click();
    await page.locator('[data-testid="site-picture-files"]').setInputFiles(join(folder, 'sketch.png'));
    await expect.poll(() => page.locator('[data-testid="site-picture-summary"]').textContent()).toMatch(/no world file: pin it by two points/);
    const preview = page.locator('[data-testid="site-picture-preview"]');
    const box = (await preview.boundingBox())!;
    for (const [index, [u, v]] of [[40, 30], [260, 170]].entries()) {
      await page.mouse.click(box.x + (u! / 300) * box.width, box.y + (v! / 200) * box.height);
      // The dialog shows the pixel it took (column = u − ½ at the pixel-centre grid); the ground position is typed for it.
      const text = (await page.locator(`[data-testid="site-picture-pin-${index + 1}-pixel"]`).textContent()) ?? '';
      const [column, row] = (text.match(/pixel (-?[\d.]+), (-?[\d.]+)/) ?? []).slice(1).map(Number) as [number, number];
      const at = ground(column + 0.5, row + 0.5);
      await page.locator(`[data-testid="site-picture-pin-${index + 1}-first"]`).fill(at.east.toFixed(3));
      await page.locator(`[data-testid="site-picture-pin-${index + 1}-second"]`).fill(at.north.toFixed(3));
    }
    await page.screenshot({ path: `${SCREENSHOT_FOLDER}/site-04-two-points-dialog.png` });
    await page.locator('[data-testid="site-picture-place"]').click();
    await expect.poll(() => page.locator('[data-testid="site-picture-dialog"]').count()).toBe(0);

    const inPicture = (east: number, north: number) => turnedQuadrant(east, north, centre, turn);
    await expect.poll(() => checkBesideMicrophones(page, PINNED_COLOURS, inPicture).catch(() => 0), { timeout: 10_000 }).toBeGreaterThanOrEqual(4);
    await page.screenshot({ path: `${SCREENSHOT_FOLDER}/site-05-two-points-placed.png` });

    // Saved with the project (web mode downloads the file), then reopened in a fresh page: the picture is there again.
    const downloadPromise = page.waitForEvent('download');
    await page.locator('[data-testid="save-project"]').click();
    const download = await downloadPromise;
    savedProject = join(folder, 'saved.whence');
    await download.saveAs(savedProject);
    const saved = JSON.parse(readFileSync(savedProject, 'utf8')) as { sitePicture?: { name: string; placedBy: string; mediaType: string; widthPixels: number; dataBase64: string } };
    expect(saved.sitePicture).toMatchObject({ name: 'sketch.png', placedBy: 'two-points', mediaType: 'image/png', widthPixels: 300 });
    expect(Buffer.from(saved.sitePicture!.dataBase64, 'base64').subarray(1, 4).toString('latin1')).toBe('PNG');
  }, 120_000);

  it('shows the saved picture again when the project is reopened', async () => {
    const fresh = await openPage(app);
    await demoLoaded(fresh);
    expect(await fresh.locator('[data-testid="map-site-picture"]').count()).toBe(0);
    const chooserPromise = fresh.waitForEvent('filechooser');
    await fresh.locator('[data-testid="open-project"]').click();
    // Opening over unsaved work may ask first (renderer/state/questions.ts): discard the fresh page's demo edits.
    const discard = fresh.locator('[data-testid="confirm-discard"]');
    if (await discard.isVisible({ timeout: 2_000 }).catch(() => false)) await discard.click();
    const chooser = await chooserPromise;
    await chooser.setFiles(savedProject);
    await fresh.locator('[data-testid="map-site-picture"]').waitFor({ state: 'attached', timeout: 15_000 });
    const turn = Math.PI / 6;
    const checked = await checkBesideMicrophones(fresh, PINNED_COLOURS, (east, north) => turnedQuadrant(east, north, centre, turn));
    expect(checked).toBeGreaterThanOrEqual(4);
    await fresh.screenshot({ path: `${SCREENSHOT_FOLDER}/site-06-reopened.png` });
    // Remove takes it off the map; Put back returns it.
    await fresh.locator('[data-testid="site-picture-remove"]').click();
    await expect.poll(() => fresh.locator('[data-testid="map-site-picture"]').count()).toBe(0);
    await fresh.locator('[data-testid="site-picture-restore"]').click();
    await fresh.locator('[data-testid="map-site-picture"]').waitFor({ state: 'attached', timeout: 5_000 });
  }, 120_000);
});
