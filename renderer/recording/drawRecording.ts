// Canvas drawing of the recording view: time axis, stacked channel lanes with their min/max envelope, event marks,
// the selection, the whole-recording navigator and the spectrogram. CSS pixels; x through the view's TimeScale.
import { envelopeColumns, envelopePeak, type DetailEnvelope, type EnvelopePyramid } from '../../core/overview';
import type { EventMark } from './eventMarks';
import type { FrequencyTick } from './frequencyTicks';
import type { TimeScale } from './timeScale';
import type { TimeTick } from './timeTicks';

export const palette = {
  ink: '#1d2a2f',
  paper: '#f4f1ea',
  panel: '#fffdf8',
  laneAlternate: '#f7f3ea',
  accent: '#2f6f62',
  warning: '#9a4b12',
  muted: '#5d6b70',
  rule: '#d9d2c3',
  tone: {
    pending: ['rgba(93, 107, 112, 0.13)', 'rgba(93, 107, 112, 0.32)'],
    located: ['rgba(47, 111, 98, 0.15)', 'rgba(47, 111, 98, 0.36)'],
    doubtful: ['rgba(176, 128, 30, 0.17)', 'rgba(176, 128, 30, 0.40)'],
    failed: ['rgba(154, 75, 18, 0.15)', 'rgba(154, 75, 18, 0.36)'],
  } as Record<EventMark['tone'], [string, string]>,
  selection: 'rgba(29, 42, 47, 0.13)',
} as const;

/** Sizes the canvas backing store for the device pixel ratio and returns a context drawing in CSS pixels. */
export function prepareCanvas(canvas: HTMLCanvasElement, widthCss: number, heightCss: number): CanvasRenderingContext2D | null {
  const ratio = window.devicePixelRatio || 1;
  const w = Math.max(1, Math.round(widthCss * ratio));
  const h = Math.max(1, Math.round(heightCss * ratio));
  if (canvas.width !== w) canvas.width = w;
  if (canvas.height !== h) canvas.height = h;
  canvas.style.width = `${widthCss}px`;
  canvas.style.height = `${heightCss}px`;
  const context = canvas.getContext('2d');
  if (!context) return null;
  context.setTransform(ratio, 0, 0, ratio, 0, 0);
  return context;
}

export interface LaneLayout {
  axisHeight: number;
  laneHeight: number;
  gutter: number;
  totalHeight: number;
}

export function laneLayout(channelCount: number, withWallClock: boolean, gutter: number): LaneLayout {
  // Lanes stay low enough that three or more fit in the panel under the map (the map comes first).
  const laneHeight = Math.max(34, Math.min(56, Math.floor(264 / Math.max(1, channelCount))));
  const axisHeight = withWallClock ? 38 : 24;
  return { axisHeight, laneHeight, gutter, totalHeight: axisHeight + laneHeight * channelCount };
}

export interface LanesDrawing {
  layout: LaneLayout;
  scale: TimeScale;
  widthCss: number;
  labels: readonly string[];
  channelCount: number;
  sampleRateHz: number;
  pyramid: EnvelopePyramid | undefined;
  /** Exact per-pixel envelope of this very view, when it has arrived. */
  detail: DetailEnvelope | undefined;
  gain: number;
  ticks: readonly TimeTick[];
  marks: readonly EventMark[];
  selection: { startSeconds: number; endSeconds: number } | undefined;
}

// Scratch buffers reused between redraws (no allocation per frame once the width is known).
let scratchMin = new Float32Array(0);
let scratchMax = new Float32Array(0);

function scratch(length: number): [Float32Array, Float32Array] {
  if (scratchMin.length < length) {
    scratchMin = new Float32Array(length);
    scratchMax = new Float32Array(length);
  }
  return [scratchMin, scratchMax];
}

