// The recorders time line: one lane per recorder on the deployment's time axis, each file a bar (name, length and where
// its start came from in its tooltip), gaps as marked breaks with their length, the recording view's span; a click moves the view.
import { useMemo, useRef, useState, type MouseEvent } from 'react';
import type { DeploymentLayout } from '../../core/deployment';
import { timeScale, timeTicks, useWidthCss, type ViewSpan } from '../recording';
import { clocksInUseText, type ClocksInUse } from './clockFitRows';
import { recorderLanes, viewCentredOn } from './recorderLanes';
import './deployment.css';

export interface RecordersTimelineProps {
  layout: DeploymentLayout;
  clocks: ClocksInUse;
  /** The recording view's span, seconds of deployment time. */
  view: ViewSpan | undefined;
  startTimeIso: string | undefined;
  onMoveView(view: ViewSpan): void;
}

/** Same gutter as the recording view's, so the two time axes line up. */
const GUTTER_PIXELS = 92;
const AXIS_PIXELS = 16;

/** Lane height: 13 px up to 8 recorders, then less (not under 6 px) so the time line stays about 100 px high. */
export function laneHeightPixels(recorderCount: number): number {
  return Math.max(6, Math.min(13, Math.floor(104 / Math.max(1, recorderCount))));
}

export function RecordersTimeline({ layout, clocks, view, startTimeIso, onMoveView }: RecordersTimelineProps) {
  const containerRef = useRef<HTMLDivElement>(null);
  const widthCss = useWidthCss(containerRef);
  const [shown, setShown] = useState(true);
  const plotWidth = Math.max(1, widthCss - GUTTER_PIXELS - 8);
  const duration = Math.max(layout.durationSeconds, 1e-3);
  const scale = useMemo(() => timeScale({ startSeconds: 0, endSeconds: duration }, plotWidth), [duration, plotWidth]);
  const fitted = clocks.kind === 'fitted' ? clocks.report : undefined;
  const laneClocks = useMemo(() => layout.recorders.map((recorder) => fitted?.recorders.find((r) => r.name === recorder.name)), [layout, fitted]);
  const lanePixels = laneHeightPixels(layout.recorders.length);
  const lanes = useMemo(() => recorderLanes(layout, scale, { laneHeightPixels: lanePixels, clocks: laneClocks, ...(view !== undefined ? { view } : {}) }), [layout, scale, laneClocks, view, lanePixels]);
  const ticks = useMemo(() => timeTicks(scale, duration, startTimeIso, 140).ticks, [scale, duration, startTimeIso]);
  const heightPixels = AXIS_PIXELS + lanes.heightPixels + 2;
  const gapCount = lanes.lanes.reduce((count, lane) => count + lane.gaps.length, 0);

  const onClick = (event: MouseEvent<SVGSVGElement>) => {
    if (view === undefined) return;
    const x = event.clientX - event.currentTarget.getBoundingClientRect().left - GUTTER_PIXELS;
    if (x < 0 || x > plotWidth) return;
    onMoveView(viewCentredOn(view, scale.toSeconds(x), duration));
  };

  return (
    <section className="recorders-timeline" ref={containerRef} data-testid="recorders-timeline" aria-label="Recorders time line">
      <header className="recorders-timeline-head">
        <button type="button" className="timeline-toggle" onClick={() => setShown((open) => !open)} aria-expanded={shown} data-testid="timeline-toggle" title={shown ? 'Hide the recorders time line (more room for the recording)' : 'Show the recorders time line'}>{shown ? '▾' : '▸'}</button>
        <strong>Recorders</strong>
        <span>{layout.recorders.length} recorders, {layout.recorders.reduce((n, r) => n + r.files.length, 0)} files, {gapCount === 0 ? 'no gaps' : `${gapCount} gap${gapCount === 1 ? '' : 's'}`}</span>
        <span className={clocks.kind === 'fitted' ? 'clocks-fitted' : 'clocks-files'} data-testid="timeline-clocks">Clocks: {clocksInUseText(clocks)}</span>
        {shown && <span className="muted">Click to show that time in the recording view.</span>}
      </header>
      {shown && <svg width={widthCss} height={heightPixels} onClick={onClick} role="img" aria-label={`Files of ${layout.recorders.length} recorders on the deployment's time line; the framed span is the recording view's`}>
        <defs>
          <clipPath id="timeline-plot"><rect x={0} y={0} width={plotWidth} height={heightPixels} /></clipPath>
        </defs>
        <g transform={`translate(${GUTTER_PIXELS},0)`}>
          {ticks.map((tick) => (
            <g key={tick.timeSeconds} transform={`translate(${tick.xPixels},0)`}>
              <line y1={AXIS_PIXELS - 4} y2={heightPixels} className="timeline-tick" />
              <text x={3} y={AXIS_PIXELS - 5} className="timeline-tick-label">{tick.wallClock ?? tick.label}</text>
            </g>
          ))}
        </g>
        {lanes.lanes.map((lane, index) => (
          <g key={lane.name} transform={`translate(0,${AXIS_PIXELS + lane.top})`} data-testid={`recorder-lane-${index}`}>
            <text x={GUTTER_PIXELS - 6} y={lanePixels - 4} className="timeline-lane-name" textAnchor="end">{lane.name}</text>
            <g transform={`translate(${GUTTER_PIXELS},0)`} clipPath="url(#timeline-plot)">
              {lane.bars.map((bar) => (
                <rect key={bar.file} x={bar.x0} y={2} width={Math.max(1, bar.x1 - bar.x0)} height={lanePixels - 4} rx={2} className="timeline-file" data-testid="recorder-file">
                  <title>{bar.title}</title>
                </rect>
              ))}
              {lane.bars.filter((bar) => bar.joined).map((bar) => <line key={`split-${bar.file}`} x1={bar.x0} x2={bar.x0} y1={2} y2={lanePixels - 2} className="timeline-split" />)}
              {lane.gaps.map((gap) => (
                <g key={`gap-${gap.fromSeconds}`} data-testid="recorder-gap">
                  <rect x={gap.x0} y={0} width={gap.x1 - gap.x0} height={lanePixels} className="timeline-gap"><title>{`${lane.name}: ${gap.label}, silent (nothing recorded; events there lose this recorder's microphones)`}</title></rect>
                  <text x={gap.x1 + 3} y={lanePixels - 4} className="timeline-gap-label">{gap.label}</text>
                </g>
              ))}
            </g>
          </g>
        ))}
        {lanes.view !== undefined && (
          <rect x={GUTTER_PIXELS + lanes.view.x0} y={AXIS_PIXELS - 2} width={lanes.view.x1 - lanes.view.x0} height={lanes.heightPixels + 3} className="timeline-view" data-testid="timeline-view">
            <title>The recording view's span</title>
          </rect>
        )}
      </svg>}
    </section>
  );
}
