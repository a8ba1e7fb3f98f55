// Onset and release of one channel: frame energy (last four hops, signal units²) against its floor, thresholds in dB,
// hysteresis and hangover; times in hops. Onset: the first hop of the triggering frame that clears the threshold alone,
// traced back over the hops before it that stay above the release level, so a slowly rising sound is dated by its start.

/** Hops per energy frame: onsets are resolved to a quarter frame. */
export const hopsPerFrame = 4;
/** No activation yet. */
export const idleStatus = -1;
/** The activation (active or already released) is waiting for other channels to agree. */
export const pendingStatus = 0;
/** The activation found no agreement in time; it may still join an event that opens soon after. */
export const loneStatus = 1;
/** The activation belongs to an event (see eventSerial). */
export const memberStatus = 2;

/** Hops of history kept for tracing an onset back (a power of two). */
const historyHops = 16;

export const noChange = 0;
export const onsetChange = 1;
export const releaseChange = 2;

export class ChannelTrigger {
  active = false;
  /** Hop of the current (or last) activation's onset. */
  onsetHop = -1;
  /** Last hop whose frame energy was above the release level. */
  lastAboveHop = -1;
  /** Largest frame energy over the floor (linear) during the current activation. */
  peakRatio = 0;
  status = idleStatus;
  /** Serial of the event the activation belongs to (-1: none). */
  eventSerial = -1;

  /** The last historyHops hop energies; hop h is at h % historyHops. */
  private readonly history = new Float64Array(historyHops);
  private belowCount = 0;
  private releasedHop = -1;
  private onFrameEnergy = Infinity;
  private onHopEnergy = Infinity;
  private offFrameEnergy = Infinity;
  private floorFrameEnergy = Infinity;
  private readonly onRatio: number;
  private readonly offRatio: number;

  constructor(
    private readonly hopFrames: number,
    thresholdDb: number,
    releaseDb: number,
    private readonly hangoverHops: number,
  ) {
    this.onRatio = 10 ** (thresholdDb / 10);
    this.offRatio = 10 ** (releaseDb / 10);
  }

  /** Sets the floor as a mean square (band signal units²). */
  setFloor(meanSquare: number): void {
    const floorHop = Math.max(meanSquare, 1e-30) * this.hopFrames;
    this.floorFrameEnergy = floorHop * hopsPerFrame;
    this.onFrameEnergy = this.floorFrameEnergy * this.onRatio;
    this.onHopEnergy = floorHop * this.onRatio;
    this.offFrameEnergy = this.floorFrameEnergy * this.offRatio;
  }

  /** Takes hop `hop`'s energy; `armed` false suppresses onsets (filter settling). Returns noChange, onsetChange or releaseChange. */
  step(hop: number, hopEnergy: number, armed: boolean): number {
    const history = this.history;
    const mask = historyHops - 1;
    history[hop & mask] = hopEnergy;
    let frameEnergy = 0;
    for (let k = 0; k < hopsPerFrame; k++) frameEnergy += history[(hop - k) & mask]!;
    if (!this.active) {
      if (!armed || frameEnergy < this.onFrameEnergy) return noChange;
      // The first hop of the frame that clears the threshold on its own...
      let onset = hop;
      for (let k = hopsPerFrame - 1; k >= 0; k--) {
        if (history[(hop - k) & mask]! >= this.onHopEnergy) {
          onset = hop - k;
          break;
        }
      }
      // ...traced back while the hops before it stay above the release level.
      const earliest = Math.max(this.releasedHop + 1, hop - historyHops + 1, 0);
      const offHopEnergy = this.offFrameEnergy / hopsPerFrame;
      while (onset > earliest && history[(onset - 1) & mask]! >= offHopEnergy) onset--;
      this.active = true;
      this.onsetHop = onset;
      this.lastAboveHop = hop;
      this.belowCount = 0;
      this.peakRatio = frameEnergy / this.floorFrameEnergy;
      this.status = pendingStatus;
      this.eventSerial = -1;
      return onsetChange;
    }
    const ratio = frameEnergy / this.floorFrameEnergy;
    if (ratio > this.peakRatio) this.peakRatio = ratio;
    if (frameEnergy >= this.offFrameEnergy) {
      this.lastAboveHop = hop;
      this.belowCount = 0;
      return noChange;
    }
    if (++this.belowCount < this.hangoverHops) return noChange;
    this.active = false;
    this.releasedHop = hop;
    return releaseChange;
  }
}
