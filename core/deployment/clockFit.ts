// Fits every recorder's clock offset and drift from calibration sounds by weighted least squares: arrival (nominal) +
// offset + drift (t - t_start) = emission + range / c, emissions unknown unless given; one reference recorder fixed otherwise.
import { WhenceError } from '../errors';
import { printableText } from '../text';
import { maxOf, minOf } from '../units';
import type { RecorderClock } from './clockModel';

export interface ClockObservation {
  recorderIndex: number;
  soundIndex: number;
  microphone: string;
  /** Arrival at the microphone on its recorder's nominal time, seconds from the origin. */
  nominalArrivalSeconds: number;
  /** Distance from the sound to the microphone over the speed of sound. */
  rangeSeconds: number;
  /** One-sigma of arrival minus range (timing, survey and sound position), seconds. */
  sigmaSeconds: number;
}

export interface ClockFitInput {
  recorders: ReadonlyArray<{ name: string; clockStartSeconds: number }>;
  sounds: ReadonlyArray<{ label: string; emittedSeconds?: number }>;
  observations: readonly ClockObservation[];
  /** Recorder fixed at offset 0, drift 0 when emission times do not fix the time base. Default 0. */
  referenceIndex?: number;
}

export interface RecorderClockFit {
  name: string;
  clock: RecorderClock;
  offsetSigmaSeconds: number;
  driftSigma: number;
  /** True for the recorder that defines time (offset and drift fixed at 0). */
  reference: boolean;
  observationCount: number;
  residualRmsSeconds: number;
  warnings: string[];
}

export interface ClockFitResult {
  recorders: RecorderClockFit[];
  /** Emission time of every calibration sound, seconds from the origin (fitted, or as given), with its sigma (0 when given). */
  sounds: Array<{ label: string; emittedSeconds: number; sigmaSeconds: number }>;
  /** Observed minus modelled arrival, seconds, one per observation (same order). */
  residualsSeconds: number[];
  chiSquare: number;
  degreesOfFreedom: number;
  /** Factor the formal sigmas were multiplied by: sqrt(chi-square / dof) when above 1, else 1. */
  sigmaScale: number;
  /** What fixes the time base: a reference recorder, or the given emission times. */
  timeBase: string;
  warnings: string[];
}

/** Drift columns are in ppm so that every unknown has a similar scale in the normal equations. */
const PPM = 1e-6;
/** A recorder whose residuals exceed its stated sigmas this many times (RMS of normalised residuals) is flagged. */
const POOR_FIT_FACTOR = 3;

/** Inverse of a symmetric positive definite matrix by Gauss-Jordan elimination with partial pivoting; undefined when singular. */
export function invert(matrix: Float64Array[], size: number): { inverse: Float64Array[] } | { singularAt: number } {
  const a = matrix.map((row) => Float64Array.from(row));
  const inv = Array.from({ length: size }, (_, i) => { const row = new Float64Array(size); row[i] = 1; return row; });
  const scale = Math.max(maxOf(a.map((row, i) => Math.abs(row[i]!))), 1e-300);
  for (let col = 0; col < size; col++) {
    let pivot = col;
    for (let row = col + 1; row < size; row++) if (Math.abs(a[row]![col]!) > Math.abs(a[pivot]![col]!)) pivot = row;
    if (!(Math.abs(a[pivot]![col]!) > 1e-12 * scale)) return { singularAt: col };
    [a[col], a[pivot]] = [a[pivot]!, a[col]!];
    [inv[col], inv[pivot]] = [inv[pivot]!, inv[col]!];
    const p = a[col]![col]!;
    for (let k = 0; k < size; k++) { a[col]![k]! /= p; inv[col]![k]! /= p; }
    for (let row = 0; row < size; row++) {
      if (row === col) continue;
      const f = a[row]![col]!;
      if (f === 0) continue;
      for (let k = 0; k < size; k++) { a[row]![k]! -= f * a[col]![k]!; inv[row]![k]! -= f * inv[col]![k]!; }
    }
  }
  return { inverse: inv };
}

