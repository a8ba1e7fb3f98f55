// The correlations of the selected event: a small multiple per microphone pair (curve, chosen peak, ±σ, the lags the
// spacing allows, quality) and each channel's autocorrelation with its half-maximum width and expected timing precision.
import { useMemo } from 'react';
import type { ChannelAutocorrelationPlot, PairCorrelationPlot } from '../../core/overview';
import { autocorrelationShape } from './autocorrelationShape';
import type { AxisTick } from './lagAxis';
import { pairPlotShape, type PlotBox } from './pairPlotShape';
import { weightingName } from './plotFormat';
import './correlations.css';

export type { ChannelAutocorrelationPlot, PairCorrelationPlot } from '../../core/overview';

export interface CorrelationsViewProps {
  pairs: PairCorrelationPlot[];
  autocorrelations: ChannelAutocorrelationPlot[];
  bandHz: { lowHz: number; highHz: number };
  weighting: string;
}

const pairBox: PlotBox = { widthPixels: 232, heightPixels: 104, left: 6, right: 6, top: 6, bottom: 18 };
const autoBox: PlotBox = { widthPixels: 232, heightPixels: 92, left: 6, right: 6, top: 6, bottom: 18 };
/** A peak this close to its runner-up is worth a second look (the same ratio the pair card flags). */
const weakPeakRatio = 1.5;

export function CorrelationsView({ pairs, autocorrelations, bandHz, weighting }: CorrelationsViewProps) {
  const kept = pairs.filter((p) => p.used).length;
  // The independent delays the fix uses (pairs_used in the survey log): the kept pairs reduced to arrival times, one fewer than their microphones.
  const keptMicrophones = new Set(pairs.filter((p) => p.used).flatMap((p) => [p.indexA, p.indexB])).size;
  const independent = Math.max(0, keptMicrophones - 1);
  return (
    <section className="cv" data-testid="correlations-view" aria-label="Correlations of the selected event">
      <header className="cv-header">
        <h2>Correlations</h2>
        <span className="cv-facts">
          {weightingName(weighting)} · band {formatHz(bandHz.lowHz)}–{formatHz(bandHz.highHz)} · {pairs.length} pairs{pairs.length > 0 ? `, ${kept} kept (${pairs.length - kept} dropped) → ${independent} independent delays used in the fix` : ''}
        </span>
      </header>
      {pairs.length === 0 && autocorrelations.length === 0 ? (
        <p className="cv-muted">Select an event (or a span) to see how each microphone pair lines up.</p>
      ) : (
        <>
          <div className="cv-legend" aria-hidden="true">
            <span><i className="cv-swatch cv-swatch-band" /> lags the spacing allows, |τ| ≤ d/c</span>
            <span><i className="cv-swatch cv-swatch-peak" /> chosen peak</span>
            <span><i className="cv-swatch cv-swatch-sigma" /> ±1σ of the delay</span>
            <span>Δt = arrival at the first microphone minus the second</span>
          </div>
          <div className="cv-grid">
            {pairs.map((pair) => <PairCard key={`${pair.indexA}-${pair.indexB}`} plot={pair} />)}
          </div>
          {autocorrelations.length > 0 && (
            <>
              <h3 className="cv-subhead">Autocorrelation of each channel in the band <span className="cv-muted">— the sharper the lobe, the more precise its delays</span></h3>
              <div className="cv-grid">
                {autocorrelations.map((plot, index) => <AutocorrelationCard key={`${index}-${plot.label}`} plot={plot} index={index} />)}
              </div>
            </>
          )}
        </>
      )}
    </section>
  );
}

