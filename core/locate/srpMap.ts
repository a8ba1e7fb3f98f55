// Steered-response-power map: at each grid point, the sum over microphone pairs of the pair's correlation at the delay
// that point predicts. Units: metres, m/s, Hz; lags in samples. SRP-PHAT (DiBiase 2000; DiBiase, Silverman & Brandstein
// 2001, "Microphone Arrays", ch. 8), with correlations read between lags by Keys (1981) cubic convolution.

import { WhenceError } from '../errors';
import { checkSrpGrid, srpGridPointCount, type SrpGrid, type SrpGridAxis } from './srpGrid';

/**
 * One pair's (PHAT-weighted, band-limited) cross-correlation at integer lags. `values[zeroLagIndex + k]` is the value
 * at lag k samples, and a source whose sound reaches a at time t_a and b at t_b gives its peak at
 * k = (t_a − t_b)·sampleRateHz: the house delay convention (positive when a hears it later).
 */
export interface PairCorrelationFunction {
  readonly indexA: number;
  readonly indexB: number;
  readonly sampleRateHz: number;
  readonly values: Float64Array;
  readonly zeroLagIndex: number;
}

export interface SrpMicrophone {
  readonly eastMeters: number;
  readonly northMeters: number;
  readonly upMeters: number;
}

/**
 * How correlations are read between integer lags. 'cubic' (default): Keys cubic convolution (a = −1/2), exact for
 * quadratics and smooth across samples, so a narrow PHAT peak keeps its height and the map's maximum does not snap to
 * integer-lag ridges. 'linear': half the work, but it flattens peaks between samples and makes the map piecewise linear.
 */
export type SrpInterpolation = 'cubic' | 'linear';

export interface SrpPlanOptions {
  readonly microphones: ReadonlyArray<SrpMicrophone>;
  readonly speedMetersPerSecond: number;
  readonly grid: SrpGrid;
  readonly interpolation?: SrpInterpolation;
}

/** Built once per array, speed of sound and grid by `createSrpPlan`; used for many events. Not re-entrant. */
export interface SrpPlan {
  readonly grid: SrpGrid;
  readonly microphoneCount: number;
  readonly speedMetersPerSecond: number;
  readonly interpolation: SrpInterpolation;
  /** Length of the map `srpMap` fills. */
  readonly pointCount: number;
}

class SrpPlanTables implements SrpPlan {
  readonly pointCount: number;
  readonly microphoneCount: number;
  /** Per microphone m: squared offsets along each axis, [m·count + i]. */
  readonly eastSquares: Float64Array;
  readonly northSquares: Float64Array;
  readonly upSquares: Float64Array;
  /** Scratch: distance from microphone m to the points of one row, [m·east.count + i]. */
  readonly rowDistances: Float64Array;
  readonly rowSquares: Float64Array;
  /** Microphone positions, [3·m] east, [3·m + 1] north, [3·m + 2] up. */
  readonly positions: Float64Array;

  constructor(
    readonly grid: SrpGrid,
    microphones: ReadonlyArray<SrpMicrophone>,
    readonly speedMetersPerSecond: number,
    readonly interpolation: SrpInterpolation,
  ) {
    this.pointCount = srpGridPointCount(grid);
    this.microphoneCount = microphones.length;
    const squares = (axis: SrpGridAxis, coordinate: (m: SrpMicrophone) => number): Float64Array => {
      const table = new Float64Array(microphones.length * axis.count);
      microphones.forEach((m, index) => {
        for (let i = 0; i < axis.count; i += 1) {
          const offset = axis.firstMeters + i * axis.stepMeters - coordinate(m);
          table[index * axis.count + i] = offset * offset;
        }
      });
      return table;
    };
    this.eastSquares = squares(grid.east, (m) => m.eastMeters);
    this.northSquares = squares(grid.north, (m) => m.northMeters);
    this.upSquares = squares(grid.up, (m) => m.upMeters);
    this.rowDistances = new Float64Array(microphones.length * grid.east.count);
    this.rowSquares = new Float64Array(microphones.length);
    this.positions = Float64Array.from(microphones.flatMap((m) => [m.eastMeters, m.northMeters, m.upMeters]));
  }
}

