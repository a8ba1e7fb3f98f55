// Fits recorder clocks (offset, drift) jointly with the unknown positions and emission times of sounds every recorder
// hears, seconds and metres: Levenberg-Marquardt, sound blocks eliminated by the Schur complement; offset prior as pseudo-observations.
import { WhenceError } from '../errors';
import { apertureMeters, median } from '../locate';
import type { ArrayMicrophone } from '../project';
import { printableText } from '../text';
import { maxOf, minOf } from '../units';
import { invert, type ClockFitResult, type ClockObservation, type RecorderClockFit } from './clockFit';
import type { RecorderClock } from './clockModel';

export interface SharedSoundFitInput {
  /** offsetPriorSigmaSeconds: one-sigma of the recorder's offset from its stamps (the prior: offset 0 ± this). */
  recorders: ReadonlyArray<{ name: string; clockStartSeconds: number; offsetPriorSigmaSeconds: number }>;
  sounds: ReadonlyArray<{ label: string }>;
  /** Arrivals on each recorder's nominal time; rangeSeconds is ignored (the sound's position is unknown). */
  observations: readonly ClockObservation[];
  microphones: ReadonlyMap<string, ArrayMicrophone>;
  speedMetersPerSecond: number;
  /** 3: each sound's height is fitted; 2: it is fixed at soundUpMeters (default the microphones' mean height). */
  dimensions: 2 | 3;
  soundUpMeters?: number;
  /** Recorder fixed at offset 0, drift 0. Default 0. */
  referenceIndex?: number;
}

export interface SharedSoundFitResult extends ClockFitResult {
  /** Fitted position of every shared sound, metres east/north/up of the array's origin. */
  soundPositions: Array<{ eastMeters: number; northMeters: number; upMeters: number }>;
  /** One-sigma of each fitted position, metres (clocks' uncertainty included; the height's 0 when fixed in 2-D; NaN for a sound left out). */
  soundPositionSigmas: Array<{ eastMeters: number; northMeters: number; upMeters: number }>;
  /** The observations with rangeSeconds set from the fitted sound positions. */
  observations: ClockObservation[];
}

const PPM = 1e-6;
/** Sounds closer together in time than this cannot separate a drift from an offset. */
export const MIN_DRIFT_SPAN_SECONDS = 1;
const POOR_FIT_FACTOR = 3;
/** A clock unknown the data alone fix no better than this fraction of its prior sigma counts as not determined by the sounds. */
const DATA_SIGMA_OVER_PRIOR = 0.5;
/** A prior tighter than this (seconds) is taken as knowledge: a clock the sounds fix worse is a warning, not a refusal. */
const TRUSTED_PRIOR_SECONDS = 0.01;

type Vec = Float64Array;

/** Inverse of a symmetric positive definite matrix scaled to unit diagonal first (unknowns of very different scales). */
function invertScaled(matrix: Float64Array[]): { inverse: Float64Array[] } | { singularAt: number } {
  const size = matrix.length;
  const d = matrix.map((row, i) => (row[i]! > 0 ? 1 / Math.sqrt(row[i]!) : 1));
  const inverted = invert(matrix.map((row, i) => row.map((v, j) => v * d[i]! * d[j]!)), size);
  if ('singularAt' in inverted) return inverted;
  return { inverse: inverted.inverse.map((row, i) => row.map((v, j) => v * d[i]! * d[j]!)) };
}

function solveSmall(matrix: Float64Array[], vector: Vec): Vec | undefined {
  const inverted = invertScaled(matrix);
  if ('singularAt' in inverted) return undefined;
  return Float64Array.from(inverted.inverse, (row) => row.reduce((sum, v, j) => sum + v * vector[j]!, 0));
}

/**
 * Leaves out arrivals that cannot be the same sound as the others: with each recorder's offset taken as the median
 * arrival difference to the reference recorder, an arrival further from its sound's median than the array's widest
 * microphone spacing (over c) plus 50 ms was another sound picked in the search span.
 */
