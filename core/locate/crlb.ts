// Cramer-Rao lower bound of a TDOA fix at any source position (m²) and the geometric dilution of precision (unitless).
// Fisher information J^T Q^-1 J: for arrival-derived delays, Q = sigma² (I + 11^T), equal to sum (g_i - mean g)(...)^T / sigma².
import { WhenceError } from '../errors';
import { invertSmall } from './smallMatrix';
import type { Microphone, Position, TimingModel } from './types';

export interface CrlbOptions {
  speedMetersPerSecond: number;
  dimensions: 2 | 3;
  /** One sigma: of each delay (`independent-pairs`) or of each microphone's arrival time (`arrival-times`), seconds. */
  timingSigmaSeconds: number;
  /** Default `independent-pairs`, as in solveFix. */
  timingModel?: TimingModel;
  /** Pairs measured (microphone indices); default every pair. With `arrival-times` only the microphones they touch count. */
  pairs?: ReadonlyArray<readonly [number, number]>;
}

export type GdopOptions = Pick<CrlbOptions, 'dimensions' | 'timingModel' | 'pairs'>;

function fail(message: string): never {
  throw new WhenceError('locate-invalid-input', message);
}

function checkGeometry(microphones: readonly Microphone[], source: Position, name: string): void {
  if (!Array.isArray(microphones) || microphones.length < 2) fail(`${name}: give at least two microphones.`);
  microphones.forEach((mic, i) => {
    for (const key of ['eastMeters', 'northMeters', 'upMeters'] as const) {
      if (!Number.isFinite(mic[key])) fail(`${name}: microphones[${i}].${key} is ${mic[key]}; give a finite coordinate in metres.`);
    }
  });
  for (const key of ['eastMeters', 'northMeters', 'upMeters'] as const) {
    if (!Number.isFinite(source[key])) fail(`${name}: source.${key} is ${source[key]}; give a finite coordinate in metres.`);
  }
}

function checkPairs(pairs: ReadonlyArray<readonly [number, number]>, micCount: number, name: string): void {
  pairs.forEach(([a, b], k) => {
    const ok = Number.isInteger(a) && Number.isInteger(b) && a >= 0 && b >= 0 && a < micCount && b < micCount && a !== b;
    if (!ok) fail(`${name}: pairs[${k}] = (${a}, ${b}) is not a pair of two different microphone indices below ${micCount}.`);
  });
}

/**
 * Unit-noise Fisher information (per metre² of range error) at the source, row-major D x D, from unit vectors
 * microphone -> source. Exported for the precision map's tests.
 */
export function unitFisherInformation(microphones: readonly Microphone[], source: Position, options: GdopOptions): Float64Array {
  const n = options.dimensions;
  const count = microphones.length;
  const unit = new Float64Array(count * 3);
  for (let i = 0; i < count; i++) {
    const de = source.eastMeters - microphones[i].eastMeters;
    const dn = source.northMeters - microphones[i].northMeters;
    const du = source.upMeters - microphones[i].upMeters;
    const d = Math.hypot(de, dn, du);
    if (d > 0) {
      unit[i * 3] = de / d;
      unit[i * 3 + 1] = dn / d;
      unit[i * 3 + 2] = du / d;
    }
  }
  const fisher = new Float64Array(n * n);
  const model = options.timingModel ?? 'independent-pairs';
  if (model === 'arrival-times') {
    const used = new Uint8Array(count);
    if (options.pairs) for (const [a, b] of options.pairs) used[a] = used[b] = 1;
    else used.fill(1);
    const mean = new Float64Array(3);
    let m = 0;
    for (let i = 0; i < count; i++) {
      if (!used[i]) continue;
      m++;
      for (let a = 0; a < 3; a++) mean[a] += unit[i * 3 + a];
    }
    for (let a = 0; a < 3; a++) mean[a] /= m;
    for (let i = 0; i < count; i++) {
      if (!used[i]) continue;
      for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) fisher[a * n + b] += (unit[i * 3 + a] - mean[a]) * (unit[i * 3 + b] - mean[b]);
    }
  } else {
    const addPair = (i: number, j: number): void => {
      for (let a = 0; a < n; a++) {
        for (let b = 0; b < n; b++) fisher[a * n + b] += (unit[i * 3 + a] - unit[j * 3 + a]) * (unit[i * 3 + b] - unit[j * 3 + b]);
      }
    };
    if (options.pairs) for (const [a, b] of options.pairs) addPair(a, b);
    else for (let i = 0; i < count; i++) for (let j = i + 1; j < count; j++) addPair(i, j);
  }
  return fisher;
}

