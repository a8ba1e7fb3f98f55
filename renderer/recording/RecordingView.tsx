// The recording view: every channel's envelope in stacked lanes with zoom and scroll, a spectrogram of the visible span,
// the detected events listed and marked, and a span selected by hand to locate. Seconds from the recording's start.
import { useCallback, useEffect, useMemo, useRef, useState, type PointerEvent as ReactPointerEvent } from 'react';
import type { EnvelopePyramid, Spectrogram } from '../../core/overview';
import { drawLanes, drawNavigator, drawSpectrogram, laneLayout, prepareCanvas } from './drawRecording';
import { eventAt, eventMarks, eventNumber, eventTone, type RecordingEvent } from './eventMarks';
import { frequencyTicks } from './frequencyTicks';
import { defaultLevelRange, spectrogramPixels } from './spectrogramImage';
import { clampSpan, panSpan, spanAround, timeScale, zoomSpan, type ViewSpan } from './timeScale';
import { formatOffset, formatSpan, formatWallClock, timeLabelStyle, timeTicks } from './timeTicks';
import { useWidthCss } from './useWidthCss';
import './recording.css';

export interface RecordingViewProps {
  info: { name: string; channelCount: number; sampleRateHz: number; frameCount: number; durationSeconds: number; startTimeIso?: string };
  channelLabels: string[];
  envelope: EnvelopePyramid | undefined;
  envelopeProgress?: number;
  events: RecordingEvent[];
  selection?: { startSeconds: number; endSeconds: number };
  requestSpectrogram: (startSeconds: number, endSeconds: number, widthPixels: number, heightPixels: number) => Promise<Spectrogram>;
  onSelectSpan: (startSeconds: number, endSeconds: number) => void;
  onLocateSpan: (startSeconds: number, endSeconds: number) => void;
  onSelectEvent: (index: number) => void;
  /** Told the span on screen whenever it changes (the recorders time line marks it). */
  onViewChange?: (view: ViewSpan) => void;
  /** A span to show, asked for from outside (the recorders time line); a new `serial` asks again. */
  viewRequest?: ViewSpan & { serial: number };
}

const gutterPixels = 92;
const navigatorHeight = 30;
const spectrogramHeight = 180;
const spectrogramSettleMs = 250;
const gains = [1, 2, 4, 8, 16, 32];
const topFrequencyChoicesHz = [4000, 8000, 12_000, 16_000, 24_000, 48_000, 96_000];

type Drag =
  | { kind: 'select'; x0: number; x1: number }
  | { kind: 'pan'; x0: number; from: ViewSpan }
  | { kind: 'navigate'; grabSeconds: number; from: ViewSpan };

interface SpectrogramShown {
  spectrogram: Spectrogram;
  image: HTMLCanvasElement;
  topHz: number;
}