/** Precomputes, per microphone, the squared offsets to every grid line, so a map needs only one square root per microphone and point. */
export function createSrpPlan(options: SrpPlanOptions): SrpPlan {
  const { microphones, speedMetersPerSecond, grid } = options;
  const interpolation = options.interpolation ?? 'cubic';
  if (!Array.isArray(microphones) || microphones.length < 2) {
    throw new WhenceError('srp-invalid-input', 'createSrpPlan(): give at least two microphones (east, north, up in metres).');
  }
  microphones.forEach((m, index) => {
    for (const field of ['eastMeters', 'northMeters', 'upMeters'] as const) {
      if (typeof m?.[field] !== 'number' || !Number.isFinite(m[field])) {
        throw new WhenceError('srp-invalid-input', `createSrpPlan(): microphones[${index}].${field} is ${String(m?.[field])}; give a finite position in metres.`);
      }
    }
  });
  if (typeof speedMetersPerSecond !== 'number' || !(speedMetersPerSecond > 0) || !Number.isFinite(speedMetersPerSecond)) {
    throw new WhenceError('srp-invalid-input', `createSrpPlan(): speedMetersPerSecond is ${String(speedMetersPerSecond)}; give the positive speed of sound in m/s.`);
  }
  if (interpolation !== 'cubic' && interpolation !== 'linear') {
    throw new WhenceError('srp-invalid-input', `createSrpPlan(): interpolation is ${String(interpolation)}; use 'cubic' or 'linear'.`);
  }
  checkSrpGrid(grid);
  return new SrpPlanTables(grid, microphones, speedMetersPerSecond, interpolation);
}

/**
 * Fills `output` (length at least plan.pointCount; point order as srpGridIndex) with the steered response power:
 * Σ over pairs of R_ab(((|p − m_a| − |p − m_b|)/c)·fs). Lags outside a correlation's values contribute 0.
 */
export function srpMap(plan: SrpPlan, pairs: ReadonlyArray<PairCorrelationFunction>, output: Float64Array): void {
  if (!(plan instanceof SrpPlanTables)) {
    throw new WhenceError('srp-invalid-input', 'srpMap(): the plan was not made by createSrpPlan(); build one with createSrpPlan().');
  }
  checkPairs(pairs, plan.microphoneCount, 'srpMap');
  if (!(output instanceof Float64Array) || output.length < plan.pointCount) {
    throw new WhenceError(
      'srp-invalid-input',
      `srpMap(): the output has ${output instanceof Float64Array ? output.length : 'no'} values but the grid has ${plan.pointCount} points; pass a Float64Array of at least plan.pointCount.`,
    );
  }
  const { grid, eastSquares, northSquares, upSquares, rowDistances, rowSquares } = plan;
  const eastCount = grid.east.count;
  const northCount = grid.north.count;
  const upCount = grid.up.count;
  const micCount = plan.microphoneCount;
  const cubic = plan.interpolation === 'cubic';
  for (let k = 0; k < upCount; k += 1) {
    for (let j = 0; j < northCount; j += 1) {
      for (let m = 0; m < micCount; m += 1) rowSquares[m] = northSquares[m * northCount + j] + upSquares[m * upCount + k];
      for (let m = 0; m < micCount; m += 1) {
        const base = m * eastCount;
        const rest = rowSquares[m];
        for (let i = 0; i < eastCount; i += 1) rowDistances[base + i] = Math.sqrt(eastSquares[base + i] + rest);
      }
      const rowStart = (k * northCount + j) * eastCount;
      output.fill(0, rowStart, rowStart + eastCount);
      for (const pair of pairs) {
        const lagsPerMeter = pair.sampleRateHz / plan.speedMetersPerSecond;
        const values = pair.values;
        const zero = pair.zeroLagIndex;
        const offsetA = pair.indexA * eastCount;
        const offsetB = pair.indexB * eastCount;
        if (cubic) {
          for (let i = 0; i < eastCount; i += 1) {
            const x = zero + (rowDistances[offsetA + i] - rowDistances[offsetB + i]) * lagsPerMeter;
            output[rowStart + i] += cubicAt(values, x);
          }
        } else {
          for (let i = 0; i < eastCount; i += 1) {
            const x = zero + (rowDistances[offsetA + i] - rowDistances[offsetB + i]) * lagsPerMeter;
            output[rowStart + i] += linearAt(values, x);
          }
        }
      }
    }
  }
}

/**
 * The steered response power at one point anywhere (not only on the grid), read exactly as `srpMap` reads it:
 * for refining a peak between grid points.
 */
