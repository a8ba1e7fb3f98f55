// Turns usable pair delays into the rows of the least-squares problem (pairs, or per-microphone arrival times for the
// `arrival-times` model) and the reference-based relative times the closed-form starts need. Seconds, metres.
import { connectedComponents, reduceToReference, type RelativeTimes } from './delayGraph';
import { createProblem, type TdoaProblem } from './tdoaProblem';
import type { DelayMeasurement, Microphone, TimingModel } from './types';

export interface BuiltProblem {
  problem: TdoaProblem;
  /** Pair rows: the delay index of each row. Arrival rows: -1. */
  rowDelay: Int32Array;
  /** Delay indices that fed the rows (arrival model: the pairs inside the reduced component). */
  delaysInRows: Set<number>;
  /** Delay indices left out because they do not connect to the largest group (arrival model only). */
  disconnectedDelays: number[];
}

export interface BuildInputs {
  microphones: readonly Microphone[];
  delays: readonly DelayMeasurement[];
  usable: readonly boolean[];
  /** Sigma of each delay, seconds. */
  pairSigmaSeconds: ArrayLike<number>;
  /** Arrival model: the per-microphone sigma, seconds. */
  arrivalSigmaSeconds: number;
  dimensions: 2 | 3;
  speedMetersPerSecond: number;
  sourceUpMeters: number;
  model: TimingModel;
}

export function buildProblem(inputs: BuildInputs): BuiltProblem {
  const { microphones, delays, usable } = inputs;
  const geometry = {
    dimensions: inputs.dimensions,
    speedMetersPerSecond: inputs.speedMetersPerSecond,
    sourceUpMeters: inputs.sourceUpMeters,
    micEast: microphones.map((mic) => mic.eastMeters),
    micNorth: microphones.map((mic) => mic.northMeters),
    micUp: microphones.map((mic) => mic.upMeters),
    mode: inputs.model,
  };
  if (inputs.model === 'independent-pairs') {
    const rows = delays.map((_, k) => k).filter((k) => usable[k]);
    const problem = createProblem({
      ...geometry,
      rowA: rows.map((k) => delays[k].indexA),
      rowB: rows.map((k) => delays[k].indexB),
      rowValueSeconds: rows.map((k) => delays[k].delaySeconds),
      rowWeight: rows.map((k) => 1 / inputs.pairSigmaSeconds[k] ** 2),
    });
    return { problem, rowDelay: Int32Array.from(rows), delaysInRows: new Set(rows), disconnectedDelays: [] };
  }
  // Arrival-time model: relative arrival times of the largest connected group, from all its pairs (equal weights,
  // since every pair has the same sigma sqrt(2) sigma_arrival); the group's first microphone is the time origin.
  const edges = {
    a: delays.map((d) => d.indexA),
    b: delays.map((d) => d.indexB),
    active: usable.map((u) => (u ? 1 : 0)),
  };
  const components = connectedComponents(microphones.length, edges);
  const group = components[0] ?? [];
  const inGroup = new Set(group);
  const delaysInRows = new Set<number>();
  const disconnectedDelays: number[] = [];
  delays.forEach((d, k) => {
    if (!usable[k]) return;
    if (inGroup.has(d.indexA) && inGroup.has(d.indexB)) delaysInRows.add(k);
    else disconnectedDelays.push(k);
  });
  const times = group.length >= 2 ? reduceToReference(group, group[0], edges, delays.map((d) => d.delaySeconds), new Float64Array(delays.length).fill(1)) : null;
  const mics = times ? times.microphones : [];
  const values = mics.map((_, i) => (i === 0 ? 0 : times!.relativeSeconds[i - 1]));
  const problem = createProblem({
    ...geometry,
    rowA: mics,
    rowB: mics.map(() => -1),
    rowValueSeconds: values,
    rowWeight: mics.map(() => 1 / inputs.arrivalSigmaSeconds ** 2),
  });
  return { problem, rowDelay: new Int32Array(mics.length).fill(-1), delaysInRows, disconnectedDelays };
}

/**
 * Relative times against one reference for the closed-form starts, from the problem's active rows: pairs reduced by
 * weighted least squares over the largest connected group; arrival rows used directly with their centred information.
 */
export function relativeTimesForClosedForm(problem: TdoaProblem): RelativeTimes | null {
  if (problem.mode === 'independent-pairs') {
    const edges = { a: problem.rowA, b: problem.rowB, active: problem.active };
    const group = connectedComponents(problem.micCount, edges)[0];
    if (!group || group.length < 2) return null;
    // Reference: the best-connected microphone of the group.
    const degree = new Float64Array(problem.micCount);
    for (let k = 0; k < problem.rowCount; k++) {
      if (!problem.active[k]) continue;
      degree[problem.rowA[k]] += problem.rowWeight[k];
      degree[problem.rowB[k]] += problem.rowWeight[k];
    }
    const reference = group.reduce((best, mic) => (degree[mic] > degree[best] ? mic : best), group[0]);
    return reduceToReference(group, reference, edges, problem.rowValueSeconds, problem.rowWeight);
  }
  const rows: number[] = [];
  for (let k = 0; k < problem.rowCount; k++) if (problem.active[k]) rows.push(k);
  if (rows.length < 2) return null;
  const m = rows.length - 1;
  let sumWeight = 0;
  for (const k of rows) sumWeight += problem.rowWeight[k];
  const information = new Float64Array(m * m);
  const relativeSeconds = new Float64Array(m);
  for (let i = 0; i < m; i++) {
    const ki = rows[i + 1];
    relativeSeconds[i] = problem.rowValueSeconds[ki] - problem.rowValueSeconds[rows[0]];
    for (let j = 0; j < m; j++) {
      const kj = rows[j + 1];
      information[i * m + j] = (i === j ? problem.rowWeight[ki] : 0) - (problem.rowWeight[ki] * problem.rowWeight[kj]) / sumWeight;
    }
  }
  return { microphones: rows.map((k) => problem.rowA[k]), relativeSeconds, information, residualCost: 0 };
}
