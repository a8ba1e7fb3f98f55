import { describe, expect, it } from 'vitest';
import { edgeMarkers, frameArrayAndFixes, scaleShowing } from '../../../renderer/map/mapFraming';
import { MapScale } from '../../../renderer/map/mapScale';
import type { MapFix } from '../../../renderer/map/types';

const mic = (eastMeters: number, northMeters: number) => ({ label: '', channel: 1, eastMeters, northMeters, upMeters: 0 });
const fix = (id: string, eastMeters: number, northMeters: number): MapFix => ({ id, label: id, status: 'ok', eastMeters, northMeters, upMeters: 0, selected: false });
// The demo's six microphones (assets/demo/scenario.ts): the array's box is -37..36 m east, -40..38.5 m north.
const demo = [mic(4, 38.5), mic(36, 17), mic(33.5, -24), mic(-2.5, -40), mic(-37, -14.5), mic(-30, 27)];

describe('frameArrayAndFixes()', () => {
  // Expected values: worked by hand; the 3-radii rule is this project's choice (issue 10, defect 7).
  it('frameArrayAndFixes() frames the array and near fixes and leaves a fix 270 m away out', () => {
    const framing = frameArrayAndFixes(demo, [fix('frog', 8, 6), fix('alder', 47, 31), fix('dog', 160, -215)]);
    expect(framing.outlierIds).toEqual(['dog']);
    expect(framing.bounds).toEqual({ minEastMeters: -37, maxEastMeters: 47, minNorthMeters: -40, maxNorthMeters: 38.5 });
  });

  it('frameArrayAndFixes() keeps fixes within 30 m of a small array', () => {
    const framing = frameArrayAndFixes([mic(0, 0), mic(1, 0), mic(0, 1)], [fix('a', 20, 0), fix('b', 40, 0)]);
    expect(framing.outlierIds).toEqual(['b']);
    expect(framing.bounds?.maxEastMeters).toBe(20);
  });
});

describe('edgeMarkers()', () => {
  const scale = MapScale.create({ centerEastMeters: 0, centerNorthMeters: 0, metersPerPixel: 0.2, widthPixels: 600, heightPixels: 400 });

  it('edgeMarkers() puts a marker on the edge towards a fix outside the view, and none for fixes inside', () => {
    // 300 m east is 1500 px right of the centre: the marker sits on the right edge less the inset, pointing east (0°).
    const markers = edgeMarkers(scale, [fix('in', 10, 10), fix('east', 300, 0)], 18);
    expect(markers).toHaveLength(1);
    expect(markers[0]).toMatchObject({ ids: ['east'], xPixels: 582, yPixels: 200, rotationDegrees: 0, distanceMeters: 300 });
    // South-east at 45°: north is up, so screen y grows southwards and the angle is +45° (clockwise).
    const se = edgeMarkers(scale, [fix('se', 200, -200)], 18)[0]!;
    expect(se.rotationDegrees).toBeCloseTo(45, 9);
    expect(se.yPixels).toBeCloseTo(382, 9);
  });

  it('edgeMarkers() merges markers of fixes in the same direction into one, nearest first', () => {
    const markers = edgeMarkers(scale, [fix('7', 160, -215), fix('16', 160.5, -215.2)]);
    expect(markers).toHaveLength(1);
    expect(markers[0]!.ids).toEqual(['7', '16']);
    expect(markers[0]!.label).toBe('7, 16');
  });
});

describe('scaleShowing()', () => {
  const scale = MapScale.create({ centerEastMeters: 0, centerNorthMeters: 0, metersPerPixel: 0.2, widthPixels: 600, heightPixels: 400 });

  it('scaleShowing() leaves the view alone when the point is inside it, and centres a point outside (zoom kept)', () => {
    expect(scaleShowing(scale, { eastMeters: 10, northMeters: 10 })).toBe(scale);
    const moved = scaleShowing(scale, { eastMeters: 300, northMeters: -100 });
    expect(moved.metersPerPixel).toBe(0.2);
    expect(moved.xPixels(300)).toBeCloseTo(300, 9);
    expect(moved.yPixels(-100)).toBeCloseTo(200, 9);
  });
});
