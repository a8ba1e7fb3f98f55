// Adaptive sampling of a parametrised plane curve into a polyline: segments split in half until the curve at the
// segment's quarter, half and three-quarter parameters lies within a chord tolerance and the segment is short enough.
// Units: metres. Recursive subdivision of the parameter (common practice for drawing conics).

/** Writes the point at parameter t as [east, north] metres into `out`. */
export type CurveAt = (t: number, out: Float64Array) => void;

export interface SamplingLimits {
  /** Largest distance allowed between the curve and a chord. */
  readonly chordToleranceMeters: number;
  /** Longest chord allowed. */
  readonly maxSegmentMeters: number;
  /** Points still allowed; decremented as points are planned. */
  remainingPoints: number;
}

const maxDepth = 60;

/**
 * Appends the polyline from (t0, start) to (t1, end) to `flat` as east, north pairs, start included.
 * Returns false if the point budget ran out before the tolerance was met.
 */
export function sampleArc(
  curve: CurveAt,
  t0: number,
  startEast: number,
  startNorth: number,
  t1: number,
  endEast: number,
  endNorth: number,
  limits: SamplingLimits,
  flat: number[],
): boolean {
  const scratch = new Float64Array(2);
  let complete = true;
  const at = (t: number): [number, number] => {
    curve(t, scratch);
    return [scratch[0], scratch[1]];
  };
  flat.push(startEast, startNorth);
  limits.remainingPoints -= 2; // the start and end points; each split below adds one more

  const refine = (tA: number, aE: number, aN: number, tB: number, bE: number, bN: number, tM: number, mE: number, mN: number, depth: number): void => {
    const tQ1 = 0.5 * (tA + tM);
    const tQ3 = 0.5 * (tM + tB);
    const [q1E, q1N] = at(tQ1);
    const [q3E, q3N] = at(tQ3);
    const deviation = Math.max(
      distanceToSegment(q1E, q1N, aE, aN, bE, bN),
      distanceToSegment(mE, mN, aE, aN, bE, bN),
      distanceToSegment(q3E, q3N, aE, aN, bE, bN),
    );
    const length = Math.hypot(bE - aE, bN - aN);
    const wantsSplit = deviation > limits.chordToleranceMeters || length > limits.maxSegmentMeters;
    if (wantsSplit && depth < maxDepth && limits.remainingPoints >= 1) {
      limits.remainingPoints -= 1;
      refine(tA, aE, aN, tM, mE, mN, tQ1, q1E, q1N, depth + 1);
      refine(tM, mE, mN, tB, bE, bN, tQ3, q3E, q3N, depth + 1);
      return;
    }
    if (wantsSplit && depth < maxDepth) complete = false;
    flat.push(bE, bN);
  };

  const tMid = 0.5 * (t0 + t1);
  const [midE, midN] = at(tMid);
  refine(t0, startEast, startNorth, t1, endEast, endNorth, tMid, midE, midN, 0);
  return complete;
}

/** Distance from point p to the segment a–b (to a itself when the segment has no length). */
export function distanceToSegment(pE: number, pN: number, aE: number, aN: number, bE: number, bN: number): number {
  const sE = bE - aE;
  const sN = bN - aN;
  const lengthSquared = sE * sE + sN * sN;
  let f = lengthSquared > 0 ? ((pE - aE) * sE + (pN - aN) * sN) / lengthSquared : 0;
  f = Math.max(0, Math.min(1, f));
  return Math.hypot(pE - aE - f * sE, pN - aN - f * sN);
}
