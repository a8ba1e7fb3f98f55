// The graph of measured pairs: connected components, its rank (independent delays), and the weighted least-squares
// reduction of any set of pair delays to relative arrival times against one reference (seconds; weights in 1/s²).
// Reduction: minimise sum w_k (tau_k - (t_a - t_b))² with t_ref = 0, i.e. solve the reduced graph Laplacian system.
import { choleskySolve } from './smallMatrix';

export interface PairEdges {
  readonly a: ArrayLike<number>;
  readonly b: ArrayLike<number>;
  readonly active: ArrayLike<number>;
}

/** Components of the graph of active edges over `micCount` microphones; isolated microphones are left out. */
export function connectedComponents(micCount: number, edges: PairEdges): number[][] {
  const parent = Int32Array.from({ length: micCount }, (_, i) => i);
  const find = (i: number): number => {
    while (parent[i] !== i) {
      parent[i] = parent[parent[i]];
      i = parent[i];
    }
    return i;
  };
  const touched = new Uint8Array(micCount);
  for (let k = 0; k < edges.a.length; k++) {
    if (!edges.active[k]) continue;
    const ra = find(edges.a[k]);
    const rb = find(edges.b[k]);
    touched[edges.a[k]] = 1;
    touched[edges.b[k]] = 1;
    if (ra !== rb) parent[ra] = rb;
  }
  const groups = new Map<number, number[]>();
  for (let i = 0; i < micCount; i++) {
    if (!touched[i]) continue;
    const root = find(i);
    const group = groups.get(root);
    if (group) group.push(i);
    else groups.set(root, [i]);
  }
  return [...groups.values()].sort((x, y) => y.length - x.length || x[0] - y[0]);
}

/** Number of independent delays in the graph: sum over components of (size - 1). */
export function graphRank(components: readonly (readonly number[])[]): number {
  return components.reduce((sum, group) => sum + group.length - 1, 0);
}

export interface RelativeTimes {
  /** Microphones of the component, the reference first. */
  readonly microphones: number[];
  /** t_i - t_ref for microphones[1..], seconds. */
  readonly relativeSeconds: Float64Array;
  /** Information matrix of relativeSeconds (inverse covariance, 1/s²), (m-1) x (m-1) row-major. */
  readonly information: Float64Array;
  /** Weighted sum of squared closure residuals of the reduction (unitless when weights are 1/sigma²). */
  readonly residualCost: number;
}

/**
 * Reduces the active pair delays within one component to arrival times relative to `reference` (which must be in
 * the component). Pairs are treated as independent with weights 1/sigma². Null when the Laplacian is singular.
 */
export function reduceToReference(
  component: readonly number[],
  reference: number,
  edges: PairEdges,
  delaySeconds: ArrayLike<number>,
  weight: ArrayLike<number>,
): RelativeTimes | null {
  const microphones = [reference, ...component.filter((i) => i !== reference)];
  const m = microphones.length;
  const position = new Map<number, number>();
  microphones.forEach((mic, index) => position.set(mic, index));
  const laplacian = new Float64Array(m * m);
  const rhs = new Float64Array(m);
  for (let k = 0; k < edges.a.length; k++) {
    if (!edges.active[k]) continue;
    const ia = position.get(edges.a[k]);
    const ib = position.get(edges.b[k]);
    if (ia === undefined || ib === undefined) continue;
    const w = weight[k];
    laplacian[ia * m + ia] += w;
    laplacian[ib * m + ib] += w;
    laplacian[ia * m + ib] -= w;
    laplacian[ib * m + ia] -= w;
    rhs[ia] += w * delaySeconds[k];
    rhs[ib] -= w * delaySeconds[k];
  }
  const size = m - 1;
  const information = new Float64Array(size * size);
  const reducedRhs = new Float64Array(size);
  for (let i = 0; i < size; i++) {
    reducedRhs[i] = rhs[i + 1];
    for (let j = 0; j < size; j++) information[i * size + j] = laplacian[(i + 1) * m + (j + 1)];
  }
  const factor = information.slice();
  const relativeSeconds = new Float64Array(size);
  if (size > 0 && !choleskySolve(factor, size, reducedRhs, relativeSeconds)) return null;
  let residualCost = 0;
  const time = (index: number): number => (index === 0 ? 0 : relativeSeconds[index - 1]);
  for (let k = 0; k < edges.a.length; k++) {
    if (!edges.active[k]) continue;
    const ia = position.get(edges.a[k]);
    const ib = position.get(edges.b[k]);
    if (ia === undefined || ib === undefined) continue;
    const r = delaySeconds[k] - (time(ia) - time(ib));
    residualCost += weight[k] * r * r;
  }
  return { microphones, relativeSeconds, information, residualCost };
}
