import { describe, expect, it } from 'vitest';
import { curveEntryPoint, placeCurveLabels } from '../../../renderer/map/curveLabels';

const box = { minX: 20, maxX: 380, minY: 20, maxY: 280 };

describe('curveEntryPoint()', () => {
  // Expected values: line/box intersections worked by hand (geometry, common practice).
  it('curveEntryPoint() finds where a segment crosses into the inner box, not the next vertex', () => {
    // A straight line from below the view up to its middle, sampled only at its ends (as along an asymptote).
    const flat = [100, 310, 100, 150];
    expect(curveEntryPoint(flat, false, box)).toEqual({ xPixels: 100, yPixels: 280 });
    // Walking from the other end, the first point is already inside.
    expect(curveEntryPoint(flat, true, box)).toEqual({ xPixels: 100, yPixels: 150 });
    const diagonal = [-10, -10, 90, 90];
    expect(curveEntryPoint(diagonal, false, box)).toEqual({ xPixels: 20, yPixels: 20 });
  });

  it('curveEntryPoint() returns undefined for a curve that never enters the box', () => {
    expect(curveEntryPoint([0, 0, 10, 500], false, box)).toBeUndefined();
  });
});

describe('placeCurveLabels()', () => {
  // Expected values: the layout this project specifies (text metrics, offsets, priorities); no outside reference.
  const options = { widthPixels: 400, heightPixels: 300, insetPixels: 20 };

  it('placeCurveLabels() gives the better curve the first place and moves a clashing label to the other end', () => {
    const line = [150, 310, 150, -10];
    const anchors = placeCurveLabels(
      [
        { text: 'M1–M2', polylinesPixels: [line], priority: 0.2 },
        { text: 'M3–M4', polylinesPixels: [line], priority: 0.9 },
      ],
      options,
    );
    expect(anchors[1]).toEqual({ anchorXPixels: 150, anchorYPixels: 280, xPixels: 154, yPixels: 282 }); // higher quality first, at the start
    expect(anchors[0]).toMatchObject({ anchorXPixels: 150, anchorYPixels: 20 }); // same start taken: the other end
  });

  it('placeCurveLabels() leaves a curve unlabelled when both ends are taken or covered', () => {
    const line = [150, 310, 150, -10];
    const anchors = placeCurveLabels(
      [
        { text: 'a', polylinesPixels: [line], priority: 3 },
        { text: 'b', polylinesPixels: [line], priority: 2 },
        { text: 'c', polylinesPixels: [line], priority: 1 },
      ],
      options,
    );
    expect(anchors[2]).toBeUndefined();
    const covered = placeCurveLabels([{ text: 'd', polylinesPixels: [line], priority: 1 }], {
      ...options,
      avoid: [{ xPixels: 100, yPixels: 0, widthPixels: 100, heightPixels: 300 }],
    });
    expect(covered[0]).toBeUndefined();
  });

  it('placeCurveLabels() keeps label boxes apart', () => {
    const requests = Array.from({ length: 12 }, (_, k) => ({ text: `M${k}–M${k + 1}`, polylinesPixels: [[40 + 25 * k, 320, 200, 150]], priority: k / 12 }));
    const anchors = placeCurveLabels(requests, options);
    // Default text metrics: 6.5 px per character plus 4 px, 14 px lines.
    const boxes = anchors.flatMap((a, k) => (a === undefined ? [] : [{ x: a.xPixels, y: a.yPixels, w: 6.5 * requests[k].text.length + 4 }]));
    expect(boxes.length).toBeGreaterThan(3);
    for (const b of boxes) expect(b.x >= 0 && b.x + b.w <= 400 && b.y >= 0 && b.y + 14 <= 300).toBe(true);
    for (let i = 0; i < boxes.length; i += 1) {
      for (let j = i + 1; j < boxes.length; j += 1) {
        const [a, b] = [boxes[i], boxes[j]];
        const apart = a.x + a.w <= b.x || b.x + b.w <= a.x || Math.abs(a.y - b.y) >= 14;
        expect(apart).toBe(true);
      }
    }
  });

  it('placeCurveLabels() mirrors a label to the left of its anchor near the right edge so it stays in view', () => {
    const [label] = placeCurveLabels([{ text: 'M3–M7', polylinesPixels: [[420, 100, 200, 100]], priority: 1 }], options);
    // Anchor 20 px inside the right edge; the 36.5 px label goes to its left: 380 − 4 − 36.5.
    expect(label).toEqual({ anchorXPixels: 380, anchorYPixels: 100, xPixels: 380 - 4 - (6.5 * 5 + 4), yPixels: 102 });
  });
});