export function drawLanes(context: CanvasRenderingContext2D, d: LanesDrawing): void {
  const { layout, scale, widthCss } = d;
  const { axisHeight, laneHeight, gutter } = layout;
  const plotWidth = Math.max(1, Math.round(scale.widthPixels));
  context.clearRect(0, 0, widthCss, layout.totalHeight);
  context.fillStyle = palette.panel;
  context.fillRect(0, 0, widthCss, layout.totalHeight);

  // lanes
  for (let c = 0; c < d.channelCount; c++) {
    const top = axisHeight + c * laneHeight;
    context.fillStyle = c % 2 === 0 ? palette.panel : palette.laneAlternate;
    context.fillRect(gutter, top, plotWidth, laneHeight);
  }

  // event marks behind the waveforms
  for (const mark of d.marks) {
    const [fill, edge] = palette.tone[mark.tone];
    const x0 = gutter + Math.max(-2, mark.x0Pixels);
    const x1 = gutter + Math.min(plotWidth + 2, mark.x1Pixels);
    context.fillStyle = fill;
    context.fillRect(x0, axisHeight, x1 - x0, layout.totalHeight - axisHeight);
    if (mark.selected) {
      context.fillRect(x0, axisHeight, x1 - x0, layout.totalHeight - axisHeight);
      context.fillStyle = edge;
      context.fillRect(x0, axisHeight, x1 - x0, 4);
      context.strokeStyle = palette.ink;
      context.lineWidth = 1.5;
      context.strokeRect(x0 + 0.75, axisHeight + 0.75, Math.max(1, x1 - x0 - 1.5), layout.totalHeight - axisHeight - 1.5);
    }
  }

  // selection
  if (d.selection) {
    const x0 = gutter + Math.max(-2, scale.toPixels(d.selection.startSeconds));
    const x1 = gutter + Math.min(plotWidth + 2, scale.toPixels(d.selection.endSeconds));
    if (x1 > gutter && x0 < gutter + plotWidth) {
      context.fillStyle = palette.selection;
      context.fillRect(x0, axisHeight, Math.max(1, x1 - x0), layout.totalHeight - axisHeight);
      context.strokeStyle = palette.ink;
      context.setLineDash([4, 3]);
      context.lineWidth = 1;
      context.beginPath();
      context.moveTo(Math.round(x0) + 0.5, axisHeight);
      context.lineTo(Math.round(x0) + 0.5, layout.totalHeight);
      context.moveTo(Math.round(x1) - 0.5, axisHeight);
      context.lineTo(Math.round(x1) - 0.5, layout.totalHeight);
      context.stroke();
      context.setLineDash([]);
    }
  }

  // waveforms: one rectangle per pixel column from min to max, all channels scaled alike
  const pyramid = d.pyramid;
  if (pyramid) {
    const fs = d.sampleRateHz;
    const framesPerColumn = scale.secondsPerPixel * fs;
    const startFrame = scale.startSeconds * fs;
    const useDetail = d.detail !== undefined && d.detail.columnCount === plotWidth && d.detail.min.length === d.channelCount;
    let peak = 0;
    for (let c = 0; c < d.channelCount; c++) {
      if (useDetail) {
        const lo = d.detail!.min[c]!;
        const hi = d.detail!.max[c]!;
        for (let i = 0; i < plotWidth; i++) {
          const m = Math.max(Math.abs(lo[i]!), Math.abs(hi[i]!));
          if (m > peak) peak = m;
        }
      } else {
        peak = Math.max(peak, envelopePeak(pyramid, c, startFrame, startFrame + plotWidth * framesPerColumn, framesPerColumn));
      }
    }
    const amplitude = (peak > 0 ? 1 / peak : 1) * d.gain;
    const [lo, hi] = scratch(plotWidth);
    context.fillStyle = palette.accent;
    for (let c = 0; c < d.channelCount; c++) {
      const top = axisHeight + c * laneHeight;
      const centre = top + laneHeight / 2;
      const half = laneHeight / 2 - 2;
      let mins: Float32Array = lo;
      let maxs: Float32Array = hi;
      if (useDetail) {
        mins = d.detail!.min[c]!;
        maxs = d.detail!.max[c]!;
      } else {
        envelopeColumns(pyramid, c, startFrame, framesPerColumn, plotWidth, lo, hi);
      }
      context.beginPath();
      for (let i = 0; i < plotWidth; i++) {
        const a = mins[i]!;
        const b = maxs[i]!;
        if (Number.isNaN(a)) continue;
        const yTop = centre - Math.max(-1, Math.min(1, b * amplitude)) * half;
        const yBottom = centre - Math.max(-1, Math.min(1, a * amplitude)) * half;
        context.rect(gutter + i, yTop, 1, Math.max(1, yBottom - yTop));
      }
      context.fill();
    }
  }

  // lane rules and labels (the gutter is drawn last so nothing spills into it)
  context.fillStyle = palette.panel;
  context.fillRect(0, 0, gutter, layout.totalHeight);
  context.strokeStyle = palette.rule;
  context.lineWidth = 1;
  context.beginPath();
  for (let c = 0; c <= d.channelCount; c++) {
    const y = Math.round(axisHeight + c * laneHeight) + 0.5;
    context.moveTo(0, y);
    context.lineTo(gutter + plotWidth, y);
  }
  context.moveTo(gutter - 0.5, axisHeight);
  context.lineTo(gutter - 0.5, layout.totalHeight);
  context.stroke();
  context.font = '600 12px system-ui, sans-serif';
  context.textBaseline = 'middle';
  context.textAlign = 'left';
  for (let c = 0; c < d.channelCount; c++) {
    const y = axisHeight + c * laneHeight + laneHeight / 2;
    context.fillStyle = palette.ink;
    context.fillText(fitText(context, d.labels[c] ?? `ch ${c + 1}`, gutter - 12), 8, y - 6);
    context.fillStyle = palette.muted;
    context.font = '11px system-ui, sans-serif';
    context.fillText(`ch ${c + 1}`, 8, y + 8);
    context.font = '600 12px system-ui, sans-serif';
  }

  // time axis on top
  context.fillStyle = palette.panel;
  context.fillRect(0, 0, widthCss, axisHeight);
  context.strokeStyle = palette.muted;
  context.fillStyle = palette.ink;
  context.font = '11px system-ui, sans-serif';
  context.textBaseline = 'top';
  context.textAlign = 'center';
  context.beginPath();
  for (const tick of d.ticks) {
    const x = Math.round(gutter + tick.xPixels) + 0.5;
    context.moveTo(x, axisHeight - 5);
    context.lineTo(x, axisHeight);
  }
  context.stroke();
  for (const tick of d.ticks) {
    const x = gutter + tick.xPixels;
    if (x < gutter + 16 || x > gutter + plotWidth - 16) continue;
    context.fillStyle = palette.ink;
    context.fillText(tick.label, x, 3);
    if (tick.wallClock) {
      context.fillStyle = palette.muted;
      context.fillText(tick.wallClock, x, 18);
    }
  }
  // faint tick lines through the lanes
  context.strokeStyle = 'rgba(29, 42, 47, 0.07)';
  context.beginPath();
  for (const tick of d.ticks) {
    const x = Math.round(gutter + tick.xPixels) + 0.5;
    context.moveTo(x, axisHeight);
    context.lineTo(x, layout.totalHeight);
  }
  context.stroke();
  context.textAlign = 'left';
  context.fillStyle = palette.muted;
  context.fillText(d.ticks.some((t) => t.wallClock) ? 'time / clock' : 'time', 8, 3);
  context.strokeStyle = palette.rule;
  context.beginPath();
  context.moveTo(0, axisHeight - 0.5);
  context.lineTo(gutter + plotWidth, axisHeight - 0.5);
  context.stroke();
}

