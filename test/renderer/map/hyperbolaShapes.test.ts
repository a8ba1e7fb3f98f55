import { describe, expect, it } from 'vitest';
import { hyperbolaBranch } from '../../../core/locate';
import { hyperbolaShapes } from '../../../renderer/map/hyperbolaShapes';
import { MapScale } from '../../../renderer/map/mapScale';
import { qualityColour } from '../../../renderer/map/qualityColour';
import type { MapMicrophone } from '../../../renderer/map/types';

const speed = 343;
const planeUpMeters = 1.5;
const mics: MapMicrophone[] = [
  { label: 'M1', channel: 1, eastMeters: 0, northMeters: 0, upMeters: 1.5 },
  { label: 'M2', channel: 2, eastMeters: 38, northMeters: 4, upMeters: 1.5 },
  { label: 'M3', channel: 3, eastMeters: 52, northMeters: 36, upMeters: 2.5 },
];
const source = { eastMeters: 31, northMeters: 19 };
const scale = MapScale.create({ centerEastMeters: 25, centerNorthMeters: 20, metersPerPixel: 0.1, widthPixels: 900, heightPixels: 600 });

/** Delay (arrival at a minus arrival at b) of the source on the map plane: the TDOA definition. */
function delay(a: MapMicrophone, b: MapMicrophone): number {
  const range = (m: MapMicrophone) => Math.hypot(source.eastMeters - m.eastMeters, source.northMeters - m.northMeters, planeUpMeters - m.upMeters);
  return (range(a) - range(b)) / speed;
}

describe('hyperbolaShapes()', () => {
  // Expected values: the source position the synthesis used (invented scene) and its delays (geometry: r/c, common practice); a hyperbola branch is |p−a| − |p−b| = c·τ (definition of TDOA); core hyperbolaBranch() for the point-for-point check; notes are this project's wording.
  it('hyperbolaShapes() maps core hyperbolaBranch() points to pixels through the scale, point for point', () => {
    const pairs = [
      { indexA: 0, indexB: 1, delaySeconds: delay(mics[0], mics[1]), quality: 0.9 },
      { indexA: 0, indexB: 2, delaySeconds: delay(mics[0], mics[2]), quality: 0.3 },
    ];
    const shapes = hyperbolaShapes(mics, pairs, speed, planeUpMeters, scale, { marginPixels: 8 });
    expect(shapes).toHaveLength(2);
    pairs.forEach((pair, k) => {
      const branch = hyperbolaBranch(mics[pair.indexA], mics[pair.indexB], pair.delaySeconds, speed, { bounds: scale.bounds(8), planeUpMeters });
      expect(shapes[k].polylinesPixels).toHaveLength(branch.polylines.length);
      branch.polylines.forEach((polyline, j) => {
        const flat = shapes[k].polylinesPixels[j];
        expect(flat).toHaveLength(2 * polyline.length);
        polyline.forEach((p, i) => {
          expect(flat[2 * i]).toBeCloseTo(scale.xPixels(p.eastMeters), 9);
          expect(flat[2 * i + 1]).toBeCloseTo(scale.yPixels(p.northMeters), 9);
        });
      });
    });
  });

  it('hyperbolaShapes() pixel points, read back through the scale, have the pair delay (|p−a| − |p−b| = c·τ)', () => {
    const pair = { indexA: 1, indexB: 2, delaySeconds: delay(mics[1], mics[2]), quality: 0.5 };
    const [shape] = hyperbolaShapes(mics, [pair], speed, planeUpMeters, scale);
    const points = shape.polylinesPixels.flat();
    expect(points.length).toBeGreaterThan(10);
    for (let i = 0; i < points.length; i += 2) {
      const p = scale.toMap({ xPixels: points[i], yPixels: points[i + 1] });
      const range = (m: MapMicrophone) => Math.hypot(p.eastMeters - m.eastMeters, p.northMeters - m.northMeters, planeUpMeters - m.upMeters);
      expect(range(mics[1]) - range(mics[2])).toBeCloseTo(speed * pair.delaySeconds, 6);
      // Within the view grown by the margin (8 px by default).
      expect(points[i]).toBeGreaterThanOrEqual(-8 - 1e-6);
      expect(points[i]).toBeLessThanOrEqual(908 + 1e-6);
    }
    // The source itself lies on the curve: some point is within a pixel of it.
    const sx = scale.xPixels(source.eastMeters);
    const sy = scale.yPixels(source.northMeters);
    let nearest = Infinity;
    for (let i = 0; i + 3 < points.length; i += 2) {
      const [ax, ay, bx, by] = [points[i], points[i + 1], points[i + 2], points[i + 3]];
      const t = Math.max(0, Math.min(1, ((sx - ax) * (bx - ax) + (sy - ay) * (by - ay)) / ((bx - ax) ** 2 + (by - ay) ** 2)));
      nearest = Math.min(nearest, Math.hypot(ax + t * (bx - ax) - sx, ay + t * (by - ay) - sy));
    }
    expect(nearest).toBeLessThan(1);
  });

  it('hyperbolaShapes() colours each curve by its quality and puts its label on the curve inside the view', () => {
    const [shape] = hyperbolaShapes(mics, [{ indexA: 0, indexB: 1, delaySeconds: delay(mics[0], mics[1]), quality: 0.25 }], speed, planeUpMeters, scale, {
      labelInsetPixels: 30,
    });
    expect(shape.colour).toBe(qualityColour(0.25));
    expect(shape.pairLabel).toBe('M1–M2');
    const placed = shape.label as NonNullable<typeof shape.label>;
    const label = { xPixels: placed.anchorXPixels, yPixels: placed.anchorYPixels };
    expect(label.xPixels).toBeGreaterThanOrEqual(30);
    expect(label.yPixels).toBeGreaterThanOrEqual(30);
    expect(label.xPixels).toBeLessThanOrEqual(870);
    expect(label.yPixels).toBeLessThanOrEqual(570);
    // On the curve: within rounding of one of its segments.
    let nearest = Infinity;
    for (const flat of shape.polylinesPixels) {
      for (let i = 0; i + 3 < flat.length; i += 2) {
        const [ax, ay, bx, by] = [flat[i], flat[i + 1], flat[i + 2], flat[i + 3]];
        const t = Math.max(0, Math.min(1, ((label.xPixels - ax) * (bx - ax) + (label.yPixels - ay) * (by - ay)) / ((bx - ax) ** 2 + (by - ay) ** 2)));
        nearest = Math.min(nearest, Math.hypot(ax + t * (bx - ax) - label.xPixels, ay + t * (by - ay) - label.yPixels));
      }
    }
    expect(nearest).toBeLessThan(1e-9);
  });

  it('hyperbolaShapes() explains a pair it cannot draw instead of throwing', () => {
    const shapes = hyperbolaShapes(
      mics,
      [
        { indexA: 0, indexB: 5, delaySeconds: 0.01, quality: 1 },
        { indexA: 0, indexB: 1, delaySeconds: 1, quality: 1 }, // 343 m of range difference for 38 m of spacing
        { indexA: 0, indexB: 1, delaySeconds: Number.NaN, quality: 1 },
      ],
      speed,
      planeUpMeters,
      scale,
    );
    expect(shapes[0].polylinesPixels).toEqual([]);
    expect(shapes[0].note).toMatch(/not in the array of 3/);
    expect(shapes[1].polylinesPixels).toEqual([]);
    expect(shapes[1].note).toMatch(/more than the .* between the microphones/);
    expect(shapes[2].polylinesPixels).toEqual([]);
    expect(shapes[2].note).toMatch(/delaySeconds is NaN/);
  });
});
