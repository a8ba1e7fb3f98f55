import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { NOISE_TILE_FRAMES, prepareScene, renderScene, type SceneSource, type SceneSpec } from '../../../core/simulate';
import { bandLimitedPeak, distance, mic, phaseSlopeDelaySamples, RATE, renderWhole } from './simulateHelpers';

const C = 343;
const MICS = [mic(1, 0, 0, 1.5), mic(2, 40, 3, 1.2), mic(3, 37.3, 41.7, 2.4), mic(4, -5.2, 35.1, 1.0), mic(5, 18.9, -22.4, 1.8), mic(6, -31.6, 12.3, 2.2)];

function quietScene(sources: SceneSource[], extra: Partial<SceneSpec> = {}): SceneSpec {
  return { sampleRateHz: RATE, durationSeconds: 0.6, speedMetersPerSecond: C, microphones: MICS, sources, ...extra };
}

const CLICK: SceneSource = { id: 'knock', kind: 'click', eastMeters: 12.34, northMeters: 17.89, upMeters: 2.7, emissionTimeSeconds: 0.05, levelDb: 0, peakFrequencyHz: 4000 };

describe('renderScene() delays, spreading and the ground reflection', () => {
  it('renderScene() puts a click\'s peak at emission + r/c at every microphone, within 0.05 sample', () => {
    const channels = renderWhole(quietScene([CLICK]));
    MICS.forEach((m, c) => {
      // r / c: geometry (common practice); the peak of the band-limited (sinc) interpolant of the rendered samples
      const expectedSamples = (CLICK.emissionTimeSeconds + distance(CLICK, m) / C) * RATE;
      const peak = bandLimitedPeak(channels[c]);
      expect(Math.abs(peak.index - expectedSamples)).toBeLessThan(0.05);
    });
  });

  it('renderScene() spreads as 1/r: the click peak is 10^(L/20) / r, so peaks at two distances are in the ratio r2/r1', () => {
    const source: SceneSource = { ...CLICK, levelDb: -6 };
    const channels = renderWhole(quietScene([source]));
    const peaks = MICS.map((_, c) => bandLimitedPeak(channels[c]).value);
    MICS.forEach((m, c) => {
      // spherical spreading, amplitude 1/r re 1 m (common practice); levelDb is the peak at 1 m (sceneTypes.ts)
      expect(peaks[c] / (10 ** (-6 / 20) / distance(source, m)) - 1).toBeCloseTo(0, 4);
    });
    expect(peaks[0] / peaks[2]).toBeCloseTo(distance(source, MICS[2]) / distance(source, MICS[0]), 4);
  });

  it('renderScene() adds the ground reflection at the path length through the mirrored source, times the reflection coefficient', () => {
    const source: SceneSource = { ...CLICK, upMeters: 6.2 };
    const ground = 0.4;
    const coefficient = 0.55;
    const channels = renderWhole(quietScene([source], { groundUpMeters: ground, reflectionCoefficient: coefficient }));
    MICS.forEach((m, c) => {
      // image source: the source mirrored across the plane z = ground (geometry)
      const image = { ...source, upMeters: 2 * ground - source.upMeters };
      const direct = (source.emissionTimeSeconds + distance(source, m) / C) * RATE;
      const reflected = (source.emissionTimeSeconds + distance(image, m) / C) * RATE;
      expect(reflected - direct).toBeGreaterThan(32); // apart: a 4 kHz Ricker pulse is below 1e-6 of its peak beyond 16 samples
      const second = bandLimitedPeak(channels[c], Math.round(direct) + 16, channels[c].length);
      expect(Math.abs(second.index - reflected)).toBeLessThan(0.05);
      expect(second.value / (coefficient / distance(image, m)) - 1).toBeCloseTo(0, 3);
    });
  });

  it.each([
    { id: 'frog', kind: 'fm-call', durationSeconds: 0.2, startFrequencyHz: 1500, endFrequencyHz: 2600, bendHz: 400, harmonicLevelsDb: [-6, -12, -18], vibratoRateHz: 30, vibratoDepthHz: 60 },
    { id: 'thump', kind: 'knock', frequencyHz: 240, decaySeconds: 0.02 },
    { id: 'sweep', kind: 'chirp', startFrequencyHz: 400, endFrequencyHz: 9000, durationSeconds: 0.15, sweep: 'exponential' },
    { id: 'wood', kind: 'click', peakFrequencyHz: 2500, ringFrequencyHz: 1100, ringDecaySeconds: 0.004, ringLevelDb: -3 },
  ] as const)('renderScene() delays a $kind by r/c to within 1 % of a sample between every microphone and the first', (kindFields) => {
    const source = { ...kindFields, eastMeters: 7.7, northMeters: 21.3, upMeters: 0.9, emissionTimeSeconds: 0.1, levelDb: 0 } as SceneSource;
    const channels = renderWhole(quietScene([source]));
    const arrival = MICS.map((m) => (source.emissionTimeSeconds + distance(source, m) / C) * RATE);
    for (let c = 1; c < MICS.length; c++) {
      const expected = arrival[c] - arrival[0]; // geometry: (r_c - r_1) / c in samples
      const estimated = phaseSlopeDelaySamples(channels[0], channels[c], 2048, 16384, Math.round(expected));
      expect(Math.abs(estimated - expected)).toBeLessThan(0.01);
    }
  });

  it('renderScene() gives a silent recording when the scene has nothing in it', () => {
    const [first] = renderWhole(quietScene([]));
    expect(first.every((x) => x === 0)).toBe(true);
  });

  it('renderScene() renders only the part of a sound inside the recording when it starts before or ends after it', () => {
    const early: SceneSource = { ...CLICK, id: 'early', emissionTimeSeconds: -0.05 - distance(CLICK, MICS[0]) / C };
    const spec = quietScene([early]);
    const channels = renderWhole(spec);
    // the pulse peaks 0.05 s before the first frame at M1: its tail (< 1e-9 after 0.4 ms) leaves the recording silent there
    expect(Math.max(...channels[0].map(Math.abs))).toBeLessThan(1e-9);
  });
});

