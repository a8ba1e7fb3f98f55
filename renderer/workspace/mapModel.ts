// From the workspace to the map's props: microphones, the selected event's hyperbolae, the session's fixes and
// the precision-map overlay. Pure (memoised by the caller).
import { createSrpPlan, precisionMap, srpGridFromBounds, srpMap } from '../../core/locate';
import type { CorrelationPlots } from '../../core/overview';
import type { Verdict } from '../../core/locate';
import type { LocatedEvent } from '../../core/pipeline';
import type { ProjectDocument } from '../../core/project';
import type { MapFix, MapHyperbola, MapMicrophone, MapOverlay } from '../map';
import { maxOf, minOf } from '../../core/units';
import { slidingMaximum } from './lagPooling';

export function mapMicrophones(document: ProjectDocument): MapMicrophone[] {
  return document.array.microphones.map((m) => ({ label: m.label, channel: m.channel, eastMeters: m.eastMeters, northMeters: m.northMeters, upMeters: m.upMeters }));
}

/** Quality 0..1 from the correlation's peak-to-second ratio: 1 at a ratio of 5 or more; 0 for pairs left out. */
function pairQuality(peakToSecondRatio: number, used: boolean): number {
  if (!used) return 0;
  return Math.max(0, Math.min(1, (peakToSecondRatio - 1) / 4));
}

export function mapHyperbolae(located: LocatedEvent | undefined): MapHyperbola[] {
  if (located === undefined) return [];
  const dropped = new Set(located.reduced.droppedPairs.map((p) => `${p.indexA}-${p.indexB}`));
  return located.pairs.map((pair) => ({ indexA: pair.indexA, indexB: pair.indexB, delaySeconds: pair.delaySeconds, quality: pairQuality(pair.peakToSecondRatio, !dropped.has(`${pair.indexA}-${pair.indexB}`)) }));
}

/** The session's fixes for the map, each with its verdict (`verdicts`: one per event, in the order of `events`). */
export function mapFixes(events: readonly LocatedEvent[], selectedIndex: number | undefined, verdicts: ReadonlyArray<Pick<Verdict, 'grade' | 'reason'>>): MapFix[] {
  const fixes: MapFix[] = [];
  events.forEach((located, index) => {
    const fix = located.solve.fix;
    if (fix === undefined) return;
    const verdict = verdicts[index];
    const entry: MapFix = { id: `event-${index}`, label: `${located.event.index + 1}`, status: located.solve.status, eastMeters: fix.eastMeters, northMeters: fix.northMeters, upMeters: fix.upMeters, ellipse: fix.ellipse, selected: index === selectedIndex };
    if (verdict !== undefined) Object.assign(entry, { verdict: verdict.grade, verdictReason: verdict.reason });
    if (fix.alternative !== undefined) entry.alternative = { eastMeters: fix.alternative.eastMeters, northMeters: fix.alternative.northMeters };
    fixes.push(entry);
  });
  return fixes;
}

export function planeHeightMeters(document: ProjectDocument, located: LocatedEvent | undefined): number {
  if (located?.solve.fix !== undefined) return located.solve.fix.upMeters;
  if (document.settings.sourceUpMeters !== undefined) return document.settings.sourceUpMeters;
  return meanUpMeters(document.array.microphones);
}

/** The mean height of the microphones (0 for none). */
export function meanUpMeters(microphones: readonly { upMeters: number }[]): number {
  return microphones.length === 0 ? 0 : microphones.reduce((sum, m) => sum + m.upMeters, 0) / microphones.length;
}

/** The square the overlays cover: three times the array's larger extent (at least 20 m) around its centre. */
function overlaySquare(mics: readonly { eastMeters: number; northMeters: number }[]) {
  const easts = mics.map((m) => m.eastMeters);
  const norths = mics.map((m) => m.northMeters);
  const span = Math.max(20, maxOf(easts) - minOf(easts), maxOf(norths) - minOf(norths));
  const centreEast = (maxOf(easts) + minOf(easts)) / 2;
  const centreNorth = (maxOf(norths) + minOf(norths)) / 2;
  return { sideMeters: 3 * span, minEastMeters: centreEast - 1.5 * span, maxEastMeters: centreEast + 1.5 * span, minNorthMeters: centreNorth - 1.5 * span, maxNorthMeters: centreNorth + 1.5 * span };
}

const PRECISION_TIMING_SIGMA_SECONDS = 50e-6;

/**
 * Scales `values` in place so the largest finite one is 1 (the minimum is left where it falls, so 0 keeps meaning no
 * coherent power); returns the index of that largest value, or undefined when none is finite and positive.
 */
