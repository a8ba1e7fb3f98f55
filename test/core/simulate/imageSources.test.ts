import { describe, expect, it } from 'vitest';
import {
  eyringRt60Seconds, imageSourcePaths, prepareScene, renderScene, shoeboxRoom, validateScene,
  type SceneRoom, type SceneSource, type SceneSpec,
} from '../../../core/simulate';
import { bandLimitedPeak, distance, mic, RATE, renderWhole } from './simulateHelpers';

const C = 343;
// walls with distinct coefficients, so each first-order image is told apart by its amplitude
const ROOM: SceneRoom = {
  west: { atMeters: 0, reflectionCoefficient: 0.9 }, east: { atMeters: 10, reflectionCoefficient: 0.8 },
  south: { atMeters: 0, reflectionCoefficient: 0.7 }, north: { atMeters: 8, reflectionCoefficient: 0.6 },
  floor: { atMeters: 0, reflectionCoefficient: 0.5 }, ceiling: { atMeters: 4, reflectionCoefficient: 0.4 },
  maxOrder: 1,
};
const SOURCE = { eastMeters: 3, northMeters: 2, upMeters: 1.5 };
const MIC = mic(1, 6.5, 5.3, 1.1);

describe('imageSourcePaths() places images as Allen & Berkley (1979) do', () => {
  it('imageSourcePaths() gives the six first-order images at the mirrored positions, delay r / c and amplitude beta / r', () => {
    // first-order images: the source mirrored in each wall, x -> 2 x_wall - x (Allen & Berkley 1979, eq. 8 with |n - q| + |n| = 1)
    const expected = [
      { at: { ...SOURCE, eastMeters: -3 }, beta: 0.9 },
      { at: { ...SOURCE, eastMeters: 17 }, beta: 0.8 },
      { at: { ...SOURCE, northMeters: -2 }, beta: 0.7 },
      { at: { ...SOURCE, northMeters: 14 }, beta: 0.6 },
      { at: { ...SOURCE, upMeters: -1.5 }, beta: 0.5 },
      { at: { ...SOURCE, upMeters: 6.5 }, beta: 0.4 },
    ];
    const paths = imageSourcePaths(SOURCE, MIC, ROOM, C);
    expect(paths).toHaveLength(6);
    for (const image of expected) {
      const r = distance(image.at, MIC);
      const path = paths.find((p) => Math.abs(p.pathLengthMeters - r) < 1e-9);
      expect(path).toBeDefined();
      expect(path!.order).toBe(1);
      expect(path!.delaySeconds).toBeCloseTo(r / C, 12); // r / c (geometry)
      expect(path!.relativeAmplitude).toBeCloseTo(image.beta / r, 12); // spherical spreading times the wall's coefficient
    }
    const delays = paths.map((p) => p.delaySeconds);
    expect(delays).toEqual([...delays].sort((a, b) => a - b));
  });

  it('imageSourcePaths() gives 6 + 18 images up to order 2 in a closed room, with the wall products of order 2', () => {
    // images of order k in a 3-D shoebox: 4k^2 + 2 (lattice points with |i| + |j| + |k| = k; computed by hand: 6, 18)
    const paths = imageSourcePaths(SOURCE, MIC, { ...ROOM, maxOrder: 2 }, C);
    expect(paths).toHaveLength(24);
    // x' + 2L on the east axis: reflected once by each of west and east (Allen & Berkley 1979: beta_x1^|n-q| beta_x2^|n|, n = 1, q = 0)
    const twice = { ...SOURCE, eastMeters: 3 + 20 };
    const path = paths.find((p) => Math.abs(p.pathLengthMeters - distance(twice, MIC)) < 1e-9);
    expect(path!.order).toBe(2);
    expect(path!.relativeAmplitude).toBeCloseTo((0.9 * 0.8) / distance(twice, MIC), 12);
  });

  it('imageSourcePaths() gives only the surface image, with coefficient -1, under a water surface and no bottom', () => {
    const hydrophone = mic(1, 20, 3, -4);
    const source = { eastMeters: 5, northMeters: 9, upMeters: -6 };
    const paths = imageSourcePaths(source, hydrophone, { ceiling: { atMeters: 0, reflectionCoefficient: -1 }, maxOrder: 4 }, 1500);
    expect(paths).toHaveLength(1);
    const image = { ...source, upMeters: 6 }; // mirrored in the surface z = 0 (geometry); pressure-release surface R = -1 (common practice)
    expect(paths[0]!.relativeAmplitude).toBeCloseTo(-1 / distance(image, hydrophone), 12);
    expect(paths[0]!.delaySeconds).toBeCloseTo(distance(image, hydrophone) / 1500, 12);
  });

  it('imageSourcePaths() leaves out images later than maxDelaySeconds and images of a wall with coefficient 0', () => {
    const paths = imageSourcePaths(SOURCE, MIC, { ...ROOM, maxOrder: 6, maxDelaySeconds: 0.03 }, C);
    expect(paths.every((p) => p.delaySeconds <= 0.03)).toBe(true);
    const noEast = imageSourcePaths(SOURCE, MIC, { ...ROOM, east: { atMeters: 10, reflectionCoefficient: 0 } }, C);
    expect(noEast).toHaveLength(5);
  });
});