/** Inverse of a symmetric 2x2/3x3 information matrix; null when (numerically) singular. */
function invertInformation(fisher: Float64Array, n: 2 | 3): Float64Array | null {
  let trace = 0;
  for (let i = 0; i < n; i++) trace += fisher[i * n + i];
  if (!(trace > 0)) return null;
  const out = new Float64Array(n * n);
  const det = invertSmall(fisher, n, out);
  // Numerically singular: the determinant is tiny next to trace^n.
  return det > 1e-14 * (n === 2 ? trace * trace : trace * trace * trace) ? out : null;
}

/**
 * CRLB covariance (m²) of the source position at `source`: 2x2 (east, north; the source on source.upMeters) or 3x3.
 * A singular geometry (no fix possible there) gives Infinity on the diagonal and NaN elsewhere.
 */
export function crlbCovariance(microphones: readonly Microphone[], source: Position, options: CrlbOptions): number[][] {
  checkGeometry(microphones, source, 'crlbCovariance');
  if (options.dimensions !== 2 && options.dimensions !== 3) fail(`crlbCovariance: dimensions is ${options.dimensions}; choose 2 or 3.`);
  if (!(options.speedMetersPerSecond > 0) || !Number.isFinite(options.speedMetersPerSecond)) fail(`crlbCovariance: speedMetersPerSecond is ${options.speedMetersPerSecond}; give a positive speed in m/s.`);
  if (!(options.timingSigmaSeconds > 0) || !Number.isFinite(options.timingSigmaSeconds)) fail(`crlbCovariance: timingSigmaSeconds is ${options.timingSigmaSeconds}; give a positive sigma in seconds.`);
  if (options.pairs) checkPairs(options.pairs, microphones.length, 'crlbCovariance');
  const n = options.dimensions;
  const inverse = invertInformation(unitFisherInformation(microphones, source, options), n);
  const rangeSigma = options.speedMetersPerSecond * options.timingSigmaSeconds;
  const out: number[][] = [];
  for (let i = 0; i < n; i++) {
    const row: number[] = [];
    for (let j = 0; j < n; j++) row.push(inverse ? inverse[i * n + j] * rangeSigma * rangeSigma : i === j ? Infinity : NaN);
    out.push(row);
  }
  return out;
}

/**
 * Geometric dilution of precision at `source`: sqrt(trace(CRLB)) / (c sigma), i.e. metres of position error per
 * metre of range (delay times speed) error; trace over east/north in 2-D, over all three axes in 3-D. Infinity when singular.
 */
export function gdop(microphones: readonly Microphone[], source: Position, options: GdopOptions): number {
  checkGeometry(microphones, source, 'gdop');
  if (options.dimensions !== 2 && options.dimensions !== 3) fail(`gdop: dimensions is ${options.dimensions}; choose 2 or 3.`);
  if (options.pairs) checkPairs(options.pairs, microphones.length, 'gdop');
  const n = options.dimensions;
  const inverse = invertInformation(unitFisherInformation(microphones, source, options), n);
  if (!inverse) return Infinity;
  let trace = 0;
  for (let i = 0; i < n; i++) trace += inverse[i * n + i];
  return Math.sqrt(trace);
}
