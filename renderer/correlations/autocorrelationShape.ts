// View-model of one channel's autocorrelation plot: the curve over lags 0..N, the half-maximum width (drawn at half its
// full width, since only positive lags show), the first zero, and the expected timing precision; SVG pixels, seconds.
import type { ChannelAutocorrelationPlot } from '../../core/overview';
import { lagAxisTicks, type AxisTick } from './lagAxis';
import type { PlotBox } from './pairPlotShape';
import { formatShortDuration, formatSnrDb } from './plotFormat';

export interface AutocorrelationShape {
  curvePath: string;
  zeroY: number;
  halfY: number;
  /** x of half the half-maximum width (the lobe falls to 0.5 there), undefined when it never does. */
  halfWidthX: number | undefined;
  firstZeroX: number | undefined;
  xTicks: AxisTick[];
  xUnit: string;
  title: string;
  widthText: string;
  precisionText: string;
  /** What the precision rests on: the channel's SNR and the lobe scale 1/(2π f_rms). */
  basisText: string;
}

export function autocorrelationShape(plot: ChannelAutocorrelationPlot, box: PlotBox): AutocorrelationShape {
  const fs = plot.sampleRateHz;
  const innerWidth = Math.max(1, box.widthPixels - box.left - box.right);
  const innerHeight = Math.max(1, box.heightPixels - box.top - box.bottom);
  const lastLag = Math.max(1, plot.values.length - 1);
  const spanSeconds = lastLag / fs;
  const x = (lagSeconds: number) => box.left + (lagSeconds / spanSeconds) * innerWidth;
  const y = (value: number) => box.top + ((1.05 - value) / 2.1) * innerHeight;
  const parts: string[] = [];
  for (let k = 0; k < plot.values.length; k++) parts.push(`${k === 0 ? 'M' : 'L'}${x(k / fs).toFixed(2)} ${y(plot.values[k]!).toFixed(2)}`);
  const half = plot.halfMaxWidthSeconds;
  const zero = plot.firstZeroSeconds;
  const { ticks: xTicks, unit: xUnit } = lagAxisTicks(0, spanSeconds, innerWidth, x, { leftPixels: 0, rightPixels: box.widthPixels });
  const precision = plot.timingPrecisionSeconds;
  return {
    curvePath: parts.join(' '),
    zeroY: y(0),
    halfY: y(0.5),
    halfWidthX: half === null || half / 2 > spanSeconds ? undefined : x(half / 2),
    firstZeroX: zero === null || zero > spanSeconds ? undefined : x(zero),
    xTicks,
    xUnit,
    title: plot.label,
    widthText: half === null ? 'no half-maximum within the window' : `half-max width ${formatShortDuration(half)}`,
    precisionText:
      precision === undefined || precision === null
        ? plot.lobeScaleSeconds ? 'expected timing precision: no SNR to judge by' : 'silent in the band: no timing'
        : precision >= 1e-3
          ? 'expected timing precision: worse than 1 ms'
          : `expected timing precision ≈ ${formatShortDuration(precision)}`,
    basisText: [
      plot.snrDb === undefined || plot.snrDb === null ? '' : `at ${formatSnrDb(plot.snrDb)} SNR`,
      plot.lobeScaleSeconds ? `lobe 1/(2πf_rms) ${formatShortDuration(plot.lobeScaleSeconds)}` : '',
    ].filter((t) => t !== '').join(' · '),
  };
}