function fitText(context: CanvasRenderingContext2D, text: string, widthPixels: number): string {
  if (context.measureText(text).width <= widthPixels) return text;
  let cut = text;
  while (cut.length > 1 && context.measureText(`${cut}…`).width > widthPixels) cut = cut.slice(0, -1);
  return `${cut}…`;
}

export interface NavigatorDrawing {
  widthCss: number;
  heightCss: number;
  gutter: number;
  /** Scale of the whole recording over the plot width. */
  whole: TimeScale;
  view: { startSeconds: number; endSeconds: number };
  pyramid: EnvelopePyramid | undefined;
  marks: readonly EventMark[];
  sampleRateHz: number;
}

/** The whole recording in one strip (largest |sample| of any channel per column) with the visible span boxed. */
export function drawNavigator(context: CanvasRenderingContext2D, d: NavigatorDrawing): void {
  const { widthCss, heightCss, gutter, whole } = d;
  const plotWidth = Math.max(1, Math.round(whole.widthPixels));
  context.clearRect(0, 0, widthCss, heightCss);
  context.fillStyle = palette.paper;
  context.fillRect(gutter, 0, plotWidth, heightCss);
  context.fillStyle = palette.muted;
  context.font = '11px system-ui, sans-serif';
  context.textBaseline = 'middle';
  context.fillText('whole', 8, heightCss / 2);
  for (const mark of d.marks) {
    context.fillStyle = mark.selected ? palette.ink : palette.tone[mark.tone][1];
    context.fillRect(gutter + mark.x0Pixels, 0, Math.max(2, mark.x1Pixels - mark.x0Pixels), heightCss);
  }
  if (d.pyramid) {
    const fs = d.sampleRateHz;
    const framesPerColumn = whole.secondsPerPixel * fs;
    const [lo, hi] = scratch(plotWidth);
    const peaks = new Float32Array(plotWidth);
    for (let c = 0; c < d.pyramid.channelCount; c++) {
      envelopeColumns(d.pyramid, c, 0, framesPerColumn, plotWidth, lo, hi);
      for (let i = 0; i < plotWidth; i++) if (!Number.isNaN(lo[i]!)) peaks[i] = Math.max(peaks[i]!, Math.abs(lo[i]!), Math.abs(hi[i]!));
    }
    let peak = 0;
    for (let i = 0; i < plotWidth; i++) peak = Math.max(peak, peaks[i]!);
    context.fillStyle = 'rgba(47, 111, 98, 0.75)';
    context.beginPath();
    const half = heightCss / 2 - 2;
    for (let i = 0; i < plotWidth; i++) {
      const h = peak > 0 ? (peaks[i]! / peak) * half : 0;
      context.rect(gutter + i, heightCss / 2 - h, 1, Math.max(1, 2 * h));
    }
    context.fill();
  }
  const x0 = gutter + whole.toPixels(d.view.startSeconds);
  const x1 = gutter + whole.toPixels(d.view.endSeconds);
  const w = Math.max(4, x1 - x0);
  context.fillStyle = 'rgba(255, 253, 248, 0.0)';
  context.strokeStyle = palette.ink;
  context.lineWidth = 1.5;
  context.fillStyle = 'rgba(29, 42, 47, 0.10)';
  context.fillRect(x0, 0.75, w, heightCss - 1.5);
  context.strokeRect(x0, 0.75, w, heightCss - 1.5);
}