describe('shoeboxRoom() and eyringRt60Seconds()', () => {
  it('shoeboxRoom() chooses walls whose Eyring reverberation time is the one asked for', () => {
    const room = shoeboxRoom({ lengthEastMeters: 30, widthNorthMeters: 20, heightMeters: 10, rt60Seconds: 2, speedMetersPerSecond: C });
    expect(eyringRt60Seconds(room, C)).toBeCloseTo(2, 10);
    // Eyring (1930) with alpha = 1 - beta^2: T = 0.161 V / (-S ln(1 - alpha)) at 343 m/s (24 ln 10 / 343 = 0.1611; common practice)
    const beta = room.west!.reflectionCoefficient;
    const byHand = (0.16111 * 6000) / (2200 * -Math.log(beta * beta));
    expect(byHand).toBeCloseTo(2, 3);
  });

  it('eyringRt60Seconds() is undefined for an open room and 0 when every wall absorbs all', () => {
    expect(eyringRt60Seconds({ ...ROOM, ceiling: undefined }, C)).toBeUndefined();
    const dead = shoeboxRoom({ lengthEastMeters: 5, widthNorthMeters: 4, heightMeters: 3, rt60Seconds: 1, speedMetersPerSecond: C });
    for (const wall of ['west', 'east', 'south', 'north', 'floor', 'ceiling'] as const) dead[wall] = { ...dead[wall]!, reflectionCoefficient: 0 };
    expect(eyringRt60Seconds(dead, C)).toBe(0);
  });
});

const CLICK: SceneSource = { id: 'tap', kind: 'click', ...SOURCE, emissionTimeSeconds: 0.02, levelDb: 0, peakFrequencyHz: 4000 };

function roomScene(room: SceneRoom | undefined, durationSeconds = 0.25): SceneSpec {
  return { sampleRateHz: RATE, durationSeconds, seed: 5, speedMetersPerSecond: C, microphones: [MIC], sources: [CLICK], ...(room ? { room } : {}) };
}

