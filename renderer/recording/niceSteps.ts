// Tick steps for axes: 1-2-5 × 10^k for plain numbers, and steps of clock units (s, min, h, days) for time.
// Steps in the axis' unit (seconds for time, hertz for frequency); a step is the smallest candidate at least the raw step.

/** The smallest 1, 2 or 5 × 10^k that is >= rawStep (rawStep > 0). */
export function niceStep125(rawStep: number): number {
  const exponent = Math.floor(Math.log10(rawStep));
  for (const exp of [exponent - 1, exponent, exponent + 1]) {
    for (const mantissa of [1, 2, 5]) {
      const step = mantissa * 10 ** exp;
      // tolerate rounding of 10^k (e.g. 0.30000000000000004)
      if (step >= rawStep * (1 - 1e-9)) return Number(step.toPrecision(12));
    }
  }
  return 10 ** (exponent + 1);
}

/** Steps of a clock: seconds 1-2-5-10-15-30, minutes 1-2-5-10-15-30, hours 1-2-3-6-12, days 1-2-5-10 ...; 1-2-5 below a second. */
const clockStepsSeconds = [1, 2, 5, 10, 15, 30, 60, 120, 300, 600, 900, 1800, 3600, 7200, 10_800, 21_600, 43_200, 86_400];

export function niceTimeStep(rawStepSeconds: number): number {
  if (rawStepSeconds < 1) return niceStep125(rawStepSeconds);
  for (const step of clockStepsSeconds) if (step >= rawStepSeconds * (1 - 1e-9)) return step;
  return 86_400 * niceStep125(rawStepSeconds / 86_400);
}

/** Multiples of `step` within [from, to] (inclusive, tolerant of rounding). */
export function ticksWithin(from: number, to: number, step: number): number[] {
  const ticks: number[] = [];
  const first = Math.ceil(from / step - 1e-9);
  const last = Math.floor(to / step + 1e-9);
  for (let k = first; k <= last && ticks.length < 10_000; k++) ticks.push(Number((k * step).toPrecision(12)));
  return ticks;
}
