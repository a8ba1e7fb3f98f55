import { describe, expect, it } from 'vitest';
import { WhenceError } from '../../../core/errors';
import { seededRandom } from '../../../core/locate';
import { MapScale, MAX_METERS_PER_PIXEL, MIN_METERS_PER_PIXEL } from '../../../renderer/map/mapScale';

const base = MapScale.create({ centerEastMeters: 120, centerNorthMeters: -35, metersPerPixel: 0.25, widthPixels: 1200, heightPixels: 800 });

describe('MapScale', () => {
  it('MapScale.toScreen() puts east to the right and north up, the centre in the middle of the view', () => {
    // Screen convention (common practice): x grows to the right, y grows downward.
    expect(base.toScreen({ eastMeters: 120, northMeters: -35 })).toEqual({ xPixels: 600, yPixels: 400 });
    expect(base.toScreen({ eastMeters: 130, northMeters: -35 })).toEqual({ xPixels: 640, yPixels: 400 });
    expect(base.toScreen({ eastMeters: 120, northMeters: -25 })).toEqual({ xPixels: 600, yPixels: 360 });
  });

  it('MapScale.toMap() undoes toScreen() for random points and scales (seeded)', () => {
    const random = seededRandom(71);
    for (let k = 0; k < 500; k += 1) {
      const scale = MapScale.create({
        centerEastMeters: (random.uniform() - 0.5) * 2e5,
        centerNorthMeters: (random.uniform() - 0.5) * 2e5,
        metersPerPixel: 10 ** (random.uniform() * 7 - 3),
        widthPixels: 100 + random.uniform() * 2000,
        heightPixels: 100 + random.uniform() * 2000,
      });
      const point = { eastMeters: scale.centerEastMeters + (random.uniform() - 0.5) * 1e4, northMeters: scale.centerNorthMeters + (random.uniform() - 0.5) * 1e4 };
      const back = scale.toMap(scale.toScreen(point));
      expect(Math.abs(back.eastMeters - point.eastMeters)).toBeLessThan(1e-9 * (1 + Math.abs(point.eastMeters)));
      expect(Math.abs(back.northMeters - point.northMeters)).toBeLessThan(1e-9 * (1 + Math.abs(point.northMeters)));
      const pixel = { xPixels: random.uniform() * scale.widthPixels, yPixels: random.uniform() * scale.heightPixels };
      const again = scale.toScreen(scale.toMap(pixel));
      expect(again.xPixels).toBeCloseTo(pixel.xPixels, 6);
      expect(again.yPixels).toBeCloseTo(pixel.yPixels, 6);
    }
  });

  it('MapScale.zoomedAbout() keeps the map point under the cursor in place and divides metres per pixel by the factor', () => {
    const anchor = { xPixels: 913, yPixels: 127 };
    const held = base.toMap(anchor);
    for (const factor of [1.2, 0.5, 3, 1 / 1.7]) {
      const zoomed = base.zoomedAbout(factor, anchor);
      expect(zoomed.metersPerPixel).toBeCloseTo(base.metersPerPixel / factor, 12);
      const still = zoomed.toScreen(held);
      expect(still.xPixels).toBeCloseTo(anchor.xPixels, 9);
      expect(still.yPixels).toBeCloseTo(anchor.yPixels, 9);
    }
  });

  it('MapScale.zoomedAbout() stops at the zoom limits and still keeps the anchor', () => {
    const anchor = { xPixels: 100, yPixels: 700 };
    const held = base.toMap(anchor);
    const closest = base.zoomedAbout(1e9, anchor);
    expect(closest.metersPerPixel).toBe(MIN_METERS_PER_PIXEL);
    expect(closest.toScreen(held).xPixels).toBeCloseTo(anchor.xPixels, 6);
    expect(closest.toScreen(held).yPixels).toBeCloseTo(anchor.yPixels, 6);
    expect(base.zoomedAbout(1e-12, anchor).metersPerPixel).toBe(MAX_METERS_PER_PIXEL);
    expect(base.zoomedAbout(Number.NaN, anchor)).toBe(base);
  });

  it('MapScale.panned() moves the map content with the hand by (dx, dy) pixels', () => {
    const point = { eastMeters: 101.5, northMeters: -12.25 };
    const before = base.toScreen(point);
    const after = base.panned(37, -21).toScreen(point);
    expect(after.xPixels).toBeCloseTo(before.xPixels + 37, 9);
    expect(after.yPixels).toBeCloseTo(before.yPixels - 21, 9);
    expect(base.panned(37, -21).metersPerPixel).toBe(base.metersPerPixel);
  });

  it('MapScale.fit() shows the bounds whole and centred inside the padding, touching it along the tighter side', () => {
    const bounds = { minEastMeters: -6, maxEastMeters: 95, minNorthMeters: 0, maxNorthMeters: 88 };
    const scale = MapScale.fit(bounds, 1400, 800, 50);
    const rect = scale.toScreenRect(bounds);
    expect(rect.xPixels).toBeGreaterThanOrEqual(50 - 1e-9);
    expect(rect.yPixels).toBeGreaterThanOrEqual(50 - 1e-9);
    expect(rect.xPixels + rect.widthPixels).toBeLessThanOrEqual(1350 + 1e-9);
    expect(rect.yPixels + rect.heightPixels).toBeLessThanOrEqual(750 + 1e-9);
    // 88 m over 700 px is the binding side: it spans exactly the height between the paddings.
    expect(rect.heightPixels).toBeCloseTo(700, 9);
    expect(rect.xPixels + rect.widthPixels / 2).toBeCloseTo(700, 9);
    expect(rect.yPixels + rect.heightPixels / 2).toBeCloseTo(400, 9);
  });

  it('MapScale.fit() widens a single point to the minimum extent', () => {
    const scale = MapScale.fit({ minEastMeters: 5, maxEastMeters: 5, minNorthMeters: 7, maxNorthMeters: 7 }, 400, 200, 0, 10);
    expect(scale.metersPerPixel).toBeCloseTo(10 / 200, 12);
    expect(scale.toScreen({ eastMeters: 5, northMeters: 7 })).toEqual({ xPixels: 200, yPixels: 100 });
  });

  it('MapScale.bounds() are the map coordinates of the view corners, grown by the margin', () => {
    const view = base.bounds();
    expect(view.minEastMeters).toBeCloseTo(base.eastMeters(0), 12);
    expect(view.maxEastMeters).toBeCloseTo(base.eastMeters(1200), 12);
    expect(view.maxNorthMeters).toBeCloseTo(base.northMeters(0), 12);
    expect(view.minNorthMeters).toBeCloseTo(base.northMeters(800), 12);
    expect(view.maxEastMeters - view.minEastMeters).toBeCloseTo(300, 9);
    const grown = base.bounds(10);
    expect(grown.maxEastMeters - grown.minEastMeters).toBeCloseTo(300 + 20 * 0.25, 9);
  });

  it('MapScale.resized() keeps the centre and metres per pixel', () => {
    const resized = base.resized(600, 300);
    expect(resized.toScreen({ eastMeters: 120, northMeters: -35 })).toEqual({ xPixels: 300, yPixels: 150 });
    expect(resized.metersPerPixel).toBe(0.25);
    expect(base.resized(1200, 800)).toBe(base);
  });

  it('MapScale.create() rejects a view without size or a non-finite centre with map-invalid-scale', () => {
    const attempt = (spec: Partial<Parameters<typeof MapScale.create>[0]>) => () => MapScale.create({ ...base.spec(), ...spec });
    for (const bad of [{ widthPixels: 0 }, { heightPixels: -5 }, { metersPerPixel: 0 }, { centerEastMeters: Number.NaN }]) {
      expect(attempt(bad)).toThrow(WhenceError);
      expect(attempt(bad)).toThrow(expect.objectContaining({ code: 'map-invalid-scale' }));
    }
  });
});
