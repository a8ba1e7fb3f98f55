import { describe, expect, it } from 'vitest';
import { defaultDetectionBand } from '../../../core/detect';
import { resolveDetectorConfig } from '../../../core/detect/config';

describe('resolveDetectorConfig()', () => {
  // Expected values: the defaults this project specifies (frame, hop, window lengths, 0.45 fs upper edge), converted to hops by hand; no outside reference.
  it.each([
    [1, 1],
    [2, 2],
    [3, 3],
    [4, 3],
    [5, 3],
    [8, 4],
    [16, 8],
  ])('asks %i channels for %i to agree by default: min(n, max(3, ceil(n/2)))', (channelCount, expected) => {
    expect(resolveDetectorConfig({ sampleRateHz: 48000, channelCount, maxArrayDelaySeconds: 0.1 }).minChannels).toBe(expected);
  });

  it('turns seconds into hops of a quarter frame', () => {
    const resolved = resolveDetectorConfig({ sampleRateHz: 48000, channelCount: 4, maxArrayDelaySeconds: 0.1 });
    expect(resolved.hopFrames).toBe(60); // 5 ms frame / 4 at 48 kHz
    expect(resolved.floorBlockHops).toBe(40); // 50 ms levels
    expect(resolved.floorWindowBlocks).toBe(80); // 4 s window
    expect(resolved.initialHops).toBe(800); // 1 s
    expect(resolved.spanHops).toBe(88); // ceil((0.1 + 0.01) / 0.00125)
    expect(resolved.mergeGapHops).toBe(80);
    expect(resolved.maxEventHops).toBe(2400);
    expect(resolved.releaseDb).toBe(4);
  });

  it('leaves wind rumble out of the default band and stays below 0.45 fs', () => {
    expect(defaultDetectionBand(48000)).toEqual({ lowHz: 200, highHz: 16000 });
    expect(defaultDetectionBand(16000)).toEqual({ lowHz: 200, highHz: 7200 });
    expect(() => resolveDetectorConfig({ sampleRateHz: 400, channelCount: 1, maxArrayDelaySeconds: 0 })).toThrow(/detection band/);
  });
});
