import { describe, expect, it } from 'vitest';
import { measurePairs } from '../../../core/pipeline/measurePairs';
import { whiteNoise } from '../../helpers/signals';

describe('measurePairs() and the array aperture', () => {
  // Expected: no lag reaches past the window (common practice: a shift of a whole window leaves no overlap), so a 20 km
  // pair in a 0.1 s window is searched to 0.1 s, not to 58 s; a 1 m pair keeps its own limit d/c + margin.
  it('measurePairs() searches no pair past the window, however far apart its microphones are, and still finds a near pair\'s delay', () => {
    const sampleRateHz = 48_000;
    const frames = 4_800;
    const source = whiteNoise(frames + 16, 7);
    // The 1 m pair hears the noise 3 samples apart (microphone 2 later); the far microphone hears unrelated noise.
    const channels = [Float32Array.from(source.subarray(8, 8 + frames)), Float32Array.from(source.subarray(5, 5 + frames)), Float32Array.from(whiteNoise(frames, 11))];
    const microphones = [
      { channel: 1, label: 'a', eastMeters: 0, northMeters: 0, upMeters: 0, surveySigmaMeters: 0 },
      { channel: 2, label: 'b', eastMeters: 1, northMeters: 0, upMeters: 0, surveySigmaMeters: 0 },
      { channel: 3, label: 'far', eastMeters: 20_000, northMeters: 0, upMeters: 0, surveySigmaMeters: 0 },
    ];
    const pairs = measurePairs(channels, microphones, { sampleRateHz, speedMetersPerSecond: 343, weighting: 'phat', bandHz: { lowHz: 200, highHz: 20_000 }, lagMarginSeconds: 1e-4 });
    const windowSeconds = (frames - 1) / sampleRateHz;
    for (const pair of pairs) expect(pair.maxLagSeconds).toBeLessThanOrEqual(windowSeconds + 1e-12);
    const near = pairs.find((pair) => pair.indexA === 0 && pair.indexB === 1)!;
    // 1 m / 343 m/s + 0.1 ms (the pair's own limit, smaller than the window).
    expect(near.maxLagSeconds).toBeCloseTo(1 / 343 + 1e-4, 9);
    // Microphone b hears the noise 3 samples later: the delay a - b is -3 samples (house sign convention).
    expect(near.delaySeconds * sampleRateHz).toBeCloseTo(-3, 1);
  });
});