export function fitClocks(input: ClockFitInput): ClockFitResult {
  const { recorders, sounds, observations } = input;
  const given = sounds.map((sound) => sound.emittedSeconds).filter((t): t is number => t !== undefined);
  const givenSpanSeconds = given.length === 0 ? 0 : maxOf(given) - minOf(given);
  const referenceIndex = input.referenceIndex ?? 0;
  // The time base: emission times given for two sounds apart in time fix both offset and drift; one fixes the offset only.
  const fixOffset = given.length === 0;
  const fixDrift = given.length === 0 || givenSpanSeconds < 1;
  const columns: Array<{ kind: 'offset' | 'drift' | 'emission'; index: number }> = [];
  const offsetColumn = recorders.map((_, r) => (r === referenceIndex && fixOffset ? -1 : columns.push({ kind: 'offset', index: r }) - 1));
  const driftColumn = recorders.map((_, r) => (r === referenceIndex && fixDrift ? -1 : columns.push({ kind: 'drift', index: r }) - 1));
  const emissionColumn = sounds.map((sound, k) => (sound.emittedSeconds !== undefined ? -1 : columns.push({ kind: 'emission', index: k }) - 1));
  const n = columns.length;
  if (observations.length < n) {
    throw new WhenceError('clock-fit-underdetermined', `the clock fit has ${observations.length} arrivals for ${n} unknowns (an offset and a drift per recorder, an emission time per sound). Make more calibration sounds (at least two at the start and two at the end, each heard by every recorder).`);
  }
  const normal = Array.from({ length: n }, () => new Float64Array(n));
  const rhs = new Float64Array(n);
  const rows = observations.map((obs) => {
    const r = obs.recorderIndex;
    const entries: Array<[number, number]> = [];
    if (offsetColumn[r]! >= 0) entries.push([offsetColumn[r]!, 1]);
    if (driftColumn[r]! >= 0) entries.push([driftColumn[r]!, (obs.nominalArrivalSeconds - recorders[r]!.clockStartSeconds) * PPM]);
    if (emissionColumn[obs.soundIndex]! >= 0) entries.push([emissionColumn[obs.soundIndex]!, -1]);
    const emitted = sounds[obs.soundIndex]!.emittedSeconds ?? 0;
    const target = obs.rangeSeconds + emitted - obs.nominalArrivalSeconds;
    return { entries, target, weight: 1 / (obs.sigmaSeconds * obs.sigmaSeconds) };
  });
  for (const { entries, target, weight } of rows) {
    for (const [i, vi] of entries) {
      rhs[i]! += weight * vi * target;
      for (const [j, vj] of entries) normal[i]![j]! += weight * vi * vj;
    }
  }
  const inverted = invert(normal, n);
  if ('singularAt' in inverted) {
    const column = columns[inverted.singularAt]!;
    const what = column.kind === 'emission'
      ? `the emission time of calibration sound '${printableText(sounds[column.index]!.label, 40)}' (no recorder heard it)`
      : `the ${column.kind} of recorder '${printableText(recorders[column.index]!.name, 40)}' (it heard ${column.kind === 'drift' ? 'calibration sounds at one time only' : 'no calibration sound that another recorder heard too'})`;
    throw new WhenceError('clock-fit-underdetermined', `the calibration sounds cannot fix ${what}. Make calibration sounds that every recorder hears, near the start and near the end of the deployment.`);
  }
  const covariance = inverted.inverse;
  const solution = new Float64Array(n);
  for (let i = 0; i < n; i++) { let sum = 0; for (let j = 0; j < n; j++) sum += covariance[i]![j]! * rhs[j]!; solution[i] = sum; }
  // residual = observed minus modelled arrival (positive: the sound came later than the fit says) = row · x - target
  const residualsSeconds = rows.map(({ entries, target }) => entries.reduce((sum, [i, v]) => sum + v * solution[i]!, 0) - target);
  const chiSquare = rows.reduce((sum, row, index) => sum + row.weight * residualsSeconds[index]! ** 2, 0);
  const degreesOfFreedom = observations.length - n;
  const sigmaScale = degreesOfFreedom > 0 ? Math.max(1, Math.sqrt(chiSquare / degreesOfFreedom)) : 1;
  const sigmaOf = (column: number) => (column < 0 ? 0 : Math.sqrt(covariance[column]![column]!) * sigmaScale);
  const warnings: string[] = [];
  if (degreesOfFreedom === 0) warnings.push('The calibration sounds give exactly as many arrivals as unknowns: nothing checks the fit. Make more calibration sounds.');
  const fits = recorders.map((recorder, r): RecorderClockFit => {
    const own = observations.map((obs, index) => ({ obs, index })).filter(({ obs }) => obs.recorderIndex === r);
    const residualRmsSeconds = own.length === 0 ? Number.NaN : Math.sqrt(own.reduce((sum, { index }) => sum + residualsSeconds[index]! ** 2, 0) / own.length);
    const normalisedRms = own.length === 0 ? Number.NaN : Math.sqrt(own.reduce((sum, { index }) => sum + rows[index]!.weight * residualsSeconds[index]! ** 2, 0) / own.length);
    const recorderWarnings: string[] = [];
    if (own.length === 0) recorderWarnings.push(`Recorder '${recorder.name}' heard no calibration sound; its clock is not corrected.`);
    else if (normalisedRms > POOR_FIT_FACTOR) {
      const worst = own.reduce((a, b) => (Math.abs(residualsSeconds[b.index]!) > Math.abs(residualsSeconds[a.index]!) ? b : a));
      recorderWarnings.push(`Recorder '${recorder.name}' fits poorly: its residuals are ${normalisedRms.toFixed(1)} times their sigmas (RMS ${(residualRmsSeconds * 1e6).toFixed(0)} µs; worst ${(residualsSeconds[worst.index]! * 1e6).toFixed(0)} µs at sound '${sounds[worst.obs.soundIndex]!.label}', microphone '${worst.obs.microphone}'). Check that microphone's position, the calibration sound's position and time, and that the right sound was picked.`);
    }
    const clock: RecorderClock = {
      clockStartSeconds: recorder.clockStartSeconds,
      offsetSeconds: offsetColumn[r]! < 0 ? 0 : solution[offsetColumn[r]!]!,
      drift: driftColumn[r]! < 0 ? 0 : solution[driftColumn[r]!]! * PPM,
    };
    return {
      name: recorder.name, clock, offsetSigmaSeconds: sigmaOf(offsetColumn[r]!), driftSigma: sigmaOf(driftColumn[r]!) * PPM,
      reference: offsetColumn[r]! < 0 && driftColumn[r]! < 0, observationCount: own.length, residualRmsSeconds, warnings: recorderWarnings,
    };
  });
  for (const fit of fits) warnings.push(...fit.warnings);
  const timeBase = fixOffset
    ? `recorder '${recorders[referenceIndex]!.name}' is the reference (offset 0, drift 0): times are on its clock`
    : fixDrift
      ? `the given emission time fixes the offsets; recorder '${recorders[referenceIndex]!.name}' is the drift reference (drift 0)`
      : 'the given emission times fix offsets and drifts (absolute time)';
  return {
    recorders: fits,
    sounds: sounds.map((sound, k) => ({ label: sound.label, emittedSeconds: emissionColumn[k]! < 0 ? sound.emittedSeconds! : solution[emissionColumn[k]!]!, sigmaSeconds: sigmaOf(emissionColumn[k]!) })),
    residualsSeconds, chiSquare, degreesOfFreedom, sigmaScale, timeBase, warnings,
  };
}
