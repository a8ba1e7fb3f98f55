// A recorder's clock: t_true = t_start + (1 + drift) * t_rec + offset, t_rec = nominal time since the recorder's first
// stamped start t_start (its files' stamps and sample counts). Seconds from the deployment's origin; drift as a ratio (ppm 1e-6).
export interface RecorderClock {
  /** t_start: nominal start of the recorder's first file, seconds from the origin. */
  clockStartSeconds: number;
  offsetSeconds: number;
  /** Rate error as a ratio: +50e-6 means its nominal time runs 50 ppm slower than true time (its samples come 50 ppm apart late). */
  drift: number;
}

/** Deployment (true) time of nominal recorder time `nominalSeconds`. */
export function clockTrueSeconds(clock: RecorderClock, nominalSeconds: number): number {
  return nominalSeconds + clock.offsetSeconds + clock.drift * (nominalSeconds - clock.clockStartSeconds);
}

/** Nominal recorder time at deployment (true) time `trueSeconds`: the inverse of clockTrueSeconds. */
export function clockNominalSeconds(clock: RecorderClock, trueSeconds: number): number {
  return clock.clockStartSeconds + (trueSeconds - clock.clockStartSeconds - clock.offsetSeconds) / (1 + clock.drift);
}

/** A clock with no correction (its stamps taken as true). */
export function uncorrectedClock(clockStartSeconds: number): RecorderClock {
  return { clockStartSeconds, offsetSeconds: 0, drift: 0 };
}

/**
 * `clock` expressed with `reference`'s nominal time taken as true time (what a fit with that reference fixed at offset 0
 * and drift 0 recovers): the composition nominal(reference, true(clock, t)), linear in t.
 */
export function clockRelativeTo(clock: RecorderClock, reference: RecorderClock): RecorderClock {
  const at = (nominal: number) => clockNominalSeconds(reference, clockTrueSeconds(clock, nominal));
  const start = clock.clockStartSeconds;
  return { clockStartSeconds: start, offsetSeconds: at(start) - start, drift: (1 + clock.drift) / (1 + reference.drift) - 1 };
}
