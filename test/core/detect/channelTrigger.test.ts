import { describe, expect, it } from 'vitest';
import { ChannelTrigger, noChange, onsetChange, releaseChange } from '../../../core/detect/channelTrigger';

// One sample per hop (hopFrames 1), a frame is four hops, floor 1 per sample: thresholds 10 dB (x10) to call
// an onset, 4 dB (x2.51) to stay on, hangover 3 hops.
function trigger(): ChannelTrigger {
  const t = new ChannelTrigger(1, 10, 4, 3);
  t.setFloor(1);
  return t;
}

describe('ChannelTrigger', () => {
  it('calls an onset when the four-hop frame clears the threshold and dates it back to where the rise began', () => {
    const t = trigger();
    const energies = [1, 1, 1, 1, 1, 1, 3, 8, 30, 60];
    const changes = energies.map((e, hop) => t.step(hop, e, true));
    // frame sums: hop 8 -> 1 + 3 + 8 + 30 = 42 >= 40, the first above 10 x 4
    expect(changes.indexOf(onsetChange)).toBe(8);
    // hop 8 is the first of that frame above 10 on its own; before it, 8 and 3 stay above 2.51: the rise began at hop 6
    expect(t.onsetHop).toBe(6);
    expect(t.active).toBe(true);
  });

  it('releases after the frame stays below the release level for the hangover, keeping the last hop above it', () => {
    const t = trigger();
    const energies = [1, 1, 1, 1, 50, 50, 50, 50, 1, 1, 1, 1, 1, 1, 1, 1];
    const changes = energies.map((e, hop) => t.step(hop, e, true));
    expect(changes[4]).toBe(onsetChange);
    // frames: hop 10 = 50 + 1 + 1 + 1 = 53 >= 10.05; hop 11 = 4 < 10.05: below from hop 11, three hops -> release at 13
    expect(changes.indexOf(releaseChange)).toBe(13);
    expect(t.lastAboveHop).toBe(10);
    expect(t.active).toBe(false);
    // peak: frame of four hops at 50 over a floor frame of 4: 50 (17 dB)
    expect(t.peakRatio).toBeCloseTo(50, 12);
  });

  it('calls no onset while not armed', () => {
    const t = trigger();
    expect([100, 100, 100, 100].map((e, hop) => t.step(hop, e, false))).toEqual([noChange, noChange, noChange, noChange]);
    expect(t.active).toBe(false);
  });
});