/** A scene with every kind of content: noise (pink), gusty wind, a hum with a bearing, every source kind, a ground plane. */
function busyScene(durationSeconds: number): SceneSpec {
  return {
    sampleRateHz: RATE, durationSeconds, seed: 99, speedMetersPerSecond: C, microphones: MICS.slice(0, 3), groundUpMeters: 0, reflectionCoefficient: 0.6,
    background: { noiseLevelDb: -50, noiseColor: 'pink', wind: { levelDb: -40, cornerHz: 40, gustDepthDb: 6 } },
    interference: [{ kind: 'hum', id: 'pump', fundamentalHz: 97.3, levelDb: -45, harmonicLevelsDb: [-6, -12], bearingDegrees: 200 }, { kind: 'hum', id: 'mains', fundamentalHz: 50, levelDb: -60 }],
    sources: [
      { id: 'a', kind: 'fm-call', eastMeters: 5, northMeters: 5, upMeters: 0.1, emissionTimeSeconds: 0.2, levelDb: -10, durationSeconds: 0.25, startFrequencyHz: 2000, endFrequencyHz: 2500, harmonicLevelsDb: [-6], pulseRateHz: 30 },
      { id: 'b', kind: 'click', eastMeters: 25, northMeters: 10, upMeters: 3, emissionTimeSeconds: 1.36, levelDb: -10, peakFrequencyHz: 3000, ringFrequencyHz: 900, ringDecaySeconds: 0.005, ringLevelDb: -6 },
      { id: 'c', kind: 'knock', eastMeters: -10, northMeters: 20, upMeters: 0.5, emissionTimeSeconds: 1.365, levelDb: -10, frequencyHz: 300, decaySeconds: 0.04 },
      { id: 'd', kind: 'chirp', eastMeters: 60, northMeters: -20, upMeters: 1, emissionTimeSeconds: durationSeconds - 0.2, levelDb: -10, startFrequencyHz: 300, endFrequencyHz: 3000, durationSeconds: 0.4 },
    ],
  };
}

function renderInWindows(spec: SceneSpec, cuts: number[]): Float32Array[] {
  const prepared = prepareScene(spec);
  const whole = Array.from({ length: prepared.channelCount }, () => new Float32Array(prepared.frameCount));
  const bounds = [0, ...cuts.filter((cut) => cut > 0 && cut < prepared.frameCount).sort((a, b) => a - b), prepared.frameCount];
  for (let i = 0; i + 1 < bounds.length; i++) {
    const count = bounds[i + 1] - bounds[i];
    const window = Array.from({ length: prepared.channelCount }, () => new Float32Array(count));
    renderScene(prepared, bounds[i], count, window);
    window.forEach((channel, c) => whole[c].set(channel, bounds[i]));
  }
  return whole;
}

