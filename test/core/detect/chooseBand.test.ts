import { describe, expect, it } from 'vitest';
import { chooseBand } from '../../../core/detect';
import { WhenceError } from '../../../core/errors';
import { callShape, knockShape, renderScene, sweepShape, type SceneOptions, type SoundShape } from '../../helpers/detectSignals';

// Three microphones 1 m apart, the source 10 m away (amplitude as given), pink background noise plus a little white.
const microphones: Array<readonly [number, number]> = [[0, 0], [0, 1], [1, 0]];
const pinkBackground = { pinkRms: 0.01, whiteRms: 0.0002 };

/** A 0.4 s window around the sound (as the detector would give) and 1 s of background from elsewhere. */
function eventAndNoise(sampleRateHz: number, shape: SoundShape | null, amplitude: number, extra: Partial<SceneOptions> = {}) {
  const base: SceneOptions = { sampleRateHz, durationSeconds: 1, microphones, seed: 3, ...pinkBackground, ...extra };
  const noise = renderScene(base);
  const event = renderScene({
    ...base,
    durationSeconds: 0.4,
    seed: 4,
    sounds: shape ? [{ shape, emitSeconds: 0.1 - 10 / 343, source: [10, 0], amplitude }] : [],
  });
  return { event, noise };
}

describe('chooseBand()', () => {
  // Expected values: the bands the synthesis used (invented scenes from test/helpers/detectSignals), widened by the bin width and smoothing; defaults and messages are what this project specifies.
  it('picks about 2-6 kHz for a call sweeping 2.2-5.8 kHz', () => {
    const { event, noise } = eventAndNoise(48000, callShape(), 0.03);
    const band = chooseBand(event, noise, 48000);
    expect(band.basis).toBe('spectrum');
    // the call's band by construction (2.2-5.8 kHz), give or take smoothing (±6 %) and a bin of 47 Hz
    expect(band.lowHz).toBeGreaterThan(1800);
    expect(band.lowHz).toBeLessThan(2500);
    expect(band.highHz).toBeGreaterThan(5500);
    expect(band.highHz).toBeLessThan(6500);
    expect(band.snrDb).toBeGreaterThan(10);
  });

  it('picks a high band for a 1 ms underwater-like click sweeping 8-20 kHz, sampled at 96 kHz', () => {
    const { event, noise } = eventAndNoise(96000, sweepShape(8000, 20000, 0.001, 0.0001), 0.03);
    const band = chooseBand(event, noise, 96000);
    expect(band.basis).toBe('spectrum');
    // by construction 8-20 kHz; short segments (2.7 ms, 375 Hz bins) blur the edges by a bin or two
    expect(band.lowHz).toBeGreaterThan(7000);
    expect(band.lowHz).toBeLessThan(10000);
    expect(band.highHz).toBeGreaterThan(18000);
    expect(band.highHz).toBeLessThan(22000);
  });

  it('picks a low band for a knock between 120 and 780 Hz', () => {
    const { event, noise } = eventAndNoise(48000, knockShape(), 0.1);
    const band = chooseBand(event, noise, 48000);
    expect(band.basis).toBe('spectrum');
    // by construction 120-780 Hz; the 4 ms ramps spread it a little beyond its ends
    expect(band.lowHz).toBeLessThan(250);
    expect(band.highHz).toBeGreaterThan(700);
    expect(band.highHz).toBeLessThan(1100);
  });

  it('returns the whole usable range, marked default, when nothing stands above the background', () => {
    const { event, noise } = eventAndNoise(48000, null, 0);
    const band = chooseBand(event, noise, 48000);
    expect(band.basis).toBe('default');
    expect(band.highHz).toBeCloseTo(0.45 * 48000, 9); // default upper end: 0.45 fs
    expect(band.snrDb).toBeLessThan(1);
  });

  it('does not choose a steady whistle that is in the background as well', () => {
    const tone = { tones: [{ frequencyHz: 3000, amplitude: 0.05 }] };
    const { event, noise } = eventAndNoise(48000, null, 0, tone);
    expect(chooseBand(event, noise, 48000).basis).toBe('default');
  });

  it('keeps within lowestHz and highestHz', () => {
    const { event, noise } = eventAndNoise(48000, callShape(), 0.03);
    const band = chooseBand(event, noise, 48000, { lowestHz: 3000, highestHz: 5000 });
    expect(band.lowHz).toBeGreaterThanOrEqual(3000);
    expect(band.highHz).toBeLessThanOrEqual(5000);
  });

  it('rejects missing channels and stretches shorter than a segment', () => {
    const { event, noise } = eventAndNoise(48000, null, 0);
    expect(() => chooseBand([], noise, 48000)).toThrow(/at least one channel/);
    expect(() => chooseBand(event, [new Float32Array(10)], 48000)).toThrow(/at least 64 frames/);
    expect(() => chooseBand(event, noise, Number.NaN)).toThrow(WhenceError);
  });
});
