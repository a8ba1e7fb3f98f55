import { describe, expect, it } from 'vitest';
import { sceneTruth, type SceneSource, type SceneSpec } from '../../../core/simulate';
import { distance, mic, RATE, renderWhole } from './simulateHelpers';

const MICS = [mic(3, 40, 0, 1.5), mic(1, 0, 0, 1.2), mic(2, 20, 35, 2.5), mic(4, -10, 30, 1.0)];
const SOURCES: SceneSource[] = [
  { id: 'inside', kind: 'click', eastMeters: 14, northMeters: 12, upMeters: 0.3, emissionTimeSeconds: 0.1, levelDb: -3, peakFrequencyHz: 3000 },
  { id: 'far', kind: 'fm-call', eastMeters: -150, northMeters: 220, upMeters: 1, emissionTimeSeconds: 0.2, levelDb: 0, durationSeconds: 0.1, startFrequencyHz: 700, endFrequencyHz: 500 },
];
const SPEC: SceneSpec = { sampleRateHz: RATE, durationSeconds: 1.5, speedMetersPerSecond: 340, microphones: MICS, groundUpMeters: 0, reflectionCoefficient: 0.7, sources: SOURCES };

describe('sceneTruth()', () => {
  const truth = sceneTruth(SPEC);

  it('sceneTruth() gives every arrival at emission + r/c, in channel order', () => {
    expect(truth).toMatchObject({ sampleRateHz: RATE, frameCount: 72000, durationSeconds: 1.5, speedMetersPerSecond: 340 });
    truth.sources.forEach((source, s) => {
      expect(source.arrivals.map((a) => a.channel)).toEqual([1, 2, 3, 4]);
      for (const arrival of source.arrivals) {
        const m = MICS.find((x) => x.channel === arrival.channel)!;
        // geometry: straight-line distance over the speed of sound (common practice)
        expect(arrival.distanceMeters).toBeCloseTo(distance(SOURCES[s], m), 12);
        expect(arrival.arrivalTimeSeconds).toBeCloseTo(SOURCES[s].emissionTimeSeconds + distance(SOURCES[s], m) / 340, 14);
        expect(arrival.amplitude).toBeCloseTo(10 ** (SOURCES[s].levelDb / 20) / distance(SOURCES[s], m), 14);
        expect(arrival.label).toBe(m.label);
      }
    });
  });

  it('sceneTruth() gives the reflection through the source mirrored across the ground plane', () => {
    const source = SOURCES[0];
    const image = { ...source, upMeters: -source.upMeters };
    for (const arrival of truth.sources[0].arrivals) {
      const m = MICS.find((x) => x.channel === arrival.channel)!;
      // image source (geometry): path length = distance from the mirrored source
      expect(arrival.reflection!.pathLengthMeters).toBeCloseTo(distance(image, m), 12);
      expect(arrival.reflection!.arrivalTimeSeconds).toBeCloseTo(source.emissionTimeSeconds + distance(image, m) / 340, 14);
      expect(arrival.reflection!.amplitude).toBeCloseTo((0.7 * 10 ** (-3 / 20)) / distance(image, m), 14);
    }
  });

  it('sceneTruth() pair delays are arrival at a minus arrival at b, close around triangles and stay within d_ab / c', () => {
    for (const source of truth.sources) {
      expect(source.pairDelays.length).toBe(6);
      const arrivalAt = new Map(source.arrivals.map((a) => [a.channel, a.arrivalTimeSeconds]));
      const delay = new Map(source.pairDelays.map((p) => [`${p.channelA}-${p.channelB}`, p.delaySeconds]));
      for (const pair of source.pairDelays) {
        expect(pair.channelA).toBeLessThan(pair.channelB);
        expect(pair.delaySeconds).toBe(arrivalAt.get(pair.channelA)! - arrivalAt.get(pair.channelB)!);
        const a = MICS.find((m) => m.channel === pair.channelA)!;
        const b = MICS.find((m) => m.channel === pair.channelB)!;
        // |tau_ab| <= d_ab / c (check-values.md, TDOA geometry)
        expect(Math.abs(pair.delaySeconds)).toBeLessThanOrEqual(distance(a, b) / 340 + 1e-15);
      }
      // closure tau_12 + tau_23 + tau_31 = 0 (check-values.md: definition of TDOA)
      expect(delay.get('1-2')! + delay.get('2-3')! - delay.get('1-3')!).toBeCloseTo(0, 15);
      expect(delay.get('2-4')! - delay.get('3-4')! - delay.get('2-3')!).toBeCloseTo(0, 15);
    }
  });

  it('sceneTruth() says when each sound is heard, and the rendered recording is silent before that', () => {
    const quiet = { ...SPEC, groundUpMeters: undefined, reflectionCoefficient: undefined };
    const channels = renderWhole(quiet);
    const far = sceneTruth(quiet).sources[1];
    expect([far.waveformStartSeconds, far.waveformEndSeconds]).toEqual([0, 0.1]);
    for (const arrival of far.arrivals) {
      const x = channels[arrival.channel - 1];
      const first = Math.ceil(arrival.heardFromSeconds * RATE);
      const clickEnds = Math.ceil(sceneTruth(quiet).sources[0].arrivals[arrival.channel - 1].heardUntilSeconds * RATE);
      expect(first).toBeGreaterThan(clickEnds);
      expect(x.subarray(clickEnds, first).every((v) => v === 0)).toBe(true);
      expect(x.subarray(first, first + 96).some((v) => v !== 0)).toBe(true);
      expect(arrival.heardUntilSeconds - arrival.heardFromSeconds).toBeCloseTo(0.1, 12);
    }
  });

  it('sceneTruth() rejects a scene it could not render, naming the field', () => {
    expect(() => sceneTruth({ ...SPEC, speedMetersPerSecond: 0 })).toThrow(/speedMetersPerSecond/);
  });
});
