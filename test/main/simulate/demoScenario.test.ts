import { describe, expect, it } from 'vitest';
import { encodeFrames, type WavWriteSpec } from '../../../core/audio';
import { speedOfSound } from '../../../core/medium';
import { parseArrayCsv, parseDelaysCsv } from '../../../core/project';
import { prepareScene, renderScene, sceneTruth, validateScene } from '../../../core/simulate';
import { demoArrayCsv, demoArrayLocalCsv, demoDelaysCsv, demoTruthCsv } from '../../../assets/demo/make-demo';
import { DEMO_SCENE, DEMO_SITE, DEMO_SPEED_METERS_PER_SECOND } from '../../../assets/demo/scenario';

// The demo is invented data: these tests check that the script is consistent with itself and deterministic,
// never that any computation is right (design: invented data is for the demo only).

function renderWindowBytes(startFrame: number, frameCount: number): Uint8Array {
  const prepared = prepareScene(DEMO_SCENE);
  const channels = Array.from({ length: prepared.channelCount }, () => new Float32Array(frameCount));
  renderScene(prepared, startFrame, frameCount, channels);
  const spec: WavWriteSpec = { channelCount: prepared.channelCount, sampleRateHz: prepared.sampleRateHz, bitsPerSample: 24, sampleFormat: 'pcm-int', frameCount };
  return encodeFrames(channels, 0, frameCount, spec);
}

describe('the demo scenario (assets/demo)', () => {
  it('the demo scene is a valid 60 s, 48 kHz, six-channel scene with the layout the story tells', () => {
    expect(() => validateScene(DEMO_SCENE)).not.toThrow();
    expect(DEMO_SCENE).toMatchObject({ sampleRateHz: 48000, durationSeconds: 60 });
    const mics = DEMO_SCENE.microphones;
    expect(mics.length).toBe(6);
    for (const m of mics) {
      expect(m.upMeters).toBeGreaterThanOrEqual(1.0);
      expect(m.upMeters).toBeLessThanOrEqual(2.5);
      const nearest = Math.min(...mics.filter((o) => o !== m).map((o) => Math.hypot(o.eastMeters - m.eastMeters, o.northMeters - m.northMeters)));
      expect(nearest).toBeGreaterThan(30);
      expect(nearest).toBeLessThan(60);
    }
    expect(new Set(DEMO_SCENE.sources.map((s) => s.kind))).toEqual(new Set(['fm-call', 'click', 'knock', 'chirp']));
    const barks = DEMO_SCENE.sources.filter((s) => s.id.startsWith('bark'));
    expect(barks.length).toBeGreaterThan(0);
    for (const bark of barks) for (const m of mics) expect(Math.hypot(bark.eastMeters - m.eastMeters, bark.northMeters - m.northMeters)).toBeGreaterThan(150);
    expect(DEMO_SCENE.interference?.length).toBe(1);
    expect(DEMO_SCENE.background?.wind).toBeDefined();
  });

  it('the demo uses the Cramer speed of sound of its morning', () => {
    const expected = speedOfSound({ medium: 'air', temperatureCelsius: 14, relativeHumidityPercent: 85, pressureKilopascals: 100.9 }).speedMetersPerSecond;
    expect(DEMO_SPEED_METERS_PER_SECOND).toBe(expected);
    expect(DEMO_SCENE.speedMetersPerSecond).toBe(expected);
  });

  it('the demo recording cannot clip: the loudest sound reaches no microphone above -20 dBFS, reflection included', () => {
    for (const source of sceneTruth(DEMO_SCENE).sources) {
      for (const arrival of source.arrivals) expect(arrival.amplitude + (arrival.reflection?.amplitude ?? 0)).toBeLessThan(0.1);
    }
  });

  it('two renderings of a demo window give identical bytes, and the window holds the first frog call above the noise', () => {
    const start = Math.round(4.4 * 48000);
    const count = 24_000;
    const first = renderWindowBytes(start, count);
    const second = renderWindowBytes(start, count);
    expect(Buffer.from(first).equals(Buffer.from(second))).toBe(true);
    const split = new Uint8Array(first.length);
    split.set(renderWindowBytes(start, 7001), 0);
    split.set(renderWindowBytes(start + 7001, count - 7001), 7001 * 18);
    expect(Buffer.from(split).equals(Buffer.from(first))).toBe(true);
    // The call stands out of the noise in the first difference x[n] - x[n-1], a crude high-pass that keeps the wind out.
    const prepared = prepareScene(DEMO_SCENE);
    const windowAt = (seconds: number) => renderScene(prepared, Math.round(seconds * 48000), 24_000, Array.from({ length: 6 }, () => new Float32Array(24_000)));
    const differenceRms = (x: Float32Array) => Math.sqrt(x.reduce((sum, v, i) => (i === 0 ? 0 : sum + (v - x[i - 1]) ** 2), 0) / (x.length - 1));
    const before = windowAt(3.8);
    const during = windowAt(4.4);
    for (let c = 0; c < 6; c++) expect(differenceRms(during[c])).toBeGreaterThan(3 * differenceRms(before[c]));
  });

  it('the demo array tables give back the scene\'s microphones (WGS84 within 1 mm about the survey origin; local exactly)', () => {
    const geographic = parseArrayCsv(demoArrayCsv(), 'demo-array.csv', DEMO_SITE.origin);
    const local = parseArrayCsv(demoArrayLocalCsv(), 'demo-array-local.csv');
    DEMO_SCENE.microphones.forEach((m, i) => {
      for (const table of [geographic, local]) {
        const read = table.microphones[i];
        expect(read).toMatchObject({ channel: m.channel, label: m.label, surveySigmaMeters: DEMO_SITE.surveySigmaMeters });
        expect(Math.hypot(read.eastMeters - m.eastMeters, read.northMeters - m.northMeters, read.upMeters - m.upMeters)).toBeLessThan(0.001);
      }
    });
    expect(local.warnings).toEqual([]);
  });

  it('the demo delay table holds every pair of every sound, equal to sceneTruth(), readable by the delay parser', () => {
    const events = parseDelaysCsv(demoDelaysCsv(), 'demo-delays.csv', new Set([1, 2, 3, 4, 5, 6]));
    const truth = sceneTruth(DEMO_SCENE);
    expect(events.map((e) => e.event)).toEqual(truth.sources.map((s) => s.id));
    events.forEach((event, s) => {
      expect(event.rows.length).toBe(15);
      event.rows.forEach((row, r) => {
        const pair = truth.sources[s].pairDelays[r];
        expect([row.channelA, row.channelB]).toEqual([pair.channelA, pair.channelB]);
        expect(Math.abs(row.delaySeconds - pair.delaySeconds)).toBeLessThan(1e-9);
        expect(row.sigmaSeconds).toBe(DEMO_SITE.delaySigmaSeconds);
      });
    });
  });

  it('the demo truth table lists every sound with its place and time', () => {
    const lines = demoTruthCsv().trim().split('\n').filter((line) => !line.startsWith('#'));
    expect(lines[0]).toBe('id,kind,x_m,y_m,z_m,emission_s,lat,lon,alt_m');
    expect(lines.length - 1).toBe(DEMO_SCENE.sources.length);
    const frog = lines.find((line) => line.startsWith('frog-a1,'))!.split(',');
    expect(frog.slice(0, 6)).toEqual(['frog-a1', 'fm-call', '8', '6', '0.05', '4.5']);
  });
});