function PairCard({ plot }: { plot: PairCorrelationPlot }) {
  const shape = useMemo(() => pairPlotShape(plot, pairBox), [plot]);
  const weak = plot.peakToSecondRatio < weakPeakRatio;
  const plotBottom = pairBox.heightPixels - pairBox.bottom;
  return (
    <figure className={`cv-card${plot.used ? '' : ' cv-unused'}`} data-testid={`correlation-pair-${plot.indexA}-${plot.indexB}`}>
      <figcaption className="cv-card-title">
        <span>{shape.title}</span>
        {!plot.used && <span className="cv-badge" title="Dropped: its delay broke closure with the others">dropped</span>}
        {shape.beyondSpacing && <span className="cv-badge cv-badge-warn">beyond d/c</span>}
      </figcaption>
      <svg viewBox={`0 0 ${pairBox.widthPixels} ${pairBox.heightPixels}`} width="100%" className="cv-svg" role="img" aria-label={`${shape.title}: ${shape.delayText}, ${shape.qualityText}`}>
        <PlotArea box={pairBox} />
        {shape.spacingBand && (
          <rect x={shape.spacingBand.x0} y={pairBox.top} width={Math.max(1, shape.spacingBand.x1 - shape.spacingBand.x0)} height={plotBottom - pairBox.top} className="cv-band" />
        )}
        <line x1={pairBox.left} x2={pairBox.widthPixels - pairBox.right} y1={shape.zeroY} y2={shape.zeroY} className="cv-zero" />
        <path d={shape.curvePath} className="cv-curve" />
        <line x1={shape.sigmaBar.x0} x2={shape.sigmaBar.x1} y1={shape.sigmaBar.y - 5} y2={shape.sigmaBar.y - 5} className="cv-sigma" />
        <line x1={shape.sigmaBar.x0} x2={shape.sigmaBar.x0} y1={shape.sigmaBar.y - 8} y2={shape.sigmaBar.y - 2} className="cv-sigma" />
        <line x1={shape.sigmaBar.x1} x2={shape.sigmaBar.x1} y1={shape.sigmaBar.y - 8} y2={shape.sigmaBar.y - 2} className="cv-sigma" />
        <circle cx={shape.peak.x} cy={shape.peak.y} r={3} className={shape.beyondSpacing ? 'cv-peak cv-peak-warn' : 'cv-peak'} />
        <LagAxis box={pairBox} ticks={shape.xTicks} unit={shape.xUnit} />
      </svg>
      <div className="cv-text">{shape.delayText}</div>
      <div className={weak ? 'cv-text cv-warn' : 'cv-text cv-muted'}>{shape.qualityText}{weak ? ' · close second peak' : ''}</div>
    </figure>
  );
}

function AutocorrelationCard({ plot, index }: { plot: ChannelAutocorrelationPlot; index: number }) {
  const shape = useMemo(() => autocorrelationShape(plot, autoBox), [plot]);
  const plotBottom = autoBox.heightPixels - autoBox.bottom;
  return (
    <figure className="cv-card" data-testid={`autocorrelation-${index}`}>
      <figcaption className="cv-card-title"><span>{shape.title}</span></figcaption>
      <svg viewBox={`0 0 ${autoBox.widthPixels} ${autoBox.heightPixels}`} width="100%" className="cv-svg" role="img" aria-label={`${shape.title}: ${shape.widthText}, ${shape.precisionText}`}>
        <PlotArea box={autoBox} />
        <line x1={autoBox.left} x2={autoBox.widthPixels - autoBox.right} y1={shape.zeroY} y2={shape.zeroY} className="cv-zero" />
        {shape.halfWidthX !== undefined && (
          <>
            <rect x={autoBox.left} y={autoBox.top} width={Math.max(1, shape.halfWidthX - autoBox.left)} height={plotBottom - autoBox.top} className="cv-band" />
            <line x1={autoBox.left} x2={shape.halfWidthX} y1={shape.halfY} y2={shape.halfY} className="cv-half" />
            <line x1={shape.halfWidthX} x2={shape.halfWidthX} y1={autoBox.top} y2={plotBottom} className="cv-half" />
          </>
        )}
        {shape.firstZeroX !== undefined && <circle cx={shape.firstZeroX} cy={shape.zeroY} r={2.5} className="cv-zero-mark" />}
        <path d={shape.curvePath} className="cv-curve" />
        <LagAxis box={autoBox} ticks={shape.xTicks} unit={shape.xUnit} />
      </svg>
      <div className="cv-text cv-muted">{shape.widthText}</div>
      <div className="cv-text">{shape.precisionText}</div>
      {shape.basisText && <div className="cv-text cv-muted cv-small">{shape.basisText}</div>}
    </figure>
  );
}

/** The plot's background, inside the box's margins. */
function PlotArea({ box }: { box: PlotBox }) {
  return <rect x={box.left} y={box.top} width={box.widthPixels - box.left - box.right} height={box.heightPixels - box.bottom - box.top} className="cv-plot-area" />;
}

/** The lag axis under a plot: tick marks, their labels and the unit at the right. */
function LagAxis({ box, ticks, unit }: { box: PlotBox; ticks: readonly AxisTick[]; unit: string }) {
  const plotBottom = box.heightPixels - box.bottom;
  return (
    <>
      {ticks.map((tick) => (
        <g key={tick.position}>
          <line x1={tick.position} x2={tick.position} y1={plotBottom} y2={plotBottom + 3} className="cv-tick" />
          <text x={tick.position} y={plotBottom + 13} className="cv-tick-label">{tick.label}</text>
        </g>
      ))}
      <text x={box.widthPixels - box.right} y={box.top + 9} className="cv-unit">{unit}</text>
    </>
  );
}

function formatHz(hz: number): string {
  return hz >= 1000 ? `${Number((hz / 1000).toFixed(2))} kHz` : `${Math.round(hz)} Hz`;
}
