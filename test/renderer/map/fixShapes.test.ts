import { describe, expect, it } from 'vitest';
import { fixShapes, FIX_COLOURS } from '../../../renderer/map/fixShapes';
import { MapScale } from '../../../renderer/map/mapScale';
import type { MapFix } from '../../../renderer/map/types';

const scale = MapScale.create({ centerEastMeters: 0, centerNorthMeters: 0, metersPerPixel: 0.05, widthPixels: 800, heightPixels: 600 });
// check-values.md: 95 % ellipse of [[4, 1.5], [1.5, 1]] m²: semi-axes 5.261984, 1.506269 m, major axis 22.5° from +x (computed).
const ellipse = { semiMajorMeters: 5.261984, semiMinorMeters: 1.506269, majorAxisDegreesFromEast: 22.5, confidence: 0.95 };
const okFix: MapFix = { id: 'a', label: 'call 1', status: 'ok', eastMeters: 3, northMeters: 2, upMeters: 0, ellipse, selected: false };

describe('fixShapes()', () => {
  it('fixShapes() draws the ellipse on screen with its major axis 22.5° above east (screen y is down)', () => {
    const [shape] = fixShapes([okFix], scale);
    expect(shape.xPixels).toBeCloseTo(460, 9);
    expect(shape.yPixels).toBeCloseTo(260, 9);
    const pixels = shape.ellipsePixels as number[];
    const dx = pixels[0] - shape.xPixels;
    const dy = pixels[1] - shape.yPixels;
    expect(dy).toBeLessThan(0); // north-east of the fix is up and to the right on screen
    expect((Math.atan2(-dy, dx) * 180) / Math.PI).toBeCloseTo(22.5, 9);
    expect(Math.hypot(dx, dy)).toBeCloseTo(5.261984 / 0.05, 6);
  });

  it('fixShapes() ellipse points, read back through the scale, satisfy the ellipse equation', () => {
    const [shape] = fixShapes([okFix], scale);
    const pixels = shape.ellipsePixels as number[];
    const angle = (22.5 * Math.PI) / 180;
    for (let k = 0; k < pixels.length; k += 2) {
      const p = scale.toMap({ xPixels: pixels[k], yPixels: pixels[k + 1] });
      const de = p.eastMeters - okFix.eastMeters;
      const dn = p.northMeters - okFix.northMeters;
      const u = de * Math.cos(angle) + dn * Math.sin(angle);
      const v = -de * Math.sin(angle) + dn * Math.cos(angle);
      expect((u / 5.261984) ** 2 + (v / 1.506269) ** 2).toBeCloseTo(1, 9);
    }
    expect(shape.ellipseLabel).toBe('95 % ellipse 5.3 m × 1.5 m');
  });

  it('fixShapes() marks the other solution of an ambiguous fix and colours fixes by status and selection', () => {
    const ambiguous: MapFix = { ...okFix, id: 'b', status: 'ambiguous', alternative: { eastMeters: -4, northMeters: 6 } };
    const [ok, amb, selected] = fixShapes([okFix, ambiguous, { ...okFix, id: 'c', selected: true }], scale);
    expect(ok.colour).toBe(FIX_COLOURS.ok);
    expect(ok.alternative).toBeUndefined();
    expect(amb.colour).toBe(FIX_COLOURS.ambiguous);
    expect(amb.alternative).toEqual({ xPixels: scale.xPixels(-4), yPixels: scale.yPixels(6) });
    expect(amb.title).toContain('other solution E −4.00 m, N 6.00 m');
    expect(selected.colour).toBe(FIX_COLOURS.selected);
  });

  it('fixShapes() colours and shapes a fix by its verdict (Okabe-Ito colours, a marker per grade) and names a doubtful one', () => {
    const [firm, doubtful, unusable] = fixShapes(
      [
        { ...okFix, verdict: 'firm', verdictReason: 'All microphones agree; small ellipse.' },
        { ...okFix, id: 'd', status: 'ambiguous', verdict: 'doubtful', verdictReason: 'Two spots fit equally: check the other one.', selected: true },
        { ...okFix, id: 'u', status: 'inconsistent', verdict: 'unusable', verdictReason: 'The microphones disagree: no single spot fits.' },
      ],
      scale,
    );
    // Okabe & Ito (2008) blue, orange and vermilion; the verdict keeps its colour when selected (selection thickens the marker).
    expect([firm!.colour, doubtful!.colour, unusable!.colour]).toEqual(['#0072b2', '#e69f00', '#d55e00']);
    expect([firm!.marker, doubtful!.marker, unusable!.marker]).toEqual(['plus', 'triangle', 'cross']);
    expect([firm!.text, doubtful!.text, unusable!.text]).toEqual(['call 1', 'call 1 (doubtful)', 'call 1 (unusable)']);
    expect(doubtful!.title).toContain('call 1: doubtful (Two spots fit equally: check the other one)');
    expect(unusable!.verdictReason).toBe('The microphones disagree: no single spot fits.');
  });

  it('fixShapes() leaves out an ellipse without a usable size', () => {
    const shapes = fixShapes(
      [
        { ...okFix, ellipse: undefined },
        { ...okFix, id: 'z', ellipse: { ...ellipse, semiMajorMeters: 0 } },
        { ...okFix, id: 'n', ellipse: { ...ellipse, semiMajorMeters: Number.POSITIVE_INFINITY } },
      ],
      scale,
    );
    for (const shape of shapes) expect(shape.ellipsePixels).toBeUndefined();
  });

  it('fixShapes() leaves out a fix without a finite position and an alternative without one', () => {
    const shapes = fixShapes(
      [
        { ...okFix, id: 'lost', eastMeters: Number.NaN, northMeters: Number.NaN },
        { ...okFix, id: 'half', status: 'ambiguous', alternative: { eastMeters: Number.NaN, northMeters: 1 } },
      ],
      scale,
    );
    expect(shapes.map((shape) => shape.id)).toEqual(['half']);
    expect(shapes[0].alternative).toBeUndefined();
  });
});
