import { beforeAll, describe, expect, it } from 'vitest';
import type { DeploymentLayout } from '../../../core/deployment';
import { formatGapLength, MIN_GAP_PIXELS, recorderLanes, viewCentredOn } from '../../../renderer/deployment/recorderLanes';
import { laneHeightPixels } from '../../../renderer/deployment/RecordersTimeline';
import { timeScale } from '../../../renderer/recording';
import { fixtureLayout } from './layoutFixture';

// Expected values: worked by hand from the fixture's invented files (1 px per 10 ms on a 300 px, 3 s axis) and the clock
// model t_true = t_start + (1 + drift) t_rec + offset of issue 9.
let layout: DeploymentLayout;
beforeAll(async () => { layout = await fixtureLayout(); });

describe('recorderLanes()', () => {
  it('puts one lane per recorder, each file a bar at its start and length, a joined file marked and a gap where nothing was recorded', () => {
    const lanes = recorderLanes(layout, timeScale({ startSeconds: 0, endSeconds: 3 }, 300), { laneHeightPixels: 12 });
    expect(lanes.lanes.map((lane) => [lane.name, lane.top])).toEqual([['A', 0], ['B', 12]]);
    expect(lanes.heightPixels).toBe(24);
    const [a, b] = lanes.lanes;
    expect(a!.bars.map((bar) => [bar.file, bar.x0, bar.x1, bar.joined])).toEqual([['a1.wav', 0, 100, false], ['a2.wav', 100, 200, true]]);
    expect(a!.gaps).toEqual([]);
    expect(b!.bars.map((bar) => [bar.x0, bar.x1])).toEqual([[50, 150], [200, 300]]);
    expect(b!.gaps).toHaveLength(1);
    expect(b!.gaps[0]).toMatchObject({ fromSeconds: 1.5, toSeconds: 2, x0: 150, x1: 200, label: 'gap 500 ms' });
    expect(a!.bars[1]!.title).toBe('a2.wav: 1.00 s, start from bext TimeReference, continues the previous file');
    expect(lanes.view).toBeUndefined();
  });

  it('draws a short gap at least MIN_GAP_PIXELS wide around its middle, and marks the recording view\'s span', () => {
    const lanes = recorderLanes(layout, timeScale({ startSeconds: 0, endSeconds: 3 }, 30), { laneHeightPixels: 10, view: { startSeconds: 1, endSeconds: 1.5 } });
    const gap = lanes.lanes[1]!.gaps[0]!;
    expect(gap.x1 - gap.x0).toBeCloseTo(MIN_GAP_PIXELS, 9); // 0.5 s is 5 px here: exactly the minimum
    expect((gap.x0 + gap.x1) / 2).toBeCloseTo(17.5, 9);
    expect(lanes.view).toEqual({ x0: 10, x1: 15 });
  });

  it('places the files through a fitted clock: offset added, drift scaling the time since the recorder\'s first start', () => {
    // B: offset +0.1 s, drift +1000 ppm; its t_start is 0.5 s, so its second file (nominal 2.0 s) moves to 2.0 + 0.1 + 0.001 * 1.5 s
    const lanes = recorderLanes(layout, timeScale({ startSeconds: 0, endSeconds: 3 }, 3000), { laneHeightPixels: 10, clocks: [undefined, { offsetSeconds: 0.1, driftPpm: 1000 }] });
    const b = lanes.lanes[1]!;
    expect(b.bars[0]!.startSeconds).toBeCloseTo(0.6, 12);
    expect(b.bars[1]!.startSeconds).toBeCloseTo(2.1015, 12);
    expect(b.bars[1]!.endSeconds).toBeCloseTo(3.1025, 12);
    expect(b.gaps[0]!.toSeconds - b.gaps[0]!.fromSeconds).toBeCloseTo(0.5005, 12);
    expect(lanes.lanes[0]!.bars[1]!.startSeconds).toBe(1); // no fit for A: its stamps
  });
});

describe('formatGapLength()', () => {
  it('writes milliseconds, seconds, minutes and hours as a field worker reads them', () => {
    expect(formatGapLength(0.0042)).toBe('4.2 ms');
    expect(formatGapLength(0.85)).toBe('850 ms');
    expect(formatGapLength(2)).toBe('2.00 s');
    expect(formatGapLength(82.04)).toBe('82.0 s');
    expect(formatGapLength(600)).toBe('10.0 min');
    expect(formatGapLength(3 * 3600 + 125)).toBe('3 h 02 min');
  });
});

describe('viewCentredOn()', () => {
  it('centres the view on the time clicked, keeping its length, and stays within the deployment', () => {
    expect(viewCentredOn({ startSeconds: 0, endSeconds: 10 }, 50, 100)).toEqual({ startSeconds: 45, endSeconds: 55 });
    expect(viewCentredOn({ startSeconds: 0, endSeconds: 10 }, 98, 100)).toEqual({ startSeconds: 90, endSeconds: 100 });
    expect(viewCentredOn({ startSeconds: 20, endSeconds: 30 }, 1, 100)).toEqual({ startSeconds: 0, endSeconds: 10 });
  });
});

describe('laneHeightPixels()', () => {
  it('keeps 13 px lanes up to 8 recorders and shrinks them for more, never below 6 px', () => {
    expect(laneHeightPixels(6)).toBe(13);
    expect(laneHeightPixels(8)).toBe(13);
    expect(laneHeightPixels(16)).toBe(6);
    expect(laneHeightPixels(40)).toBe(6);
    expect(laneHeightPixels(10)).toBe(10);
  });
});