function withoutWrongPicks(observations: readonly ClockObservation[], recorderCount: number, referenceIndex: number, mics: readonly ArrayMicrophone[], c: number, sounds: ReadonlyArray<{ label: string }>, warnings: string[]): ClockObservation[] {
  const offsets = Array.from({ length: recorderCount }, (_, r) => {
    if (r === referenceIndex) return 0;
    const differences = observations.filter((o) => o.recorderIndex === r).flatMap((own) => {
      const ref = observations.find((o) => o.soundIndex === own.soundIndex && o.recorderIndex === referenceIndex);
      return ref === undefined ? [] : [ref.nominalArrivalSeconds - own.nominalArrivalSeconds];
    });
    return differences.length === 0 ? 0 : median(differences);
  });
  const limitSeconds = apertureMeters(mics) / c + 0.05;
  const aligned = (o: ClockObservation) => o.nominalArrivalSeconds + offsets[o.recorderIndex]!;
  return observations.filter((o) => {
    const middle = median(observations.filter((other) => other.soundIndex === o.soundIndex).map(aligned));
    if (Math.abs(aligned(o) - middle) <= limitSeconds) return true;
    warnings.push(`Shared sound '${sounds[o.soundIndex]!.label}' at microphone '${o.microphone}' came ${(aligned(o) - middle).toFixed(3)} s from where the other microphones place it (more than the array's ${(limitSeconds * 1e3).toFixed(0)} ms across): another sound was picked there; that arrival is left out. Keep shared sounds apart from other loud sounds by more than --search.`);
    return false;
  });
}

