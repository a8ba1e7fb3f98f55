// Position fix from pair delays with an honest uncertainty: checks, closed-form and multi-start weighted least squares,
// outlier rejection, ambiguity, linearised budget (and optional Monte Carlo). Metres (local ENU), seconds, m².
// Chan & Ho (1994) and Smith & Abel (1987) starts; Levenberg-Marquardt refinement; covariance (J^T W J)^-1.
import { arrayShape, reflectAcrossAxis } from './arrayShape';
import { buildProblem, relativeTimesForClosedForm } from './buildProblem';
import { chiSquareQuantile, chiSquareUpperTail } from './chiSquare';
import { closedFormStarts } from './closedForm';
import { closureFailures, closureTest, physicalLimitViolations } from './delayChecks';
import { connectedComponents, graphRank } from './delayGraph';
import { errorEllipse, errorEllipsoid } from './errorEllipse';
import { median } from './median';
import { monteCarloCovariance } from './monteCarlo';
import { heightExplainedCost } from './heightNuisance';
import { findSolutions, samePosition, type Candidate } from './multiStart';
import { rejectOutlierRows } from './outlierRejection';
import { conditionNumberSymmetric, toNested } from './smallMatrix';
import { degreesOfFreedom, evaluateCost, updateGeometry, type TdoaProblem } from './tdoaProblem';
import type { DelayMeasurement, Fix, Microphone, PairResidual, Position, SolveOptions, SolveResult } from './types';
import { linearBudget } from './uncertaintyBudget';
import { validateInput } from './validateInput';
import { maxOf, minOf } from '../units';

/** Redundant delays needed before the timing sigma is estimated from the residuals instead of the default. */
export const MIN_DOF_FOR_RESIDUAL_SIGMA = 3;
/** Smallest timing sigma believed when estimated from residuals (noise-free input), seconds. */
const RESIDUAL_SIGMA_FLOOR_SECONDS = 1e-12;

function formatMs(seconds: number): string {
  return `${(seconds * 1e3).toPrecision(4)} ms`;
}

function formatPosition(p: Position): string {
  return `(${p.eastMeters.toFixed(3)}, ${p.northMeters.toFixed(3)}, ${p.upMeters.toFixed(3)}) m`;
}

function addMatrices(n: number, ...matrices: Float64Array[]): Float64Array {
  const out = new Float64Array(n * n);
  for (const m of matrices) for (let i = 0; i < n * n; i++) out[i] += m[i];
  return out;
}