export interface SpectrogramDrawing {
  widthCss: number;
  heightCss: number;
  gutter: number;
  scale: TimeScale;
  image: CanvasImageSource | undefined;
  imageSpan: { startSeconds: number; endSeconds: number } | undefined;
  ticks: readonly FrequencyTick[];
  message: string | undefined;
}

export function drawSpectrogram(context: CanvasRenderingContext2D, d: SpectrogramDrawing): void {
  const { widthCss, heightCss, gutter, scale } = d;
  const plotWidth = Math.max(1, Math.round(scale.widthPixels));
  context.clearRect(0, 0, widthCss, heightCss);
  context.fillStyle = palette.panel;
  context.fillRect(0, 0, widthCss, heightCss);
  context.fillStyle = '#fbf9f3';
  context.fillRect(gutter, 0, plotWidth, heightCss);
  if (d.image && d.imageSpan) {
    const x0 = gutter + scale.toPixels(d.imageSpan.startSeconds);
    const x1 = gutter + scale.toPixels(d.imageSpan.endSeconds);
    context.save();
    context.beginPath();
    context.rect(gutter, 0, plotWidth, heightCss);
    context.clip();
    context.imageSmoothingEnabled = true;
    context.drawImage(d.image, x0, 0, x1 - x0, heightCss);
    context.restore();
  }
  context.strokeStyle = palette.muted;
  context.fillStyle = palette.ink;
  context.font = '11px system-ui, sans-serif';
  context.textAlign = 'right';
  context.textBaseline = 'middle';
  context.lineWidth = 1;
  context.beginPath();
  for (const tick of d.ticks) {
    const y = Math.round(tick.yPixels) + 0.5;
    context.moveTo(gutter - 5, y);
    context.lineTo(gutter, y);
  }
  context.stroke();
  for (const tick of d.ticks) {
    const y = Math.min(heightCss - 6, Math.max(6, tick.yPixels));
    context.fillText(tick.label, gutter - 8, y);
  }
  context.save();
  context.translate(12, heightCss / 2);
  context.rotate(-Math.PI / 2);
  context.textAlign = 'center';
  context.fillStyle = palette.muted;
  context.fillText('kHz', 0, 0);
  context.restore();
  context.strokeStyle = palette.rule;
  context.strokeRect(gutter - 0.5, 0.5, plotWidth + 1, heightCss - 1);
  if (d.message) {
    context.textAlign = 'center';
    context.fillStyle = palette.muted;
    context.font = '12px system-ui, sans-serif';
    context.fillText(d.message, gutter + plotWidth / 2, heightCss / 2);
  }
}