export function fitClocksFromSharedSounds(input: SharedSoundFitInput): SharedSoundFitResult {
  const { recorders, sounds, microphones, dimensions } = input;
  const c = input.speedMetersPerSecond;
  const referenceIndex = input.referenceIndex ?? 0;
  const mics = [...microphones.values()];
  const meanUpMeters = mics.reduce((sum, m) => sum + m.upMeters, 0) / Math.max(1, mics.length);
  const soundUpMeters = input.soundUpMeters ?? meanUpMeters;
  const warnings: string[] = [];
  // sounds heard by too few microphones fix nothing: left out
  const picked = withoutWrongPicks(input.observations, recorders.length, referenceIndex, mics, c, sounds, warnings);
  const perSound = sounds.map((_, k) => picked.filter((o) => o.soundIndex === k).length);
  const usedSound = perSound.map((count) => count >= dimensions + 2);
  for (const [k, sound] of sounds.entries()) {
    if (!usedSound[k]) warnings.push(`Shared sound '${sound.label}' was heard at ${perSound[k]} microphone${perSound[k] === 1 ? '' : 's'}; a sound of unknown position needs at least ${dimensions + 2} (${dimensions}-D): it is left out.`);
  }
  const observations = picked.filter((o) => usedSound[o.soundIndex]);
  // drift columns only for recorders whose sounds span time
  const spanOf = (r: number) => {
    const times = observations.filter((o) => o.recorderIndex === r).map((o) => o.nominalArrivalSeconds);
    return times.length === 0 ? 0 : maxOf(times) - minOf(times);
  };
  const clockColumns: Array<{ kind: 'offset' | 'drift'; index: number }> = [];
  const offsetColumn = recorders.map((_, r) => (r === referenceIndex ? -1 : clockColumns.push({ kind: 'offset', index: r }) - 1));
  const driftFixed: number[] = [];
  const driftColumn = recorders.map((_, r) => {
    if (r === referenceIndex) return -1;
    if (spanOf(r) < MIN_DRIFT_SPAN_SECONDS) { driftFixed.push(r); return -1; }
    return clockColumns.push({ kind: 'drift', index: r }) - 1;
  });
  if (driftFixed.length > 0) {
    warnings.push(`The shared sounds heard by ${driftFixed.map((r) => `'${recorders[r]!.name}'`).join(', ')} lie within ${MIN_DRIFT_SPAN_SECONDS} s of each other, so ${driftFixed.length === 1 ? 'its drift is' : 'their drifts are'} not determined and fixed at 0 ppm. Use sounds spread over the whole recording to fit drifts.`);
  }
  const nc = clockColumns.length;
  const soundParams = dimensions + 1;
  const soundCount = usedSound.filter(Boolean).length;
  const unknowns = nc + soundParams * soundCount;
  if (observations.length < unknowns || soundCount === 0) {
    const perSoundSurplus = recorders.length - soundParams;
    const needed = perSoundSurplus > 0 ? Math.ceil(nc / perSoundSurplus) : Number.POSITIVE_INFINITY;
    throw new WhenceError('clock-fit-underdetermined', `the shared sounds give ${observations.length} arrivals for ${unknowns} unknowns (an offset and a drift per recorder, a ${dimensions}-D position and an emission time per sound). ${Number.isFinite(needed) ? `Give at least ${needed} shared sounds, each heard by every recorder, at different places` : `With ${recorders.length} recorders a sound's ${dimensions}-D position and time use up every arrival: use calibration sounds at surveyed points (--calibration)`}${driftFixed.length === 0 ? ', spread over the recording' : ''}.`);
  }
  // unknowns: clock vector (offsets s, drifts ppm), per sound q = position / c (seconds) and emission T (seconds)
  const clockParams = new Float64Array(nc);
  const soundIndexOf = sounds.map((_, k) => k).filter((k) => usedSound[k]);
  const micSeconds = (label: string) => { const m = microphones.get(label)!; return [m.eastMeters / c, m.northMeters / c, m.upMeters / c]; };
  // start: offsets from the median arrival difference to the reference recorder over the sounds both heard
  for (const [r] of recorders.entries()) {
    if (offsetColumn[r]! < 0) continue;
    const differences = soundIndexOf.flatMap((k) => {
      const own = observations.find((o) => o.soundIndex === k && o.recorderIndex === r);
      const ref = observations.find((o) => o.soundIndex === k && o.recorderIndex === referenceIndex);
      return own !== undefined && ref !== undefined ? [ref.nominalArrivalSeconds - own.nominalArrivalSeconds] : [];
    }).sort((a, b) => a - b);
    if (differences.length > 0) clockParams[offsetColumn[r]!] = differences[Math.floor(differences.length / 2)]!;
  }
  const clockOf = (params: Vec, r: number) => ({
    offset: offsetColumn[r]! < 0 ? 0 : params[offsetColumn[r]!]!,
    driftPpm: driftColumn[r]! < 0 ? 0 : params[driftColumn[r]!]!,
  });
  const obsBySound = soundIndexOf.map((k) => observations.filter((o) => o.soundIndex === k));
  const trueArrival = (params: Vec, o: ClockObservation) => {
    const { offset, driftPpm } = clockOf(params, o.recorderIndex);
    return o.nominalArrivalSeconds + offset + driftPpm * PPM * (o.nominalArrivalSeconds - recorders[o.recorderIndex]!.clockStartSeconds);
  };
  const soundState = obsBySound.map((list) => {
    const centroid = [0, 1, 2].map((j) => list.reduce((sum, o) => sum + micSeconds(o.microphone)[j]!, 0) / list.length);
    const q = Float64Array.from(centroid.slice(0, dimensions));
    const earliest = minOf(list.map((o) => trueArrival(clockParams, o)));
    return Float64Array.from([...q, earliest - 0.02]);
  });
  const upSeconds = soundUpMeters / c;
  /** Observed minus modelled arrival and its gradient in the sound's own unknowns. */
  const evaluate = (params: Vec, state: Vec, o: ClockObservation) => {
    const x = micSeconds(o.microphone);
    const d = [state[0]! - x[0]!, state[1]! - x[1]!, (dimensions === 3 ? state[2]! : upSeconds) - x[2]!];
    const range = Math.max(Math.hypot(d[0]!, d[1]!, d[2]!), 1e-9);
    const residual = trueArrival(params, o) - state[dimensions]! - range;
    const soundGradient = new Float64Array(soundParams);
    for (let j = 0; j < dimensions; j++) soundGradient[j] = -d[j]! / range;
    soundGradient[dimensions] = -1;
    return { residual, soundGradient, range };
  };
  const clockGradient = (o: ClockObservation) => {
    const g: Array<[number, number]> = [];
    const r = o.recorderIndex;
    if (offsetColumn[r]! >= 0) g.push([offsetColumn[r]!, 1]);
    if (driftColumn[r]! >= 0) g.push([driftColumn[r]!, (o.nominalArrivalSeconds - recorders[r]!.clockStartSeconds) * PPM]);
    return g;
  };
  const priorWeight = recorders.map((rec) => 1 / (rec.offsetPriorSigmaSeconds ** 2 + recorders[referenceIndex]!.offsetPriorSigmaSeconds ** 2));
  const cost = (params: Vec, states: Vec[]) => {
    let sum = 0;
    obsBySound.forEach((list, i) => { for (const o of list) sum += evaluate(params, states[i]!, o).residual ** 2 / o.sigmaSeconds ** 2; });
    recorders.forEach((_, r) => { if (offsetColumn[r]! >= 0) sum += priorWeight[r]! * params[offsetColumn[r]!]! ** 2; });
    return sum;
  };
  /** Normal equations reduced to the clock unknowns (Schur complement of the sound blocks). */
  const reduce = (params: Vec, states: Vec[], lambda: number, withPrior: boolean) => {
    const S = Array.from({ length: nc }, () => new Float64Array(nc));
    const b = new Float64Array(nc);
    const blocks = obsBySound.map((list, i) => {
      const V = Array.from({ length: soundParams }, () => new Float64Array(soundParams));
      const W = Array.from({ length: nc }, () => new Float64Array(soundParams));
      const gk = new Float64Array(soundParams);
      for (const o of list) {
        const { residual, soundGradient } = evaluate(params, states[i]!, o);
        const w = 1 / o.sigmaSeconds ** 2;
        const cg = clockGradient(o);
        for (let a = 0; a < soundParams; a++) {
          gk[a]! += w * soundGradient[a]! * residual;
          for (let bb = 0; bb < soundParams; bb++) V[a]![bb]! += w * soundGradient[a]! * soundGradient[bb]!;
        }
        for (const [col, v] of cg) {
          b[col]! -= w * v * residual;
          for (const [col2, v2] of cg) S[col]![col2]! += w * v * v2;
          for (let a = 0; a < soundParams; a++) W[col]![a]! += w * v * soundGradient[a]!;
        }
      }
      for (let a = 0; a < soundParams; a++) V[a]![a]! *= 1 + lambda;
      const inverted = invertScaled(V);
      if ('singularAt' in inverted) return undefined;
      const Vi = inverted.inverse;
      // S -= W Vi Wᵀ ; b += W Vi gk (b holds -g_c)
      const WVi = W.map((row) => Float64Array.from({ length: soundParams }, (_, a) => row.reduce((sum, v, t) => sum + v * Vi[t]![a]!, 0)));
      for (let p = 0; p < nc; p++) {
        b[p]! += WVi[p]!.reduce((sum, v, a) => sum + v * gk[a]!, 0);
        for (let q = 0; q < nc; q++) S[p]![q]! -= WVi[p]!.reduce((sum, v, a) => sum + v * W[q]![a]!, 0);
      }
      return { Vi, W, WVi, gk };
    });
    if (withPrior) recorders.forEach((_, r) => { const col = offsetColumn[r]!; if (col >= 0) { S[col]![col]! += priorWeight[r]!; b[col]! -= priorWeight[r]! * params[col]!; } });
    for (let p = 0; p < nc; p++) S[p]![p]! *= 1 + lambda;
    return { S, b, blocks };
  };
  const step = (params: Vec, states: Vec[], lambda: number, clocksFree: boolean) => {
    const { S, b, blocks } = reduce(params, states, lambda, true);
    if (blocks.some((block) => block === undefined)) return undefined;
    const dc = clocksFree && nc > 0 ? solveSmall(S, b) : new Float64Array(nc);
    if (dc === undefined) return undefined;
    const nextParams = Float64Array.from(params, (v, i) => v + dc[i]!);
    const nextStates = states.map((state, i) => {
      const { Vi, W, gk } = blocks[i]!;
      // δk = Vi (-gk - Wᵀ δc)
      const rhs = Float64Array.from({ length: soundParams }, (_, a) => -gk[a]! - W.reduce((sum, row, p) => sum + row[a]! * dc[p]!, 0));
      return Float64Array.from(state, (v, a) => v + Vi[a]!.reduce((sum, x, t) => sum + x * rhs[t]!, 0));
    });
    return { nextParams, nextStates };
  };
  const optimise = (startParams: Vec, startStates: Vec[], clocksFree: boolean) => {
    let params = startParams;
    let states = startStates;
    let lambda = 1e-3;
    let current = cost(params, states);
    let iteration = 0;
    for (; iteration < 200 && lambda < 1e12; iteration++) {
      const next = step(params, states, lambda, clocksFree);
      const nextCost = next === undefined ? Number.POSITIVE_INFINITY : cost(next.nextParams, next.nextStates);
      if (next !== undefined && nextCost <= current) {
        const converged = current - nextCost <= 1e-14 * current;
        params = next.nextParams; states = next.nextStates; current = nextCost; lambda = Math.max(lambda / 3, 1e-9);
        if (converged) break;
      } else {
        lambda *= 5;
      }
    }
    return { params, states };
  };
  const soundCost = (params: Vec, state: Vec, i: number) => obsBySound[i]!.reduce((sum, o) => sum + (evaluate(params, state, o).residual / o.sigmaSeconds) ** 2, 0);
  let { params, states } = optimise(clockParams, soundState, true);
  // 3-D: a sound's height has a second, mirrored minimum about the microphones' mean height; try it for every sound
  const meanUpSeconds = meanUpMeters / c;
  for (let round = 0; dimensions === 3 && round < 3; round++) {
    const mirrored = optimise(params, states.map((state) => Float64Array.from(state, (v, j) => (j === 2 ? 2 * meanUpSeconds - v : v))), false).states;
    let switched = 0;
    const chosen = states.map((state, i) => {
      if (soundCost(params, mirrored[i]!, i) < 0.999 * soundCost(params, state, i)) { switched++; return mirrored[i]!; }
      return state;
    });
    if (switched === 0) break;
    ({ params, states } = optimise(params, chosen, true));
  }
  // what the sounds alone determine: the reduced normal matrix without the prior
  const dataOnly = reduce(params, states, 0, false);
  const dataInverse = nc === 0 ? { inverse: [] as Float64Array[] } : invertScaled(dataOnly.S);
  const describe = (col: number) => `the ${clockColumns[col]!.kind} of recorder '${printableText(recorders[clockColumns[col]!.index]!.name, 40)}'`;
  const advice = 'Use more shared sounds, at places spread around the array (not all in a line or at one spot) and heard by every recorder, or calibration sounds at surveyed points (--calibration).';
  if ('singularAt' in dataInverse) throw new WhenceError('clock-fit-underdetermined', `the shared sounds cannot fix ${describe(dataInverse.singularAt)}: their places and times leave it free. ${advice}`);
  for (const [r] of recorders.entries()) {
    const col = offsetColumn[r]!;
    if (col < 0) continue;
    const dataSigma = Math.sqrt(Math.max(0, dataInverse.inverse[col]![col]!));
    const priorSigma = 1 / Math.sqrt(priorWeight[r]!);
    if (!(dataSigma <= DATA_SIGMA_OVER_PRIOR * priorSigma)) {
      // a prior of a few milliseconds is a clock the user trusts: the fit then leans on it, and says so
      if (priorSigma < TRUSTED_PRIOR_SECONDS && Number.isFinite(dataSigma)) {
        warnings.push(`The shared sounds fix ${describe(col)} only to ±${(dataSigma * 1e6).toFixed(0)} µs; its fitted value comes mostly from its prior ±${(priorSigma * 1e6).toFixed(0)} µs (--offset-sigma).`);
        continue;
      }
      throw new WhenceError('clock-fit-underdetermined', `the shared sounds fix ${describe(col)} only to ±${(dataSigma * 1e3).toFixed(1)} ms, no better than its prior ±${(priorSigma * 1e3).toFixed(1)} ms. ${advice}`);
    }
  }
  const { S, blocks } = reduce(params, states, 0, true);
  const covariance = nc === 0 ? [] : (() => { const inv = invertScaled(S); if ('singularAt' in inv) throw new WhenceError('clock-fit-underdetermined', `the shared sounds cannot fix ${describe(inv.singularAt)}. ${advice}`); return inv.inverse; })();
  const fittedObservations: ClockObservation[] = [];
  const residualsSeconds: number[] = [];
  obsBySound.forEach((list, i) => list.forEach((o) => {
    const { residual, range } = evaluate(params, states[i]!, o);
    residualsSeconds.push(residual);
    fittedObservations.push({ ...o, rangeSeconds: range });
  }));
  const chiSquare = fittedObservations.reduce((sum, o, index) => sum + (residualsSeconds[index]! / o.sigmaSeconds) ** 2, 0);
  const degreesOfFreedom = observations.length - unknowns;
  const sigmaScale = degreesOfFreedom > 0 ? Math.max(1, Math.sqrt(chiSquare / degreesOfFreedom)) : 1;
  if (degreesOfFreedom === 0) warnings.push('The shared sounds give exactly as many arrivals as unknowns: nothing checks the fit. Use more shared sounds.');
  const sigmaOf = (col: number) => (col < 0 ? 0 : Math.sqrt(covariance[col]![col]!) * sigmaScale);
  const fits = recorders.map((recorder, r): RecorderClockFit => {
    const own = fittedObservations.map((o, index) => ({ o, index })).filter(({ o }) => o.recorderIndex === r);
    const rms = own.length === 0 ? Number.NaN : Math.sqrt(own.reduce((sum, { index }) => sum + residualsSeconds[index]! ** 2, 0) / own.length);
    const normalised = own.length === 0 ? Number.NaN : Math.sqrt(own.reduce((sum, { o, index }) => sum + (residualsSeconds[index]! / o.sigmaSeconds) ** 2, 0) / own.length);
    const recorderWarnings: string[] = [];
    if (own.length === 0) recorderWarnings.push(`Recorder '${recorder.name}' heard no shared sound; its clock is set by its prior only.`);
    else if (normalised > POOR_FIT_FACTOR) recorderWarnings.push(`Recorder '${recorder.name}' fits poorly: its residuals are ${normalised.toFixed(1)} times their sigmas (RMS ${(rms * 1e6).toFixed(0)} µs). Check its microphones' positions and that every recorder heard the same sounds.`);
    const { offset, driftPpm } = clockOf(params, r);
    const priorSigma = 1 / Math.sqrt(priorWeight[r]!);
    if (offsetColumn[r]! >= 0 && Math.abs(offset) > 5 * priorSigma) recorderWarnings.push(`Recorder '${recorder.name}': its fitted offset ${offset.toFixed(3)} s is ${(Math.abs(offset) / priorSigma).toFixed(0)} times its prior sigma (${priorSigma.toFixed(3)} s); its stamps are further off than assumed (--offset-sigma).`);
    const clock: RecorderClock = { clockStartSeconds: recorder.clockStartSeconds, offsetSeconds: offset, drift: driftPpm * PPM };
    return {
      name: recorder.name, clock, offsetSigmaSeconds: sigmaOf(offsetColumn[r]!), driftSigma: sigmaOf(driftColumn[r]!) * PPM,
      reference: r === referenceIndex, observationCount: own.length, residualRmsSeconds: rms, warnings: recorderWarnings,
    };
  });
  for (const fit of fits) warnings.push(...fit.warnings);
  // sigma of sound i's unknown t (a position coordinate / c, or the emission time): [Vi + Vi Wᵀ C W Vi]_tt
  const soundSigma = (i: number, t: number) => {
    const { Vi, W } = blocks[i]!;
    const u = Float64Array.from({ length: nc }, (_, p) => W[p]!.reduce((sum, v, a) => sum + v * Vi[a]![t]!, 0));
    let extra = 0;
    for (let p = 0; p < nc; p++) for (let q = 0; q < nc; q++) extra += u[p]! * covariance[p]![q]! * u[q]!;
    return Math.sqrt(Math.max(0, Vi[t]![t]! + extra)) * sigmaScale;
  };
  const emissionSigma = (i: number) => soundSigma(i, dimensions);
  const stateOf = new Map(soundIndexOf.map((k, i) => [k, i]));
  return {
    recorders: fits,
    sounds: sounds.map((sound, k) => {
      const i = stateOf.get(k);
      return i === undefined ? { label: sound.label, emittedSeconds: Number.NaN, sigmaSeconds: Number.NaN } : { label: sound.label, emittedSeconds: states[i]![dimensions]!, sigmaSeconds: emissionSigma(i) };
    }),
    soundPositions: sounds.map((_, k) => {
      const i = stateOf.get(k);
      if (i === undefined) return { eastMeters: Number.NaN, northMeters: Number.NaN, upMeters: Number.NaN };
      const s = states[i]!;
      return { eastMeters: s[0]! * c, northMeters: s[1]! * c, upMeters: dimensions === 3 ? s[2]! * c : soundUpMeters };
    }),
    soundPositionSigmas: sounds.map((_, k) => {
      const i = stateOf.get(k);
      if (i === undefined) return { eastMeters: Number.NaN, northMeters: Number.NaN, upMeters: Number.NaN };
      return { eastMeters: soundSigma(i, 0) * c, northMeters: soundSigma(i, 1) * c, upMeters: dimensions === 3 ? soundSigma(i, 2) * c : 0 };
    }),
    observations: fittedObservations,
    residualsSeconds, chiSquare, degreesOfFreedom, sigmaScale,
    timeBase: `recorder '${recorders[referenceIndex]!.name}' is the reference (offset 0, drift 0): times are on its clock; shared sounds' places and emission times fitted with the clocks`,
    warnings,
  };
}
