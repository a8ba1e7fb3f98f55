import { describe, expect, it } from 'vitest';
import { CHANNEL_GATE_LEAD_SECONDS, CHANNEL_GATE_SECONDS, DIRECT_PART_SECONDS, GATE_LEAD_SECONDS, gateChannels, LONG_CHANNEL_GATE, onsetGatedSpan, SHORT_CHANNEL_GATE, soundsReverberant, startsSharply, taperWindow } from '../../../core/pipeline/onsetGate';

describe('onsetGatedSpan()', () => {
  it('onsetGatedSpan() runs from the earliest onset less the lead-in to the latest onset plus the direct part', () => {
    const span = onsetGatedSpan([1.03, 1.0, 1.015], 0.05)!;
    expect(span.startSeconds).toBeCloseTo(1.0 - GATE_LEAD_SECONDS, 12);
    expect(span.endSeconds).toBeCloseTo(1.03 + DIRECT_PART_SECONDS + GATE_LEAD_SECONDS, 12);
  });

  it('onsetGatedSpan() reaches the array\'s largest delay past the earliest onset when a microphone did not trigger', () => {
    const span = onsetGatedSpan([1.0, undefined, 1.01], 0.05)!;
    expect(span.endSeconds).toBeCloseTo(1.0 + 0.05 + DIRECT_PART_SECONDS + GATE_LEAD_SECONDS, 12);
    expect(onsetGatedSpan([undefined, undefined], 0.05)).toBeUndefined();
  });
});

describe('gateChannels() and taperWindow()', () => {
  it('gateChannels() keeps each channel from its own onset less the lead-in to the gate\'s end, zero elsewhere', () => {
    const fs = 1000;
    const channels = [new Float32Array(200).fill(1), new Float32Array(200).fill(1), new Float32Array(200).fill(1)];
    gateChannels(channels, 200, 10, [10.05, 10.1, undefined], fs);
    const first = Math.round((0.05 - CHANNEL_GATE_LEAD_SECONDS) * fs);
    const last = Math.round((0.05 + CHANNEL_GATE_SECONDS) * fs);
    expect(channels[0]![first - 1]).toBe(0);
    expect(channels[0]![Math.round(0.05 * fs)]).toBe(1);
    expect(channels[0]![last]).toBe(0);
    expect(channels[1]![Math.round(0.05 * fs)]).toBe(0); // before the second channel's own gate
    expect(channels[1]![Math.round(0.1 * fs)]).toBe(1);
    expect(channels[2]!.every((v) => v === 1)).toBe(true); // no onset: left whole
  });

  it('gateChannels() with the short gate keeps only the first milliseconds after each onset, and inside the long gate gives the same', () => {
    const fs = 48_000;
    const onsets = [10.05, 10.08];
    const alone = [new Float32Array(9600).fill(1), new Float32Array(9600).fill(1)];
    gateChannels(alone, 9600, 10, onsets, fs, SHORT_CHANNEL_GATE);
    onsets.forEach((onset, c) => {
      const at = Math.round((onset - 10) * fs);
      expect(alone[c]![at - Math.round(SHORT_CHANNEL_GATE.leadSeconds * fs) - 1]).toBe(0);
      expect(alone[c]![at]).toBe(1);
      expect(alone[c]![at + Math.round(SHORT_CHANNEL_GATE.lengthSeconds * fs)]).toBe(0);
    });
    // 6 ms in all (geometry: a wall 3 m to the side of the path sends an echo that trails the direct sound at 10 m by about 2 h^2 / r = 1.8 m, 5 ms)
    expect(SHORT_CHANNEL_GATE.leadSeconds + SHORT_CHANNEL_GATE.lengthSeconds).toBeLessThanOrEqual(0.006);
    const nested = [new Float32Array(9600).fill(1), new Float32Array(9600).fill(1)];
    gateChannels(nested, 9600, 10, onsets, fs, LONG_CHANNEL_GATE);
    gateChannels(nested, 9600, 10, onsets, fs, SHORT_CHANNEL_GATE);
    for (let c = 0; c < 2; c++) for (let i = 0; i < 9600; i++) expect(nested[c]![i]).toBeCloseTo(alone[c]![i]!, 6);
  });

  it('taperWindow() ramps both ends from near 0 to 1 (raised cosine) and leaves the middle alone', () => {
    const channel = new Float32Array(2000).fill(1);
    taperWindow([channel], 2000, 48_000);
    expect(channel[0]).toBeLessThan(0.01);
    expect(channel[1999]).toBeLessThan(0.01);
    expect(channel[1000]).toBe(1);
  });
});

describe('startsSharply()', () => {
  // invented test signals: a 3 kHz tone burst that starts at full level (a click's body) or swells linearly over 20 ms (a call)
  const fs = 48_000;
  const burst = (riseSeconds: number, onsetSeconds: number): Float32Array => {
    const x = new Float32Array(4800);
    const start = Math.round(onsetSeconds * fs);
    for (let i = start; i < x.length; i++) {
      const t = (i - start) / fs;
      x[i] = Math.min(1, riseSeconds > 0 ? t / riseSeconds : 1) * Math.sin(2 * Math.PI * 3000 * t);
    }
    return x;
  };

  it('startsSharply() is true when most channels reach their level within the short gate, false for a sound that swells', () => {
    const onsets = [0.02, 0.025, 0.03];
    expect(startsSharply(onsets.map((o) => burst(0, o)), 4800, 0, onsets, fs)).toBe(true);
    expect(startsSharply(onsets.map((o) => burst(0.02, o)), 4800, 0, onsets, fs)).toBe(false);
    // two of three swell: not sharp; a channel without an onset does not count
    expect(startsSharply([burst(0, 0.02), burst(0.02, 0.025), burst(0.02, 0.03)], 4800, 0, onsets, fs)).toBe(false);
    expect(startsSharply([burst(0, 0.02), burst(0, 0.025), burst(0.02, 0.03)], 4800, 0, [0.02, 0.025, undefined], fs)).toBe(true);
  });
});

describe('soundsReverberant()', () => {
  it('soundsReverberant() is true when the event rings on well after its last onset, false for a sound that ends', () => {
    expect(soundsReverberant(3.0, [1.0, 1.02], 0.05)).toBe(true);
    expect(soundsReverberant(1.2, [1.0, 1.02], 0.05)).toBe(false);
  });
});
