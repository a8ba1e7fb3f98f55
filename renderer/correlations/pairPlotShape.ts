// View-model of one pair's correlation plot: the curve (decimated to the pixel width), the chosen peak, the ±σ bar, the
// band |τ| ≤ d/c and the lag ticks, all in SVG pixels; lags in seconds (arrival at A minus arrival at B).
import type { PairCorrelationPlot } from '../../core/overview';
import { lagAxisTicks, type AxisTick } from './lagAxis';
import { formatRatio, formatShortDuration, formatSnrDb } from './plotFormat';

export interface PlotBox {
  widthPixels: number;
  heightPixels: number;
  /** Inner margins for the axis labels. */
  left: number;
  right: number;
  top: number;
  bottom: number;
}

export interface PairPlotShape {
  /** SVG path of the correlation (min/max per pixel column when there are more lags than pixels). */
  curvePath: string;
  /** y of correlation 0. */
  zeroY: number;
  /** The physically possible lags, |τ| ≤ d/c, as an x range (undefined when the spacing is not known). */
  spacingBand: { x0: number; x1: number } | undefined;
  peak: { x: number; y: number };
  /** ±σ around the peak (at least 3 px wide so that it shows). */
  sigmaBar: { x0: number; x1: number; y: number };
  xTicks: AxisTick[];
  /** Unit of the tick labels, 'µs' or 'ms'. */
  xUnit: string;
  /** True when the chosen delay lies beyond d/c (only the margin allowed it). */
  beyondSpacing: boolean;
  title: string;
  delayText: string;
  qualityText: string;
}

/** Linear interpolation of the correlation at a fractional lag (frames). */
function valueAt(plot: PairCorrelationPlot, lagFrames: number): number {
  const position = lagFrames + plot.maxLagFrames;
  const i = Math.max(0, Math.min(plot.values.length - 1, Math.floor(position)));
  const j = Math.min(plot.values.length - 1, i + 1);
  const u = Math.max(0, Math.min(1, position - i));
  return plot.values[i]! * (1 - u) + plot.values[j]! * u;
}

export function pairPlotShape(plot: PairCorrelationPlot, box: PlotBox): PairPlotShape {
  const fs = plot.sampleRateHz;
  const innerWidth = Math.max(1, box.widthPixels - box.left - box.right);
  const innerHeight = Math.max(1, box.heightPixels - box.top - box.bottom);
  const maxLagSeconds = Math.max(plot.maxLagFrames, 1) / fs;
  const x = (lagSeconds: number) => box.left + ((lagSeconds + maxLagSeconds) / (2 * maxLagSeconds)) * innerWidth;

  let high = -Infinity;
  let low = Infinity;
  for (const v of plot.values) {
    if (v > high) high = v;
    if (v < low) low = v;
  }
  if (!Number.isFinite(high)) {
    high = 1;
    low = 0;
  }
  // headroom above the peak for the ±σ bar
  const top = Math.max(high, 1e-12) * 1.25;
  const bottom = Math.min(low * 1.1, -0.1 * top);
  const y = (value: number) => box.top + ((top - value) / (top - bottom)) * innerHeight;

  // Curve: every lag when they fit; else, per pixel column, the min and max of its lags (keeps the peak's height).
  const count = plot.values.length;
  const parts: string[] = [];
  if (count <= innerWidth) {
    for (let i = 0; i < count; i++) parts.push(`${i === 0 ? 'M' : 'L'}${x((i - plot.maxLagFrames) / fs).toFixed(2)} ${y(plot.values[i]!).toFixed(2)}`);
  } else {
    const columns = Math.floor(innerWidth);
    for (let c = 0; c < columns; c++) {
      const from = Math.floor((c * count) / columns);
      const to = Math.max(from + 1, Math.floor(((c + 1) * count) / columns));
      let lo = Infinity;
      let hi = -Infinity;
      let loAt = from;
      let hiAt = from;
      for (let i = from; i < to; i++) {
        if (plot.values[i]! < lo) { lo = plot.values[i]!; loAt = i; }
        if (plot.values[i]! > hi) { hi = plot.values[i]!; hiAt = i; }
      }
      const px = (box.left + c + 0.5).toFixed(2);
      const [first, second] = loAt <= hiAt ? [lo, hi] : [hi, lo];
      parts.push(`${c === 0 ? 'M' : 'L'}${px} ${y(first).toFixed(2)}`, `L${px} ${y(second).toFixed(2)}`);
    }
  }

  const delayFrames = plot.delaySeconds * fs;
  const peak = { x: x(plot.delaySeconds), y: y(valueAt(plot, delayFrames)) };
  const sigmaHalf = Math.max(1.5, (plot.sigmaSeconds / (2 * maxLagSeconds)) * innerWidth);
  const limit = plot.spacingLimitSeconds;
  const spacingBand = limit === undefined ? undefined : { x0: x(Math.max(-maxLagSeconds, -limit)), x1: x(Math.min(maxLagSeconds, limit)) };

  const { ticks: xTicks, unit: xUnit } = lagAxisTicks(-maxLagSeconds, maxLagSeconds, innerWidth, x, { leftPixels: 0, rightPixels: box.widthPixels });
  return {
    curvePath: parts.join(' '),
    zeroY: y(0),
    spacingBand,
    peak,
    sigmaBar: { x0: peak.x - sigmaHalf, x1: peak.x + sigmaHalf, y: peak.y },
    xTicks,
    xUnit,
    beyondSpacing: limit !== undefined && Math.abs(plot.delaySeconds) > limit * (1 + 1e-9),
    title: `${plot.labelA} – ${plot.labelB}`,
    delayText: `Δt ${formatShortDuration(plot.delaySeconds, true)} ± ${formatShortDuration(plot.sigmaSeconds)}`,
    qualityText: `peak/2nd ${formatRatio(plot.peakToSecondRatio)} · SNR ${formatSnrDb(plot.snrDb)}`,
  };
}