/** Solves for the source position; see types.ts for the options and the result. Never throws on bad geometry. */
export function solveFix(microphones: readonly Microphone[], delays: readonly DelayMeasurement[], options: SolveOptions): SolveResult {
  const invalid = validateInput(microphones, delays, options);
  if (invalid.length > 0) return { status: 'invalid-input', warnings: invalid };
  const warnings: string[] = [];
  const dims = options.dimensions;
  const speed = options.speedMetersPerSecond;
  const speedSigma = options.speedSigmaMetersPerSecond ?? 0;
  const confidence = options.confidence ?? 0.95;
  const defaultSigma = options.defaultTimingSigmaSeconds ?? 1e-4;
  const rejectOutliers = options.rejectOutliers ?? true;
  const model = options.timingModel ?? 'independent-pairs';
  const level = options.residualTestLevel ?? 0.01;
  const conditionLimit = options.conditionNumberLimit ?? 1e6;
  const sourceUpMeters = options.sourceUpMeters ?? microphones.reduce((sum, mic) => sum + mic.upMeters, 0) / Math.max(microphones.length, 1);
  const heightSigma = dims === 2 ? options.sourceUpSigmaMeters ?? 0 : 0;
  const label = (i: number): string => microphones[i].label || `#${i}`;
  const pairName = (k: number): string => `pair ${label(delays[k].indexA)}-${label(delays[k].indexB)} (delays[${k}])`;

  if (microphones.length < 2 || delays.length === 0) {
    return { status: 'insufficient', warnings: ['No delays to solve: a fix needs delays between at least 3 microphones (2-D) or 4 (3-D).'] };
  }

  // Timing sigmas. Pair delays given with their own sigmas are treated as independent (no shared-channel correlation).
  const statedCount = delays.filter((d) => d.sigmaSeconds !== undefined).length;
  const anyStated = statedCount > 0;
  const fillSigma = anyStated ? median(delays.filter((d) => d.sigmaSeconds !== undefined).map((d) => d.sigmaSeconds as number)) : defaultSigma;
  if (anyStated && statedCount < delays.length) {
    warnings.push(`${delays.length - statedCount} of ${delays.length} delays came without a sigma; they were given the median stated sigma, ${formatMs(fillSigma)}.`);
  }
  const pairSigma = Float64Array.from(delays, (d) => d.sigmaSeconds ?? fillSigma);

  // Physical limit and triplet closure.
  const reasons: (string | undefined)[] = delays.map(() => undefined);
  const limitViolations = physicalLimitViolations(microphones, delays, speed, speedSigma, (k) => options.lagToleranceSeconds ?? 3 * pairSigma[k]);
  for (const violation of limitViolations) {
    const k = violation.delayIndex;
    const text = `|delay| = ${formatMs(Math.abs(delays[k].delaySeconds))} exceeds the physical limit d/c + tolerance = ${formatMs(violation.limitSeconds)}`;
    if (rejectOutliers) {
      reasons[k] = `${text}; dropped`;
      warnings.push(`Dropped ${pairName(k)}: ${text}. Check the channel order and the lag search range.`);
    } else {
      warnings.push(`${pairName(k)}: ${text}; kept because rejectOutliers is false.`);
    }
  }
  const usable = reasons.map((reason) => reason === undefined);
  const closures = closureFailures(microphones.length, delays, usable, (k) => pairSigma[k]);
  if (closures.length > 0) {
    const shown = closures.slice(0, 5).map((f) => {
      const [a, b, c] = f.microphones.map(label);
      return `${a}-${b} + ${b}-${c} + ${c}-${a} = ${formatMs(f.misclosureSeconds)} (${(Math.abs(f.misclosureSeconds) / f.sigmaSeconds).toFixed(1)} sigma)`;
    });
    const counts = new Map<number, number>();
    for (const f of closures) for (const k of f.delayIndices) counts.set(k, (counts.get(k) ?? 0) + 1);
    const worst = [...counts.entries()].sort((x, y) => y[1] - x[1]).slice(0, 3).map(([k, count]) => `${pairName(k)} in ${count}`);
    warnings.push(
      `${closures.length} triplet(s) of delays do not close within 4 sigma: ${shown.join('; ')}${closures.length > 5 ? '; ...' : ''}. ` +
        `Pairs most often involved: ${worst.join(', ')}.`,
    );
  }

  // Rows of the least-squares problem.
  const arrivalSigma = anyStated ? Math.sqrt(Array.from(pairSigma).reduce((s, v) => s + v * v, 0) / pairSigma.length / 2) : defaultSigma;
  if (model === 'arrival-times' && anyStated) {
    const spread = maxOf(pairSigma) / minOf(pairSigma);
    if (spread > 1.01) warnings.push(`The arrival-time model assumes one sigma for every microphone; the stated delay sigmas differ (up to ${spread.toFixed(2)}x), their RMS was used.`);
  }
  const built = buildProblem({ microphones, delays, usable, pairSigmaSeconds: pairSigma, arrivalSigmaSeconds: arrivalSigma, dimensions: dims, speedMetersPerSecond: speed, sourceUpMeters, model });
  const problem = built.problem;
  for (const k of built.disconnectedDelays) {
    reasons[k] = 'not connected to the largest group of microphones';
    warnings.push(`Left out ${pairName(k)}: it does not connect to the largest group of microphones with delays.`);
  }

  const insufficient = (message: string): SolveResult => ({ status: 'insufficient', warnings: [...warnings, message] });
  const needed = dims === 2 ? 'a 2-D fix needs 2 independent delays (3 microphones)' : 'a 3-D fix needs 3 independent delays (4 microphones)';
  const rankOf = (p: TdoaProblem): number => {
    if (p.mode === 'arrival-times') {
      let count = 0;
      for (let k = 0; k < p.rowCount; k++) count += p.active[k];
      return count - 1;
    }
    return graphRank(connectedComponents(p.micCount, { a: p.rowA, b: p.rowB, active: p.active }));
  };
  const usedMics = (): number[] => {
    const seen = new Set<number>();
    for (let k = 0; k < problem.rowCount; k++) {
      if (!problem.active[k]) continue;
      seen.add(problem.rowA[k]);
      if (problem.rowB[k] >= 0) seen.add(problem.rowB[k]);
    }
    return [...seen].sort((a, b) => a - b);
  };
  const groups = connectedComponents(microphones.length, { a: delays.map((d) => d.indexA), b: delays.map((d) => d.indexB), active: usable.map((u) => (u ? 1 : 0)) });
  if (groups.length > 1 && graphRank(groups.slice(0, 1)) < dims && graphRank(groups) >= dims) {
    const named = groups.map((group) => group.map(label).join('-')).join('; ');
    return insufficient(
      `The pairs form ${groups.length} separate groups of microphones with no microphone in common (${named}): no group alone fixes a point ` +
        `(two microphones give a hyperbola) and one group's delays cannot be checked against another's; ${needed} within one group. ` +
        'Measure pairs that link the groups.',
    );
  }
  const rank = rankOf(problem);
  if (rank < dims) {
    if (usedMics().length === 2) return insufficient(`Two microphones give one delay: the source lies somewhere on a hyperbola, not at a point; ${needed}.`);
    return insufficient(`Only ${Math.max(rank, 0)} independent delay(s) are usable; ${needed}.`);
  }
  const shape = arrayShape(dims, problem.micEast, problem.micNorth, problem.micUp, usedMics());
  if (shape.degeneracy === 'point') {
    return insufficient('All microphones used share one horizontal position: their delays give a distance, not a direction. Spread the microphones out.');
  }
  if (shape.degeneracy === 'line') {
    return insufficient('The microphones used are collinear: in 3-D they fix the distance along and from their line, not the direction around it. Add a microphone off the line, or solve in 2-D.');
  }

  const solve = (extra: readonly ArrayLike<number>[] = []): Candidate[] => {
    const times = relativeTimesForClosedForm(problem);
    const starts = times ? closedFormStarts(problem, times) : [];
    return findSolutions(problem, shape, starts, { extraStarts: extra });
  };
  let candidates = solve();
  if (candidates.length === 0) {
    return insufficient('No position fits these delays within 10^4 array apertures: the source is too far away for a fix (the array gives a bearing at most), or the delays are inconsistent.');
  }

  const sigmaMode = (): 'stated' | 'residuals' | 'default' => (anyStated ? 'stated' : degreesOfFreedom(problem) >= MIN_DOF_FOR_RESIDUAL_SIGMA ? 'residuals' : 'default');

  // Outlier rejection (leave-one-out) when the residual test fails.
  const droppedRowReasons = new Map<number, string>();
  if (rejectOutliers && degreesOfFreedom(problem) >= 2) {
    const initialDof = degreesOfFreedom(problem);
    const describeRow = (row: number): string => (problem.mode === 'independent-pairs' ? pairName(built.rowDelay[row]) : `the arrival at ${label(problem.rowA[row])}`);
    const outcome = rejectOutlierRows(problem, candidates[0].position, {
      sigmaMode: sigmaMode(),
      level,
      explainedCost: (q) => heightExplainedCost(problem, q, heightSigma),
      maxDrops: Math.max(1, Math.floor(initialDof / 2)),
      describeRow,
      canDrop: (row) => {
        problem.active[row] = 0;
        const ok = degreesOfFreedom(problem) >= 1 && rankOf(problem) >= dims;
        problem.active[row] = 1;
        return ok;
      },
    });
    warnings.push(...outcome.warnings);
    for (const drop of outcome.dropped) {
      const unit = sigmaMode() === 'residuals' ? '' : ' (chi-square)';
      const text = `outlier: leaving it out lowered the weighted residual sum${unit} from ${drop.costBefore.toPrecision(4)} to ${drop.costAfter.toPrecision(4)}`;
      droppedRowReasons.set(drop.row, text);
      warnings.push(`Dropped ${describeRow(drop.row)} as an ${text}.`);
    }
    if (outcome.dropped.length > 0) candidates = solve([outcome.position]);
    if (candidates.length === 0) return insufficient('After dropping outliers no position fits the remaining delays.');
  }

  // Final estimate, sigma and chi-square.
  const best = candidates[0];
  const p = best.position;
  const dof = degreesOfFreedom(problem);
  const cost = evaluateCost(problem, p);
  const mode = sigmaMode();
  let weightScale = 1;
  let timingSigmaSeconds: number;
  const rowSigmaAssumed = model === 'arrival-times' ? arrivalSigma : defaultSigma;
  if (mode === 'residuals') {
    const estimated = Math.max(rowSigmaAssumed * Math.sqrt(cost / dof), RESIDUAL_SIGMA_FLOOR_SECONDS);
    weightScale = (rowSigmaAssumed / estimated) ** 2;
    timingSigmaSeconds = estimated;
    warnings.push(`No delay stated a sigma: the timing sigma, ${formatMs(estimated)}, was estimated from the residuals (${dof} redundant), so the chi-square test below cannot judge it.`);
  } else if (mode === 'default') {
    timingSigmaSeconds = rowSigmaAssumed;
    warnings.push(`No delay stated a sigma and only ${dof} delay(s) are redundant: the default timing sigma, ${formatMs(defaultSigma)}, was assumed.`);
  } else {
    let sum = 0;
    let count = 0;
    for (let row = 0; row < problem.rowCount; row++) {
      if (!problem.active[row]) continue;
      sum += 1 / problem.rowWeight[row];
      count++;
    }
    timingSigmaSeconds = Math.sqrt(sum / Math.max(count, 1));
  }
  // 2-D with the source height known within a sigma: the height is a nuisance parameter of the test, not a misfit.
  const statistic = mode === 'residuals' ? cost * weightScale : Math.max(0, cost * weightScale - heightExplainedCost(problem, p, heightSigma, weightScale));
  const pValue = chiSquareUpperTail(statistic, dof);
  const consistent = pValue >= level;
  if (dof === 0) warnings.push('No redundant delays: the fit passes through every delay exactly and cannot be checked.');
  else if (!consistent) {
    warnings.push(`The residuals are larger than the stated sigmas allow (chi-square ${statistic.toPrecision(4)} on ${dof} degrees of freedom, p = ${pValue.toPrecision(2)}): sigmas too small, a bad delay, or a wrong speed of sound or survey.`);
  }

  // Budget and conditioning.
  const budget = linearBudget(problem, p, {
    weightScale,
    speedSigmaMetersPerSecond: speedSigma,
    surveySigmaMeters: microphones.map((mic) => mic.surveySigmaMeters ?? 0),
    sourceUpSigmaMeters: dims === 2 ? options.sourceUpSigmaMeters ?? 0 : 0,
  });
  const conditionNumber = conditionNumberSymmetric(budget.normal, dims);
  const covariance = addMatrices(dims, budget.timing, budget.speed, budget.survey, budget.sourceHeight);
  if (!covariance.every(Number.isFinite)) {
    return { status: 'ill-conditioned', warnings: [...warnings, 'The normal matrix is singular at the solution: no position or covariance can be given.'] };
  }

  // Ambiguity: exact mirror of a collinear (2-D) or coplanar (3-D) array, or a second solution that fits as well.
  const positionOf = (q: ArrayLike<number>): Position => ({ eastMeters: q[0], northMeters: q[1], upMeters: dims === 3 ? q[2] : sourceUpMeters });
  let alternative: Position | undefined;
  const mirrorAxis = shape.degeneracy === 'collinear' ? 1 : shape.degeneracy === 'coplanar' ? 2 : -1;
  if (mirrorAxis >= 0) {
    const mirror = reflectAcrossAxis(shape, p, mirrorAxis);
    if (!samePosition(shape, mirror, p)) {
      alternative = positionOf(mirror);
      warnings.push(
        `The microphones are ${shape.degeneracy}: the mirror image ${formatPosition(alternative)} fits the delays exactly as well. ` +
          `Add a microphone off the ${dims === 2 ? 'line' : 'plane'} to tell them apart.`,
      );
    }
  } else {
    const flooredScale = Math.min(weightScale, (rowSigmaAssumed / RESIDUAL_SIGMA_FLOOR_SECONDS) ** 2);
    const threshold = chiSquareQuantile(0.95, 1);
    for (const other of candidates.slice(1)) {
      // Distinct converged solutions (multiStart keeps only those apart by more than 1e-6 of the scale) that fit as well.
      if ((other.cost - best.cost) * flooredScale >= threshold) continue;
      alternative = positionOf(other.position);
      warnings.push(
        `A second position, ${formatPosition(alternative)}, fits the delays about as well (chi-square difference ${((other.cost - best.cost) * flooredScale).toFixed(2)}): ` +
          'the hyperbolae cross twice. More microphones, or microphones around the source, remove the ambiguity.',
      );
      break;
    }
  }
  const illConditioned = !(conditionNumber <= conditionLimit);
  if (illConditioned) {
    warnings.push(
      `The normal matrix is nearly singular (condition number ${conditionNumber.toExponential(2)} > ${conditionLimit.toExponential(0)}): ` +
        (dims === 3 ? 'the geometry hardly constrains one direction (e.g. height with microphones on one plane; consider 2-D mode), ' : 'the geometry hardly constrains one direction (e.g. range to a distant source), ') +
        'so the position is poorly determined along the ellipse major axis.',
    );
  }

  // Residuals per input delay at the fix.
  updateGeometry(problem, p);
  const residuals: PairResidual[] = delays.map((delay, k) => {
    const modelSeconds = (problem.distance[delay.indexA] - problem.distance[delay.indexB]) / speed;
    const residual: PairResidual = { indexA: delay.indexA, indexB: delay.indexB, residualSeconds: delay.delaySeconds - modelSeconds, used: true };
    let reason = reasons[k];
    if (reason === undefined && !built.delaysInRows.has(k)) reason = 'not used';
    if (reason === undefined) {
      for (const [row, text] of droppedRowReasons) {
        if (problem.mode === 'independent-pairs' && built.rowDelay[row] === k) reason = text;
        if (problem.mode === 'arrival-times' && (problem.rowA[row] === delay.indexA || problem.rowA[row] === delay.indexB)) {
          reason = `the arrival time at ${label(problem.rowA[row])} was dropped as an ${text}`;
        }
      }
    }
    if (reason !== undefined) {
      residual.used = false;
      residual.reason = reason;
    }
    return residual;
  });
  const used = residuals.filter((r) => r.used);

  // Consistency at the final sigma: the chi-square test, and the closure of the delays still used (in the arrival-time
  // model the pairs' closure is not part of the chi-square).
  const finalPairSigma = (k: number): number => pairSigma[k] / Math.sqrt(weightScale);
  const closure = closureTest(microphones.length, delays, residuals.map((r) => r.used), finalPairSigma, level);
  if (closure.failures.length > 0) {
    const worst = closure.failures.reduce((a, b) => (Math.abs(a.misclosureSeconds) / a.sigmaSeconds >= Math.abs(b.misclosureSeconds) / b.sigmaSeconds ? a : b));
    const [a, b, c] = worst.microphones.map(label);
    warnings.push(
      `${closure.failures.length} of ${closure.tested} triplet(s) of the delays used still do not close at the test level (limit ${closure.sigmaLimit.toFixed(2)} sigma); ` +
        `worst ${a}-${b} + ${b}-${c} + ${c}-${a} = ${formatMs(worst.misclosureSeconds)} (${(Math.abs(worst.misclosureSeconds) / worst.sigmaSeconds).toFixed(1)} sigma).`,
    );
  }
  const inconsistent = (dof > 0 && !consistent) || closure.failures.length > 0;
  if (inconsistent) {
    warnings.push(
      'Status inconsistent: the delays contradict each other beyond their sigmas' +
        (mode === 'default' ? ` (the assumed ${formatMs(defaultSigma)}; state sigma_s or --timing-sigma if yours is larger)` : '') +
        ', so the position and its ellipse cannot be trusted. Check the channel order, the peaks chosen (echoes) and the survey.',
    );
  }
  const status = inconsistent ? 'inconsistent' : alternative ? 'ambiguous' : illConditioned ? 'ill-conditioned' : 'ok';
  const residualRmsSeconds = used.length > 0 ? Math.sqrt(used.reduce((s, r) => s + r.residualSeconds ** 2, 0) / used.length) : 0;

  const covarianceNested = toNested(covariance, dims);
  const horizontal = [
    [covariance[0], covariance[1]],
    [covariance[dims], covariance[dims + 1]],
  ];
  let timingTrace = 0;
  for (let i = 0; i < dims; i++) timingTrace += budget.timing[i * dims + i];
  const fix: Fix = {
    ...positionOf(p),
    covarianceMeters2: covarianceNested,
    ellipse: errorEllipse(horizontal, confidence),
    residuals,
    residualRmsSeconds,
    chiSquare: { statistic, degreesOfFreedom: dof, pValue, consistent },
    gdop: Math.sqrt(timingTrace) / (speed * timingSigmaSeconds),
    crlbCovarianceMeters2: toNested(budget.timing, dims),
    sigmaSource: mode,
    timingSigmaSeconds,
    pairsUsed: used.length,
    droppedPairs: residuals.filter((r) => !r.used),
    budget: {
      timingMeters2: toNested(budget.timing, dims),
      speedMeters2: toNested(budget.speed, dims),
      surveyMeters2: toNested(budget.survey, dims),
      sourceHeightMeters2: toNested(budget.sourceHeight, dims),
    },
    conditionNumber,
  };
  if (problem.mode === 'arrival-times' && droppedRowReasons.size > 0) fix.droppedArrivals = [...droppedRowReasons.keys()].map((row) => problem.rowA[row]);
  if (dims === 3) fix.ellipsoid = errorEllipsoid(covarianceNested, confidence);
  if (alternative) fix.alternative = alternative;

  if (options.monteCarlo) {
    const rowSigma = Float64Array.from(problem.rowWeight, (w) => 1 / Math.sqrt(w * weightScale));
    const result = monteCarloCovariance(problem, p, {
      trials: options.monteCarlo.trials,
      seed: options.monteCarlo.seed,
      rowSigmaSeconds: rowSigma,
      speedSigmaMetersPerSecond: speedSigma,
      surveySigmaMeters: microphones.map((mic) => mic.surveySigmaMeters ?? 0),
      sourceUpSigmaMeters: dims === 2 ? options.sourceUpSigmaMeters ?? 0 : 0,
    });
    fix.monteCarloCovarianceMeters2 = toNested(result.covariance, dims);
    if (result.convergedTrials < options.monteCarlo.trials) {
      warnings.push(`Monte Carlo: ${options.monteCarlo.trials - result.convergedTrials} of ${options.monteCarlo.trials} trials did not converge and were left out.`);
    }
  }

  if (options.arrivalTimesSeconds) {
    let sum = 0;
    let count = 0;
    options.arrivalTimesSeconds.forEach((time, i) => {
      if (time === undefined) return;
      sum += time - problem.distance[i] / speed;
      count++;
    });
    if (count > 0) fix.emissionTimeSeconds = sum / count;
  }
  return { status, fix, warnings };
}

