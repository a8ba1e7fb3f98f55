import { describe, expect, it } from 'vitest';
import { CHANNEL_GATE_LEAD_SECONDS, CHANNEL_GATE_SECONDS, DIRECT_PART_SECONDS, GATE_LEAD_SECONDS, gateChannels, onsetGatedSpan, soundsReverberant, taperWindow } from '../../../core/pipeline/onsetGate';

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

  it('taperWindow() ramps both ends from near 0 to 1 (raised cosine) and leaves the middle alone', () => {
    const channel = new Float32Array(2000).fill(1);
    taperWindow([channel], 2000, 48_000);
    expect(channel[0]).toBeLessThan(0.01);
    expect(channel[1999]).toBeLessThan(0.01);
    expect(channel[1000]).toBe(1);
  });
});

describe('soundsReverberant()', () => {
  it('soundsReverberant() is true when the event rings on well after its last onset, false for a sound that ends', () => {
    expect(soundsReverberant(3.0, [1.0, 1.02], 0.05)).toBe(true);
    expect(soundsReverberant(1.2, [1.0, 1.02], 0.05)).toBe(false);
  });
});
