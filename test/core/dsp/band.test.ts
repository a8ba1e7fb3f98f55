import { describe, expect, it } from 'vitest';
import { bandEdgeTaperFraction, bandWeights } from '../../../core/dsp';
import { WhenceError } from '../../../core/errors';

describe('bandWeights()', () => {
  it('is 1 inside the band, 0 outside, with raised-cosine edges of 10 % of the width inside the band', () => {
    // definition of the band weights (core/dsp/band.ts): f = k fs / N and a raised-cosine (Hann) taper, common practice
    const { weights, firstBin, lastBin } = bandWeights({ lowHz: 1000, highHz: 3000 }, 8000, 1024);
    const binHz = 8000 / 1024;
    expect(bandEdgeTaperFraction).toBe(0.1);
    for (let k = 0; k <= 512; k++) {
      const f = k * binHz;
      if (f <= 1000 || f >= 3000) expect(weights[k]).toBe(0);
      else if (f >= 1200 && f <= 2800) expect(weights[k]).toBe(1);
      else expect(weights[k]).toBeGreaterThan(0);
    }
    expect(firstBin).toBe(Math.floor(1000 / binHz) + 1);
    expect(lastBin).toBe(Math.ceil(3000 / binHz) - 1);
    // middle of the lower edge: weight 0.5
    const k = Math.round(1100 / binHz);
    expect(weights[k]).toBeCloseTo(0.5 - 0.5 * Math.cos((Math.PI * (k * binHz - 1000)) / 200), 12);
  });

  it('gives 0 to DC and Nyquist for a full band', () => {
    const { weights } = bandWeights({ lowHz: 0, highHz: 4000 }, 8000, 64);
    expect(weights[0]).toBe(0);
    expect(weights[32]).toBe(0); // bin N/2 is Nyquist (f = k fs / N), common practice; zero weight there is this project's choice
  });

  it('writes into a given array of N/2 + 1 bins the same weights as a new one, clearing what was there', () => {
    const into = bandWeights({ lowHz: 100, highHz: 3900 }, 8000, 1024).weights;
    const fresh = bandWeights({ lowHz: 1000, highHz: 3000 }, 8000, 1024);
    const reused = bandWeights({ lowHz: 1000, highHz: 3000 }, 8000, 1024, into);
    expect(reused.weights).toBe(into);
    expect(Array.from(reused.weights)).toEqual(Array.from(fresh.weights));
    expect([reused.firstBin, reused.lastBin]).toEqual([fresh.firstBin, fresh.lastBin]);
    // an array of another length is left alone and a new one made
    const other = new Float64Array(100);
    expect(bandWeights({ lowHz: 1000, highHz: 3000 }, 8000, 1024, other).weights).not.toBe(other);
  });

  it('rejects a band outside 0..fs/2 or inverted', () => {
    expect(() => bandWeights({ lowHz: 3000, highHz: 1000 }, 8000, 64)).toThrow(WhenceError);
    expect(() => bandWeights({ lowHz: 100, highHz: 5000 }, 8000, 64)).toThrow(WhenceError);
    expect(() => bandWeights({ lowHz: -1, highHz: 1000 }, 8000, 64)).toThrow(WhenceError);
  });
});
