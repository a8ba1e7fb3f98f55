// Where the slice curve ψ = 0 crosses the four edges of a map rectangle, by safeguarded Newton on ψ along each edge.
// Units: metres. ψ is concave along any line (a linear function minus d times a distance), so each edge holds at most
// two crossings, one on each side of ψ's maximum, which is found in closed form.

import type { SliceFrame } from './hyperbolaSlice';
import { slicePsi } from './hyperbolaSlice';

export interface EdgeRectangle {
  readonly minEastMeters: number;
  readonly maxEastMeters: number;
  readonly minNorthMeters: number;
  readonly maxNorthMeters: number;
}

/** A crossing point; one of its coordinates is exactly a bound. */
export interface EdgeCrossing {
  readonly eastMeters: number;
  readonly northMeters: number;
}

/** All points where the curve crosses or touches the rectangle's edges (a corner may appear twice). */
export function edgeCrossings(frame: SliceFrame, rect: EdgeRectangle): EdgeCrossing[] {
  const crossings: EdgeCrossing[] = [];
  const { minEastMeters: e0, maxEastMeters: e1, minNorthMeters: n0, maxNorthMeters: n1 } = rect;
  for (const w of crossingsAlong(frame, e0, n0, 1, 0, e1 - e0)) crossings.push({ eastMeters: Math.min(e0 + w, e1), northMeters: n0 });
  for (const w of crossingsAlong(frame, e0, n1, 1, 0, e1 - e0)) crossings.push({ eastMeters: Math.min(e0 + w, e1), northMeters: n1 });
  for (const w of crossingsAlong(frame, e0, n0, 0, 1, n1 - n0)) crossings.push({ eastMeters: e0, northMeters: Math.min(n0 + w, n1) });
  for (const w of crossingsAlong(frame, e1, n0, 0, 1, n1 - n0)) crossings.push({ eastMeters: e1, northMeters: Math.min(n0 + w, n1) });
  return crossings;
}

/** Distances w in [0, length] along the segment from (east, north) in unit direction (dirEast, dirNorth) where ψ = 0. */
function crossingsAlong(frame: SliceFrame, east: number, north: number, dirEast: number, dirNorth: number, length: number): number[] {
  const psi = (w: number): number => slicePsi(frame, east + w * dirEast, north + w * dirNorth);
  const x0 = east - frame.originEastMeters;
  const y0 = north - frame.originNorthMeters;
  const d = frame.rangeDifferenceMeters;
  const slope = frame.spanEastMeters * dirEast + frame.spanNorthMeters * dirNorth;
  const footW = -(x0 * dirEast + y0 * dirNorth);
  const across = x0 * dirNorth - y0 * dirEast;
  const z = frame.heightAboveFocusMeters;
  const offAxis = Math.sqrt(across * across + z * z);
  const derivative = (w: number): number => {
    const along = w - footW;
    const rho = Math.sqrt(along * along + offAxis * offAxis);
    return rho > 0 ? slope - (d * along) / rho : slope;
  };
  // ψ(w) = ψ0 + slope·w − d·√((w − footW)² + offAxis²): its maximum is where the distance's slope equals slope/d.
  const pieces: Array<[number, number]> = [];
  if (d > 0 && Math.abs(slope) < d) {
    const ratio = slope / d;
    const peakW = footW + (offAxis * ratio) / Math.sqrt(1 - ratio * ratio);
    if (peakW > 0 && peakW < length) {
      pieces.push([0, peakW], [peakW, length]);
    } else {
      pieces.push([0, length]);
    }
  } else {
    pieces.push([0, length]);
  }
  const roots: number[] = [];
  for (const [lo, hi] of pieces) {
    const psiLo = psi(lo);
    const psiHi = psi(hi);
    if (psiLo === 0) addRoot(roots, lo);
    if (psiHi === 0) addRoot(roots, hi);
    if ((psiLo < 0 && psiHi > 0) || (psiLo > 0 && psiHi < 0)) addRoot(roots, solveBracketed(psi, derivative, lo, hi, psiLo));
  }
  return roots;
}

function addRoot(roots: number[], w: number): void {
  if (!roots.includes(w)) roots.push(w);
}

/** The root of a monotone ψ in [lo, hi] (ψ(lo), ψ(hi) of opposite signs): Newton's method, falling back to bisection. */
function solveBracketed(psi: (w: number) => number, derivative: (w: number) => number, lo: number, hi: number, psiLo: number): number {
  let a = lo;
  let b = hi;
  const rising = psiLo < 0;
  let w = 0.5 * (a + b);
  for (let iteration = 0; iteration < 200; iteration += 1) {
    const value = psi(w);
    if (value === 0) return w;
    if ((value < 0) === rising) a = w;
    else b = w;
    const slope = derivative(w);
    let next = slope !== 0 ? w - value / slope : Number.NaN;
    if (!(next > a && next < b)) next = 0.5 * (a + b);
    if (next === w || b - a <= 2 * Number.EPSILON * (Math.abs(a) + Math.abs(b))) return next;
    w = next;
  }
  return w;
}