export function RecordingView(props: RecordingViewProps) {
  const { info, channelLabels, envelope, envelopeProgress, events, selection, requestSpectrogram, onSelectSpan, onLocateSpan, onSelectEvent, onViewChange, viewRequest } = props;
  const duration = Math.max(info.durationSeconds, 1 / info.sampleRateHz);
  const minSpan = Math.min(duration, Math.max(24 / info.sampleRateHz, 0.001));
  const nyquistHz = info.sampleRateHz / 2;

  const [view, setView] = useState<ViewSpan>({ startSeconds: 0, endSeconds: duration });
  const [gain, setGain] = useState(1);
  const [showSpectrogram, setShowSpectrogram] = useState(true);
  const [topHz, setTopHz] = useState(nyquistHz);
  const [drag, setDrag] = useState<Drag | undefined>();
  const [localSelection, setLocalSelection] = useState<ViewSpan | undefined>();
  const [shown, setShown] = useState<SpectrogramShown | undefined>();
  const [spectrogramStatus, setSpectrogramStatus] = useState<'idle' | 'computing' | 'failed'>('idle');
  const [spectrogramError, setSpectrogramError] = useState('');
  const [hoverSeconds, setHoverSeconds] = useState<number | undefined>();

  const containerRef = useRef<HTMLDivElement>(null);
  const widthCss = useWidthCss(containerRef);
  const lanesRef = useRef<HTMLCanvasElement>(null);
  const navigatorRef = useRef<HTMLCanvasElement>(null);
  const spectrogramRef = useRef<HTMLCanvasElement>(null);
  const requestIdRef = useRef(0);

  // A new recording: show it whole.
  const recordingKey = `${info.name}|${info.frameCount}|${info.sampleRateHz}|${info.channelCount}`;
  const shownKeyRef = useRef(recordingKey);
  useEffect(() => {
    if (shownKeyRef.current === recordingKey) return;
    shownKeyRef.current = recordingKey;
    setView({ startSeconds: 0, endSeconds: duration });
    setShown(undefined);
    setLocalSelection(undefined);
    setTopHz(info.sampleRateHz / 2);
  }, [recordingKey, duration, info.sampleRateHz]);

  useEffect(() => { onViewChange?.(view); }, [view, onViewChange]);
  const requestSerial = viewRequest?.serial;
  useEffect(() => {
    if (viewRequest === undefined) return;
    setView(clampSpan(viewRequest, duration, minSpan));
    // only a new request moves the view, not a new duration
  }, [requestSerial]);


  const plotWidth = Math.max(1, widthCss - gutterPixels - 8);
  const scale = useMemo(() => timeScale(view, plotWidth), [view, plotWidth]);
  const wholeScale = useMemo(() => timeScale({ startSeconds: 0, endSeconds: duration }, plotWidth), [duration, plotWidth]);
  const layout = useMemo(() => laneLayout(info.channelCount, info.startTimeIso !== undefined, gutterPixels), [info.channelCount, info.startTimeIso]);
  const ticks = useMemo(() => timeTicks(scale, duration, info.startTimeIso).ticks, [scale, duration, info.startTimeIso]);
  const marks = useMemo(() => eventMarks(events, scale), [events, scale]);
  const wholeMarks = useMemo(() => eventMarks(events, wholeScale), [events, wholeScale]);
  const chosenSelection = selection ?? localSelection;
  const shownSelection = drag?.kind === 'select' && Math.abs(drag.x1 - drag.x0) >= 2
    ? { startSeconds: scale.toSeconds(Math.min(drag.x0, drag.x1)), endSeconds: scale.toSeconds(Math.max(drag.x0, drag.x1)) }
    : chosenSelection;

  // The exact per-pixel envelope that came with the spectrogram, when it is of this very view.
  const detail = shown?.spectrogram.detail;
  const detailMatches =
    detail !== undefined &&
    detail.columnCount === plotWidth &&
    Math.abs(detail.startSeconds - view.startSeconds) < 1e-9 * duration + 1e-12 &&
    Math.abs(detail.endSeconds - view.endSeconds) < 1e-9 * duration + 1e-12;
  const baseBucketSeconds = envelope ? envelope.levels[0]!.bucketFrames / info.sampleRateHz : 0;
  const coarse = envelope !== undefined && !detailMatches && scale.secondsPerPixel < baseBucketSeconds / 2;

  useEffect(() => {
    const canvas = lanesRef.current;
    if (!canvas) return;
    const frame = requestAnimationFrame(() => {
      const context = prepareCanvas(canvas, widthCss, layout.totalHeight);
      if (!context) return;
      drawLanes(context, {
        layout,
        scale,
        widthCss,
        labels: channelLabels,
        channelCount: info.channelCount,
        sampleRateHz: info.sampleRateHz,
        pyramid: envelope,
        detail: detailMatches ? detail : undefined,
        gain,
        ticks,
        marks,
        selection: shownSelection,
      });
    });
    return () => cancelAnimationFrame(frame);
  }, [layout, scale, widthCss, channelLabels, info.channelCount, info.sampleRateHz, envelope, detail, detailMatches, gain, ticks, marks, shownSelection]);

  useEffect(() => {
    const canvas = navigatorRef.current;
    if (!canvas) return;
    const frame = requestAnimationFrame(() => {
      const context = prepareCanvas(canvas, widthCss, navigatorHeight);
      if (!context) return;
      drawNavigator(context, { widthCss, heightCss: navigatorHeight, gutter: gutterPixels, whole: wholeScale, view, pyramid: envelope, marks: wholeMarks, sampleRateHz: info.sampleRateHz });
    });
    return () => cancelAnimationFrame(frame);
  }, [widthCss, wholeScale, view, envelope, wholeMarks, info.sampleRateHz]);

  // Spectrogram of the visible span, asked for once the view has settled; answers for an older view are dropped.
  useEffect(() => {
    if (!showSpectrogram) return;
    const id = ++requestIdRef.current;
    const timer = setTimeout(() => {
      setSpectrogramStatus('computing');
      // finer FFT when only the lower part of the band is shown, so that bins still match rows
      const heightForFft = Math.min(4096, Math.round(spectrogramHeight * (nyquistHz / topHz)));
      requestSpectrogram(view.startSeconds, view.endSeconds, plotWidth, heightForFft).then(
        (spectrogram) => {
          if (id !== requestIdRef.current) return;
          const pixels = spectrogramPixels(spectrogram, spectrogramHeight, defaultLevelRange(spectrogram), topHz);
          const image = document.createElement('canvas');
          image.width = pixels.width;
          image.height = pixels.height;
          image.getContext('2d')?.putImageData(new ImageData(pixels.rgba, pixels.width, pixels.height), 0, 0);
          setShown({ spectrogram, image, topHz });
          setSpectrogramStatus('idle');
        },
        (error: unknown) => {
          if (id !== requestIdRef.current) return;
          setSpectrogramError(error instanceof Error ? error.message : String(error));
          setSpectrogramStatus('failed');
        },
      );
    }, spectrogramSettleMs);
    return () => clearTimeout(timer);
  }, [showSpectrogram, view, plotWidth, topHz, nyquistHz, requestSpectrogram]);

  const frequencyAxis = useMemo(() => frequencyTicks(shown?.topHz ?? topHz, spectrogramHeight), [shown, topHz]);
  useEffect(() => {
    const canvas = spectrogramRef.current;
    if (!canvas || !showSpectrogram) return;
    const frame = requestAnimationFrame(() => {
      const context = prepareCanvas(canvas, widthCss, spectrogramHeight);
      if (!context) return;
      const message =
        spectrogramStatus === 'failed'
          ? `The spectrogram could not be computed: ${spectrogramError}`
          : shown === undefined
            ? 'Computing the spectrogram of this span…'
            : undefined;
      drawSpectrogram(context, {
        widthCss,
        heightCss: spectrogramHeight,
        gutter: gutterPixels,
        scale,
        image: shown?.image,
        imageSpan: shown ? { startSeconds: shown.spectrogram.startSeconds, endSeconds: shown.spectrogram.endSeconds } : undefined,
        ticks: frequencyAxis,
        message,
      });
    });
    return () => cancelAnimationFrame(frame);
  }, [showSpectrogram, widthCss, scale, shown, frequencyAxis, spectrogramStatus, spectrogramError]);

  // Bring a newly selected event into view.
  const selectedEvent = events.find((e) => e.selected);
  const lastSelectedRef = useRef<number | undefined>(undefined);
  useEffect(() => {
    if (!selectedEvent || selectedEvent.index === lastSelectedRef.current) {
      lastSelectedRef.current = selectedEvent?.index;
      return;
    }
    lastSelectedRef.current = selectedEvent.index;
    setView((current) => {
      const length = current.endSeconds - current.startSeconds;
      const eventLength = selectedEvent.endSeconds - selectedEvent.startSeconds;
      const inside = selectedEvent.startSeconds >= current.startSeconds && selectedEvent.endSeconds <= current.endSeconds;
      // keep a view that already shows the event at a readable size; else show it at a third of the view
      if (inside && eventLength >= length * 0.05) return current;
      if (eventLength > length * 0.8 || eventLength < length * 0.05) return spanAround(selectedEvent.startSeconds, selectedEvent.endSeconds, 1, duration, minSpan);
      const centre = (selectedEvent.startSeconds + selectedEvent.endSeconds) / 2;
      return clampSpan({ startSeconds: centre - length / 2, endSeconds: centre + length / 2 }, duration, minSpan);
    });
  }, [selectedEvent, duration, minSpan]);

  // Wheel: zoom around the pointer; sideways (or with Shift) scroll.
  useEffect(() => {
    const canvas = lanesRef.current;
    if (!canvas) return;
    const onWheel = (event: WheelEvent) => {
      event.preventDefault();
      const x = event.offsetX - gutterPixels;
      const sideways = event.shiftKey || Math.abs(event.deltaX) > Math.abs(event.deltaY);
      setView((current) => {
        const s = timeScale(current, plotWidth);
        if (sideways) return panSpan(current, (event.shiftKey ? event.deltaY : event.deltaX) * s.secondsPerPixel, duration, minSpan);
        const factor = Math.exp(event.deltaY * (event.deltaMode === 1 ? 0.05 : 0.0015));
        return zoomSpan(current, factor, s.toSeconds(Math.max(0, Math.min(plotWidth, x))), duration, minSpan);
      });
    };
    canvas.addEventListener('wheel', onWheel, { passive: false });
    return () => canvas.removeEventListener('wheel', onWheel);
  }, [plotWidth, duration, minSpan]);

  const plotX = (event: ReactPointerEvent<HTMLCanvasElement>) => {
    const rect = event.currentTarget.getBoundingClientRect();
    return Math.max(0, Math.min(plotWidth, event.clientX - rect.left - gutterPixels));
  };

  const onLanesDown = (event: ReactPointerEvent<HTMLCanvasElement>) => {
    if (event.button !== 0) return;
    const rect = event.currentTarget.getBoundingClientRect();
    if (event.clientX - rect.left < gutterPixels) return;
    event.currentTarget.setPointerCapture(event.pointerId);
    const x = plotX(event);
    const onAxis = event.clientY - rect.top < layout.axisHeight;
    setDrag(onAxis ? { kind: 'pan', x0: x, from: view } : { kind: 'select', x0: x, x1: x });
  };
  const onLanesMove = (event: ReactPointerEvent<HTMLCanvasElement>) => {
    const x = plotX(event);
    setHoverSeconds(scale.toSeconds(x));
    if (!drag) return;
    if (drag.kind === 'select') setDrag({ ...drag, x1: x });
    else if (drag.kind === 'pan') setView(panSpan(drag.from, -(x - drag.x0) * scale.secondsPerPixel, duration, minSpan));
  };
  const onLanesUp = (event: ReactPointerEvent<HTMLCanvasElement>) => {
    if (!drag) return;
    setDrag(undefined);
    if (drag.kind !== 'select') return;
    const x1 = plotX(event);
    if (Math.abs(x1 - drag.x0) >= 4) {
      const start = Math.max(0, scale.toSeconds(Math.min(drag.x0, x1)));
      const end = Math.min(duration, scale.toSeconds(Math.max(drag.x0, x1)));
      setLocalSelection({ startSeconds: start, endSeconds: end });
      onSelectSpan(start, end);
    } else {
      const index = eventAt(marks, x1);
      if (index !== undefined) onSelectEvent(index);
    }
  };

  const onNavigatorDown = (event: ReactPointerEvent<HTMLCanvasElement>) => {
    const rect = event.currentTarget.getBoundingClientRect();
    const x = event.clientX - rect.left - gutterPixels;
    if (x < 0) return;
    event.currentTarget.setPointerCapture(event.pointerId);
    const t = wholeScale.toSeconds(Math.min(plotWidth, x));
    let from = view;
    if (t < view.startSeconds || t > view.endSeconds) {
      const length = view.endSeconds - view.startSeconds;
      from = clampSpan({ startSeconds: t - length / 2, endSeconds: t + length / 2 }, duration, minSpan);
      setView(from);
    }
    setDrag({ kind: 'navigate', grabSeconds: t, from });
  };
  const onNavigatorMove = (event: ReactPointerEvent<HTMLCanvasElement>) => {
    if (drag?.kind !== 'navigate') return;
    const rect = event.currentTarget.getBoundingClientRect();
    const t = wholeScale.toSeconds(Math.max(0, Math.min(plotWidth, event.clientX - rect.left - gutterPixels)));
    setView(panSpan(drag.from, t - drag.grabSeconds, duration, minSpan));
  };

  const zoomBy = useCallback(
    (factor: number) => setView((current) => zoomSpan(current, factor, (current.startSeconds + current.endSeconds) / 2, duration, minSpan)),
    [duration, minSpan],
  );

  const style = timeLabelStyle(duration);
  const hoverText =
    hoverSeconds === undefined
      ? ''
      : `${formatOffset(hoverSeconds, style, 3)}${info.startTimeIso ? ` · ${formatWallClock(info.startTimeIso, hoverSeconds, 3) ?? ''}` : ''}`;
  const progressPercent = Math.round(Math.max(0, Math.min(1, envelopeProgress ?? 0)) * 100);

  return (
    <section className="rv" data-testid="recording-view" aria-label={`Recording ${info.name}`} ref={containerRef}>
      <header className="rv-header">
        <div className="rv-title">
          <h2>{info.name}</h2>
          <span className="rv-facts">
            {info.channelCount} channels · {formatRate(info.sampleRateHz)} · {formatOffset(info.durationSeconds, style === 'seconds' ? 'seconds' : style, style === 'seconds' ? 3 : 0)}
            {info.startTimeIso ? ` · started ${info.startTimeIso.replace('T', ' ')}` : ' · start time not recorded'}
          </span>
        </div>
        <div className="rv-tools" role="toolbar" aria-label="View">
          <button type="button" onClick={() => zoomBy(2)} title="Zoom out: show twice as much time" aria-label="Zoom out">−</button>
          <button type="button" onClick={() => zoomBy(0.5)} title="Zoom in: show half as much time" aria-label="Zoom in">+</button>
          <button type="button" onClick={() => setView({ startSeconds: 0, endSeconds: duration })} title="Show the whole recording">Whole</button>
          <button
            type="button"
            disabled={!chosenSelection}
            onClick={() => chosenSelection && setView(spanAround(chosenSelection.startSeconds, chosenSelection.endSeconds, 0.25, duration, minSpan))}
            title="Zoom to the selection"
          >
            Selection
          </button>
          <label className="rv-inline">
            Gain
            <select value={gain} onChange={(e) => setGain(Number(e.target.value))} aria-label="Waveform gain">
              {gains.map((g) => <option key={g} value={g}>×{g}</option>)}
            </select>
          </label>
          <label className="rv-inline">
            <input type="checkbox" checked={showSpectrogram} onChange={(e) => setShowSpectrogram(e.target.checked)} /> Spectrogram
          </label>
          <button
            type="button"
            className="rv-primary"
            data-testid="recording-locate-selection"
            disabled={!chosenSelection}
            onClick={() => chosenSelection && onLocateSpan(chosenSelection.startSeconds, chosenSelection.endSeconds)}
            title="Measure the time differences in the selected span and locate the event there"
          >
            Locate selection
          </button>
        </div>
      </header>

      <canvas
        ref={navigatorRef}
        className="rv-navigator"
        aria-label="Whole recording; drag to scroll"
        onPointerDown={onNavigatorDown}
        onPointerMove={onNavigatorMove}
        onPointerUp={() => setDrag(undefined)}
      />
      <div className="rv-lanes-wrap">
        <canvas
          ref={lanesRef}
          className="rv-lanes"
          data-testid="recording-overview"
          aria-label="Channel envelopes; drag to select a span, click an event to choose it, wheel to zoom, drag the time axis to scroll"
          onPointerDown={onLanesDown}
          onPointerMove={onLanesMove}
          onPointerUp={onLanesUp}
          onPointerLeave={() => setHoverSeconds(undefined)}
        />
        {envelope === undefined && (
          <div className="rv-progress" role="status" style={{ top: layout.axisHeight }}>
            <span>Building the overview of every channel… {progressPercent} %</span>
            <progress max={100} value={progressPercent} />
          </div>
        )}
      </div>
      <div className="rv-status">
        <span>View {formatSpan(view.startSeconds, view.endSeconds, duration)}</span>
        {chosenSelection && <span>Selection {formatSpan(chosenSelection.startSeconds, chosenSelection.endSeconds, duration)}</span>}
        {coarse && (
          <span className="rv-note">
            Zoomed past the overview’s {formatSeconds(baseBucketSeconds)} resolution;{' '}
            {showSpectrogram ? 'the exact waveform comes with the spectrogram.' : 'turn the spectrogram on to fetch the exact waveform.'}
          </span>
        )}
        <span className="rv-hover">{hoverText}</span>
      </div>

      {showSpectrogram && (
        <div className="rv-spectrogram">
          <div className="rv-spectrogram-head">
            <span>
              Spectrogram of the visible span, mean power of all channels
              {shown ? ` · ${shown.spectrogram.fftSizePoints}-point Hann window, ${(shown.spectrogram.frequencyStepHz).toFixed(1)} Hz per bin` : ''}
              {spectrogramStatus === 'computing' ? ' · updating…' : ''}
            </span>
            <label className="rv-inline">
              Up to
              <select value={topHz} onChange={(e) => setTopHz(Number(e.target.value))} aria-label="Highest frequency shown">
                {topFrequencyChoicesHz.filter((f) => f < nyquistHz).map((f) => <option key={f} value={f}>{f / 1000} kHz</option>)}
                <option value={nyquistHz}>{nyquistHz / 1000} kHz (all)</option>
              </select>
            </label>
          </div>
          <canvas ref={spectrogramRef} data-testid="recording-spectrogram" aria-label="Spectrogram of the visible span" />
        </div>
      )}

      <div className="rv-events" data-testid="recording-events">
        <h3>Events ({events.length})</h3>
        {events.length === 0 ? (
          <p className="rv-muted">No events yet. Press Find &amp; locate, or drag across the lanes to select an event by hand.</p>
        ) : (
          <div className="rv-events-scroll">
            <table>
              <thead>
                <tr><th scope="col">#</th><th scope="col">Start</th><th scope="col">End</th><th scope="col">Length</th><th scope="col">Status</th></tr>
              </thead>
              <tbody>
                {events.map((event) => (
                  <tr
                    key={event.index}
                    className={event.selected ? 'rv-selected' : undefined}
                    aria-selected={event.selected}
                    onClick={() => onSelectEvent(event.index)}
                    data-testid={`recording-event-${event.index}`}
                  >
                    <td><button type="button" className="rv-link" onClick={(e) => { e.stopPropagation(); onSelectEvent(event.index); }}>{eventNumber(event)}</button></td>
                    <td>{formatOffset(event.startSeconds, style, 3)}</td>
                    <td>{formatOffset(event.endSeconds, style, 3)}</td>
                    <td>{((event.endSeconds - event.startSeconds) * 1000).toFixed(0)} ms</td>
                    <td><span className={`rv-status-chip rv-tone-${eventTone(event.status)}`}>{event.status ?? 'not located'}</span></td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </div>
    </section>
  );
}

function formatRate(sampleRateHz: number): string {
  return sampleRateHz % 1000 === 0 ? `${sampleRateHz / 1000} kHz` : `${(sampleRateHz / 1000).toFixed(3)} kHz`;
}

function formatSeconds(seconds: number): string {
  return seconds >= 1 ? `${seconds.toFixed(2)} s` : `${(seconds * 1000).toFixed(seconds < 0.01 ? 2 : 1)} ms`;
}