export function normaliseToPeak(values: Float64Array): number | undefined {
  let best = -1;
  for (let k = 0; k < values.length; k++) if (Number.isFinite(values[k]!) && (best < 0 || values[k]! > values[best]!)) best = k;
  if (best < 0 || !(values[best]! > 0)) return undefined;
  const peak = values[best]!;
  for (let k = 0; k < values.length; k++) values[k] = values[k]! / peak;
  return best;
}

/** Expected 1-sigma horizontal error over the array's surroundings for a given arrival-time sigma (CRLB). */
export function precisionOverlay(document: ProjectDocument, speedMetersPerSecond: number, cells = 120): MapOverlay | undefined {
  const mics = document.array.microphones;
  if (mics.length < 3) return undefined;
  const square = overlaySquare(mics);
  const step = square.sideMeters / cells;
  const grid = { eastStartMeters: square.minEastMeters + step / 2, northStartMeters: square.minNorthMeters + step / 2, eastStepMeters: step, northStepMeters: step, columns: cells, rows: cells, upMeters: planeHeightMeters(document, undefined) };
  const output = { horizontalErrorMeters: new Float64Array(cells * cells), gdop: new Float64Array(cells * cells) };
  try {
    precisionMap(mics.map((m) => ({ label: m.label, eastMeters: m.eastMeters, northMeters: m.northMeters, upMeters: m.upMeters })), grid, { speedMetersPerSecond, timingSigmaSeconds: PRECISION_TIMING_SIGMA_SECONDS, dimensions: 2, timingModel: 'arrival-times' }, output);
  } catch {
    return undefined;
  }
  return {
    kind: 'precision',
    grid: { firstEastMeters: grid.eastStartMeters, stepEastMeters: step, countEast: cells, firstNorthMeters: grid.northStartMeters, stepNorthMeters: step, countNorth: cells },
    values: output.horizontalErrorMeters,
    unitLabel: `expected 1-σ error, m (arrival σ ${PRECISION_TIMING_SIGMA_SECONDS * 1e6} µs)`,
  };
}

/**
 * Steered-response power (SRP-PHAT, DiBiase 2000) of the selected event over the array's surroundings, from its pair
 * correlations pooled over each cell's lags (Cobos et al. 2011), normalised to its peak (1 at the peak, which is marked).
 */
export function srpOverlay(document: ProjectDocument, plots: CorrelationPlots | undefined, speedMetersPerSecond: number, planeUpMeters: number, cells = 150): MapOverlay | undefined {
  const mics = document.array.microphones;
  if (plots === undefined || mics.length < 3 || plots.pairs.length === 0) return undefined;
  const { minEastMeters, maxEastMeters, minNorthMeters, maxNorthMeters } = overlaySquare(mics);
  try {
    const grid = srpGridFromBounds({ minEastMeters, maxEastMeters, minNorthMeters, maxNorthMeters, minUpMeters: planeUpMeters, maxUpMeters: planeUpMeters }, { east: cells, north: cells });
    const plan = createSrpPlan({ microphones: mics, speedMetersPerSecond, grid });
    const values = new Float64Array(plan.pointCount);
    // A cell spans delays up to its diagonal over c either side of its centre's (the delay's gradient is at most 2/c): each
    // correlation is pooled over those lags, or the sharp PHAT peaks fall between cells and the map is speckle.
    const cellDiagonalMeters = Math.hypot(grid.east.stepMeters, grid.north.stepMeters);
    srpMap(plan, plots.pairs.map((pair) => ({ indexA: pair.indexA, indexB: pair.indexB, sampleRateHz: pair.sampleRateHz, values: slidingMaximum(pair.values, (cellDiagonalMeters * pair.sampleRateHz) / speedMetersPerSecond), zeroLagIndex: pair.maxLagFrames })), values);
    const peak = normaliseToPeak(values);
    if (peak === undefined) return undefined;
    const i = peak % grid.east.count;
    const j = Math.floor(peak / grid.east.count);
    return {
      kind: 'srp',
      grid: { firstEastMeters: grid.east.firstMeters, stepEastMeters: grid.east.stepMeters, countEast: grid.east.count, firstNorthMeters: grid.north.firstMeters, stepNorthMeters: grid.north.stepMeters, countNorth: grid.north.count },
      values,
      unitLabel: 'SRP-PHAT of the selected event, normalised to its peak',
      peak: { eastMeters: grid.east.firstMeters + i * grid.east.stepMeters, northMeters: grid.north.firstMeters + j * grid.north.stepMeters },
    };
  } catch {
    return undefined;
  }
}
