// Consistency checks of pair delays before a fit: the physical limit |tau_ab| <= d_ab / c + tolerance, and triplet
// closure tau_ab + tau_bc + tau_ca = 0 within the combined sigma (both follow from the definition of a TDOA). Seconds.
import { microphoneDistanceMeters } from './aperture';
import { chiSquareQuantile } from './chiSquare';
import type { DelayMeasurement, Microphone } from './types';

export interface LimitViolation {
  delayIndex: number;
  limitSeconds: number;
}

/**
 * Delays beyond d_ab / c_min + tolerance, where c_min = c - 3 sigma_c (the slowest plausible sound) and the tolerance
 * is `toleranceSeconds(k)`.
 */
export function physicalLimitViolations(
  microphones: readonly Microphone[],
  delays: readonly DelayMeasurement[],
  speedMetersPerSecond: number,
  speedSigmaMetersPerSecond: number,
  toleranceSeconds: (delayIndex: number) => number,
): LimitViolation[] {
  const slowest = Math.max(speedMetersPerSecond - 3 * speedSigmaMetersPerSecond, 0.5 * speedMetersPerSecond);
  const out: LimitViolation[] = [];
  delays.forEach((delay, k) => {
    const limitSeconds = microphoneDistanceMeters(microphones[delay.indexA], microphones[delay.indexB]) / slowest + toleranceSeconds(k);
    if (Math.abs(delay.delaySeconds) > limitSeconds) out.push({ delayIndex: k, limitSeconds });
  });
  return out;
}

export interface ClosureFailure {
  /** Delay indices of the three pairs (a,b), (b,c), (a,c) with a < b < c. */
  delayIndices: [number, number, number];
  microphones: [number, number, number];
  /** tau_ab + tau_bc + tau_ca, seconds. */
  misclosureSeconds: number;
  /** Combined sigma of the three delays, seconds. */
  sigmaSeconds: number;
}

/** lookup[a * n + b] = delay index of pair (a, b) in either direction (the first usable measurement), -1 when not measured. */
function usablePairLookup(n: number, delays: readonly DelayMeasurement[], usable: ArrayLike<boolean>): Int32Array {
  const lookup = new Int32Array(n * n).fill(-1);
  delays.forEach((delay, k) => {
    if (!usable[k]) return;
    const { indexA: a, indexB: b } = delay;
    if (lookup[a * n + b] < 0) {
      lookup[a * n + b] = k;
      lookup[b * n + a] = k;
    }
  });
  return lookup;
}

/** Calls `visit` for every closed triplet a < b < c with the delay indices of its pairs (ab, bc, ac). */
function forEachClosedTriplet(n: number, lookup: Int32Array, visit: (a: number, b: number, c: number, kab: number, kbc: number, kac: number) => void): void {
  for (let a = 0; a < n; a++) {
    for (let b = a + 1; b < n; b++) {
      const kab = lookup[a * n + b];
      if (kab < 0) continue;
      for (let c = b + 1; c < n; c++) {
        const kbc = lookup[b * n + c];
        const kac = lookup[a * n + c];
        if (kbc >= 0 && kac >= 0) visit(a, b, c, kab, kbc, kac);
      }
    }
  }
}

/**
 * Triplets of measured pairs whose closure exceeds `sigmaLimit` combined sigmas. Only delays with `usable[k]` take part;
 * when a pair is measured twice, the first measurement is used.
 */
export function closureFailures(
  micCount: number,
  delays: readonly DelayMeasurement[],
  usable: ArrayLike<boolean>,
  sigmaSeconds: (delayIndex: number) => number,
  sigmaLimit = 4,
): ClosureFailure[] {
  // t_x - t_y from measurement k of pair (x, y), whichever way round it was measured.
  const difference = (x: number, k: number): number => (delays[k].indexA === x ? delays[k].delaySeconds : -delays[k].delaySeconds);
  const out: ClosureFailure[] = [];
  forEachClosedTriplet(micCount, usablePairLookup(micCount, delays, usable), (a, b, c, kab, kbc, kac) => {
    const misclosure = difference(a, kab) + difference(b, kbc) - difference(a, kac);
    const sigma = Math.sqrt(sigmaSeconds(kab) ** 2 + sigmaSeconds(kbc) ** 2 + sigmaSeconds(kac) ** 2);
    if (Math.abs(misclosure) > sigmaLimit * sigma) {
      out.push({ delayIndices: [kab, kbc, kac], microphones: [a, b, c], misclosureSeconds: misclosure, sigmaSeconds: sigma });
    }
  });
  return out;
}

/** Number of closed triplets among the usable delays (every pair of the three measured). */
function closedTripletCount(micCount: number, delays: readonly DelayMeasurement[], usable: ArrayLike<boolean>): number {
  let count = 0;
  forEachClosedTriplet(micCount, usablePairLookup(micCount, delays, usable), () => count++);
  return count;
}

export interface ClosureTest {
  /** Closed triplets tested. */
  tested: number;
  /** Misclosure limit in combined sigmas: two-sided normal at `level`, Bonferroni over the triplets tested. */
  sigmaLimit: number;
  failures: ClosureFailure[];
}

/**
 * Triplet closure as a test at significance `level` for the whole set: each triplet's misclosure against
 * z(1 - level / (2 T)) combined sigmas, T the number of triplets (Bonferroni), so a consistent set fails with probability <= level.
 */
export function closureTest(
  micCount: number,
  delays: readonly DelayMeasurement[],
  usable: ArrayLike<boolean>,
  sigmaSeconds: (delayIndex: number) => number,
  level: number,
): ClosureTest {
  const tested = closedTripletCount(micCount, delays, usable);
  if (tested === 0) return { tested, sigmaLimit: Number.POSITIVE_INFINITY, failures: [] };
  // z(1 - a/2)^2 is the chi-square (1 dof) quantile at 1 - a.
  const sigmaLimit = Math.sqrt(chiSquareQuantile(1 - level / tested, 1));
  return { tested, sigmaLimit, failures: closureFailures(micCount, delays, usable, sigmaSeconds, sigmaLimit) };
}