describe('renderScene() with a room', () => {
  it('renderScene() puts the direct click and each first-order image at emission + r / c with amplitude beta / r', () => {
    const [channel] = renderWhole(roomScene(ROOM));
    const arrivals = [{ r: distance(SOURCE, MIC), gain: 1 }, ...imageSourcePaths(SOURCE, MIC, ROOM, C).map((p) => ({ r: p.pathLengthMeters, gain: p.relativeAmplitude * p.pathLengthMeters }))];
    const samples = arrivals.map((a) => (CLICK.emissionTimeSeconds + a.r / C) * RATE).sort((a, b) => a - b);
    // a 4 kHz Ricker pulse is below 1e-6 of its peak beyond 16 samples: arrivals 32 samples apart do not touch
    for (let i = 1; i < samples.length; i++) expect(samples[i]! - samples[i - 1]!).toBeGreaterThan(32);
    for (const a of arrivals) {
      const at = (CLICK.emissionTimeSeconds + a.r / C) * RATE;
      const sign = Math.sign(a.gain);
      const peak = bandLimitedPeak(sign > 0 ? channel! : channel!.map((x) => -x), Math.round(at) - 8, Math.round(at) + 8);
      expect(Math.abs(peak.index - at)).toBeLessThan(0.05);
      expect((sign * peak.value) / (a.gain / a.r) - 1).toBeCloseTo(0, 3); // Ricker peak 1 at 1 m, times beta / r
    }
  });

  it('renderScene() with every reflection coefficient 0 gives the free field, sample for sample', () => {
    const dead: SceneRoom = { ...ROOM, maxOrder: 3 };
    for (const wall of ['west', 'east', 'south', 'north', 'floor', 'ceiling'] as const) dead[wall] = { ...dead[wall]!, reflectionCoefficient: 0 };
    const [free] = renderWhole(roomScene(undefined));
    const [room] = renderWhole(roomScene(dead));
    expect(Array.from(room!)).toEqual(Array.from(free!));
  });

  it('renderScene() with a diffuse tail decays at the room\'s reverberation time (Schroeder backward integration, T20, within 20 %)', () => {
    const rt60 = 1.0;
    const room = shoeboxRoom({ lengthEastMeters: 12, widthNorthMeters: 9, heightMeters: 4, rt60Seconds: rt60, speedMetersPerSecond: C }, { maxOrder: 6, maxDelaySeconds: 0.04, diffuseTail: true });
    const microphones = [mic(1, 8.1, 6.2, 1.3), mic(2, 11, 1, 3), mic(3, 1, 8, 0.5), mic(4, 6, 4.5, 2)];
    const spec: SceneSpec = { ...roomScene(room, 1.4), microphones };
    const channels = renderWhole(spec);
    // Schroeder (1965) JASA 37:409: the decay curve is the backward integral of the squared impulse response, here summed
    // over four microphones (independent tails) to average out the tail's randomness; T20 fits -5..-25 dB (ISO 3382-1)
    const frames = channels[0]!.length;
    const energy = new Float64Array(frames + 1);
    for (let n = frames - 1; n >= 0; n--) energy[n] = energy[n + 1]! + channels.reduce((sum, channel) => sum + channel[n]! ** 2, 0);
    const start = Math.round(CLICK.emissionTimeSeconds * RATE);
    const db = (n: number) => 10 * Math.log10(energy[n]! / energy[start]!);
    let n5 = start;
    while (db(n5) > -5) n5++;
    let n25 = n5;
    while (db(n25) > -25) n25++;
    let sx = 0, sy = 0, sxx = 0, sxy = 0, count = 0;
    for (let n = n5; n <= n25; n += 16) {
      const t = n / RATE, y = db(n);
      sx += t; sy += y; sxx += t * t; sxy += t * y; count++;
    }
    const slopeDbPerSecond = (count * sxy - sx * sy) / (count * sxx - sx * sx);
    expect(-60 / slopeDbPerSecond / rt60).toBeGreaterThan(0.8);
    expect(-60 / slopeDbPerSecond / rt60).toBeLessThan(1.2);
  });

  it('renderScene() with a diffuse tail puts nothing before the direct sound at a microphone farther away than maxDelaySeconds', () => {
    // a corridor 60 m long; the microphone 50 m from the source (146 ms) hears its tail after maxDelaySeconds = 30 ms
    const room = shoeboxRoom({ lengthEastMeters: 60, widthNorthMeters: 6, heightMeters: 4, rt60Seconds: 1, speedMetersPerSecond: C }, { maxOrder: 2, maxDelaySeconds: 0.03, diffuseTail: true });
    const far = mic(1, 53, 3, 1.2);
    const spec: SceneSpec = { ...roomScene(room, 0.6), microphones: [far] };
    const [channel] = renderWhole(spec);
    // a 4 kHz Ricker pulse is below 1e-6 of its peak beyond 16 samples (as above): earlier than that, silence (no background)
    const directSample = (CLICK.emissionTimeSeconds + distance(SOURCE, far) / C) * RATE;
    const before = channel!.subarray(0, Math.floor(directSample) - 16);
    expect(Math.max(...Array.from(before, Math.abs))).toBeLessThan(1e-6 / distance(SOURCE, far));
    // and the tail is there after it
    expect(Math.max(...Array.from(channel!.subarray(Math.ceil(directSample) + 16), Math.abs))).toBeGreaterThan(1e-4);
  });

  it('renderScene() with a diffuse tail gives the same samples bit for bit when rendered in windows', () => {
    const room = shoeboxRoom({ lengthEastMeters: 12, widthNorthMeters: 9, heightMeters: 4, rt60Seconds: 0.5, speedMetersPerSecond: C }, { maxOrder: 3, maxDelaySeconds: 0.03, diffuseTail: true });
    const spec = roomScene(room, 0.6);
    const [whole] = renderWhole(spec);
    const prepared = prepareScene(spec);
    const split = new Float32Array(prepared.frameCount);
    for (const [from, to] of [[0, 1234], [1234, 9000], [9000, prepared.frameCount]] as const) {
      const out = [new Float32Array(to - from)];
      renderScene(prepared, from, to - from, out);
      split.set(out[0]!, from);
    }
    expect(Array.from(split)).toEqual(Array.from(whole!));
    const [again] = renderWhole({ ...spec, seed: 6 });
    expect(Array.from(again!)).not.toEqual(Array.from(whole!));
  });
});

describe('validateScene() checks a room', () => {
  const bad: Array<[string, (s: SceneSpec) => void, RegExp]> = [
    ['a room with a ground plane', (s) => { s.groundUpMeters = 0; }, /give the room a floor/],
    ['a source outside the walls', (s) => { s.sources[0]!.eastMeters = 11; }, /sources\[0\]\.eastMeters must lie between/],
    ['walls the wrong way round', (s) => { s.room!.east = { atMeters: -1, reflectionCoefficient: 0.5 }; }, /room\.east\.atMeters/],
    ['a coefficient of 1.2', (s) => { s.room!.floor = { atMeters: 0, reflectionCoefficient: 1.2 }; }, /room\.floor\.reflectionCoefficient/],
    ['an order of 40', (s) => { s.room!.maxOrder = 40; }, /room\.maxOrder/],
    ['a tail in an open room', (s) => { s.room!.ceiling = undefined; s.room!.diffuseTail = true; s.room!.maxDelaySeconds = 0.05; }, /needs all six walls/],
    ['a tail without maxDelaySeconds', (s) => { s.room!.diffuseTail = true; }, /needs room\.maxDelaySeconds/],
  ];
  it.each(bad)('validateScene() refuses %s, naming the field', (_, change, message) => {
    const spec = JSON.parse(JSON.stringify(roomScene(ROOM))) as SceneSpec;
    change(spec);
    expect(() => validateScene(spec)).toThrow(message);
  });
});