export function srpValueAt(plan: SrpPlan, pairs: ReadonlyArray<PairCorrelationFunction>, eastMeters: number, northMeters: number, upMeters: number): number {
  if (!(plan instanceof SrpPlanTables)) {
    throw new WhenceError('srp-invalid-input', 'srpValueAt(): the plan was not made by createSrpPlan(); build one with createSrpPlan().');
  }
  checkPairs(pairs, plan.microphoneCount, 'srpValueAt');
  const positions = plan.positions;
  const distanceTo = (m: number): number =>
    Math.hypot(eastMeters - positions[3 * m], northMeters - positions[3 * m + 1], upMeters - positions[3 * m + 2]);
  let total = 0;
  for (const pair of pairs) {
    const x = pair.zeroLagIndex + ((distanceTo(pair.indexA) - distanceTo(pair.indexB)) * pair.sampleRateHz) / plan.speedMetersPerSecond;
    total += plan.interpolation === 'cubic' ? cubicAt(pair.values, x) : linearAt(pair.values, x);
  }
  return total;
}

/** Keys (1981) cubic convolution, a = −1/2, at fractional index x; samples outside the array count as 0. */
function cubicAt(values: Float64Array, x: number): number {
  const i = Math.floor(x);
  const f = x - i;
  let p0: number;
  let p1: number;
  let p2: number;
  let p3: number;
  if (i >= 1 && i + 2 < values.length) {
    p0 = values[i - 1];
    p1 = values[i];
    p2 = values[i + 1];
    p3 = values[i + 2];
  } else {
    if (i < -2 || i >= values.length + 1 || Number.isNaN(x)) return 0;
    p0 = sampleOrZero(values, i - 1);
    p1 = sampleOrZero(values, i);
    p2 = sampleOrZero(values, i + 1);
    p3 = sampleOrZero(values, i + 2);
  }
  return p1 + 0.5 * f * (p2 - p0 + f * (2 * p0 - 5 * p1 + 4 * p2 - p3 + f * (3 * (p1 - p2) + p3 - p0)));
}

function linearAt(values: Float64Array, x: number): number {
  const i = Math.floor(x);
  const f = x - i;
  if (i >= 0 && i + 1 < values.length) return values[i] + f * (values[i + 1] - values[i]);
  if (i < -1 || i >= values.length || Number.isNaN(x)) return 0;
  const p0 = sampleOrZero(values, i);
  return p0 + f * (sampleOrZero(values, i + 1) - p0);
}

function sampleOrZero(values: Float64Array, index: number): number {
  return index >= 0 && index < values.length ? values[index] : 0;
}

function checkPairs(pairs: ReadonlyArray<PairCorrelationFunction>, microphoneCount: number, caller: string): void {
  if (!Array.isArray(pairs) || pairs.length === 0) {
    throw new WhenceError('srp-invalid-input', `${caller}(): give at least one pair correlation.`);
  }
  pairs.forEach((pair, index) => {
    const where = `${caller}(): pairs[${index}]`;
    const isIndex = (value: number): boolean => Number.isInteger(value) && value >= 0 && value < microphoneCount;
    if (!isIndex(pair?.indexA) || !isIndex(pair?.indexB) || pair.indexA === pair.indexB) {
      throw new WhenceError(
        'srp-invalid-input',
        `${where} joins microphones ${String(pair?.indexA)} and ${String(pair?.indexB)}; give two different indices from 0 to ${microphoneCount - 1}.`,
      );
    }
    if (typeof pair.sampleRateHz !== 'number' || !(pair.sampleRateHz > 0) || !Number.isFinite(pair.sampleRateHz)) {
      throw new WhenceError('srp-invalid-input', `${where}.sampleRateHz is ${String(pair.sampleRateHz)}; give the positive sample rate in Hz.`);
    }
    if (!(pair.values instanceof Float64Array) || pair.values.length === 0) {
      throw new WhenceError('srp-invalid-input', `${where}.values is not a non-empty Float64Array of correlation values.`);
    }
    if (!Number.isInteger(pair.zeroLagIndex) || pair.zeroLagIndex < 0 || pair.zeroLagIndex >= pair.values.length) {
      throw new WhenceError(
        'srp-invalid-input',
        `${where}.zeroLagIndex is ${String(pair.zeroLagIndex)}; give the index of lag 0, from 0 to ${pair.values.length - 1}.`,
      );
    }
  });
}