function sameBits(a: Float32Array[], b: Float32Array[]): boolean {
  return a.length === b.length && a.every((channel, c) => {
    const x = new Uint32Array(channel.buffer, channel.byteOffset, channel.length);
    const y = new Uint32Array(b[c].buffer, b[c].byteOffset, b[c].length);
    return x.length === y.length && x.every((value, i) => value === y[i]);
  });
}

describe('renderScene() is deterministic and split-invariant', () => {
  const spec = busyScene(3.2);
  const whole = renderWhole(spec);

  it('renderScene() gives the same samples bit for bit for windows split at tile edges, across them and one frame long', () => {
    const tile = NOISE_TILE_FRAMES;
    expect(whole[0].length).toBeGreaterThan(2 * tile); // the recording spans three noise tiles
    for (const cuts of [[1], [tile - 1, tile, tile + 1], [4095, 48000, 48001, 100_000, tile * 2 + 17], Array.from({ length: 40 }, (_, i) => 3700 * i + 11)]) {
      expect(sameBits(renderInWindows(spec, cuts), whole)).toBe(true);
    }
  });

  it('renderScene() gives the same samples bit for bit for any random split (fast-check)', () => {
    const short = busyScene(1.5);
    const reference = renderWhole(short);
    fc.assert(fc.property(fc.array(fc.integer({ min: 1, max: 71_999 }), { maxLength: 12 }), (cuts) => sameBits(renderInWindows(short, cuts), reference)), { numRuns: 25, seed: 42 });
  });

  it('renderScene() renders a window the same after other windows, and from a SceneSpec as from a PreparedScene', () => {
    const prepared = prepareScene(spec);
    const window = () => Array.from({ length: 3 }, () => new Float32Array(5000));
    const first = renderScene(prepared, 70_000, 5000, window());
    renderScene(prepared, 150_000, 3000, window());
    renderScene(prepared, 0, 10, window());
    const again = renderScene(prepared, 70_000, 5000, window());
    const fromSpec = renderScene(spec, 70_000, 5000, window());
    expect(sameBits(first, again)).toBe(true);
    expect(sameBits(first, fromSpec)).toBe(true);
    expect(sameBits(first, whole.map((channel) => channel.slice(70_000, 75_000)))).toBe(true);
  });

  it('renderScene() changes every sample of the noise with the seed, and nothing else', () => {
    const other = renderWhole({ ...spec, seed: 100 });
    const quiet = { ...spec, background: undefined, interference: undefined };
    expect(sameBits(renderWhole({ ...quiet, seed: 5 }), renderWhole({ ...quiet, seed: 6 }))).toBe(true);
    let differing = 0;
    for (let i = 0; i < 10_000; i++) if (other[1][i] !== whole[1][i]) differing++;
    expect(differing).toBeGreaterThan(9990);
  });

  it('renderScene() writes into the caller\'s longer arrays from index 0 and leaves the rest alone', () => {
    const prepared = prepareScene(spec);
    const out = Array.from({ length: 3 }, () => new Float32Array(200).fill(7));
    renderScene(prepared, 1000, 100, out);
    expect(Array.from(out[2].subarray(0, 100))).toEqual(Array.from(whole[2].subarray(1000, 1100)));
    expect(out[2][100]).toBe(7);
  });

  it('renderScene() says what is wrong with a window outside the recording or too few outputs', () => {
    const prepared = prepareScene(spec);
    const out = () => Array.from({ length: 3 }, () => new Float32Array(10));
    expect(() => renderScene(prepared, prepared.frameCount - 5, 10, out())).toThrow(/within the recording \(0\.\.153600\)/);
    expect(() => renderScene(prepared, -1, 10, out())).toThrow(/start -1/);
    expect(() => renderScene(prepared, 0, 10, out().slice(0, 2))).toThrow(/2 output arrays for 3 channels/);
    expect(() => renderScene(prepared, 0, 11, out())).toThrow(/channel 1 holds 10 frames/);
  });
});
