// The legend of the map: hyperbola colours by delay quality and, when shown, the overlay's colours with its range.
import { cssGradient } from './colourScale';
import type { OverlayLegend } from './overlayRaster';
import { QUALITY_SCALE } from './qualityColour';
import { VERDICT_ORDER, VERDICT_STYLES } from '../verdict';

export interface MapLegendProps {
  showHyperbolae: boolean;
  /** Explain the fix markers (colour and shape by verdict). */
  showFixes?: boolean;
  overlay: OverlayLegend | null;
  overlayError: string | null;
  /** The overlay's peak is marked on the map. */
  srpPeak?: boolean;
}

export function MapLegend({ showHyperbolae, showFixes = false, overlay, overlayError, srpPeak = false }: MapLegendProps) {
  if (!showHyperbolae && !showFixes && overlay === null && overlayError === null) return null;
  return (
    <div className="map-legend" data-testid="map-legend">
      {showFixes && (
        <div className="map-legend-row" data-testid="map-legend-fixes">
          <div className="map-legend-title">fixes:</div>
          <ul className="map-legend-verdicts">
            {VERDICT_ORDER.map((grade) => (
              <li key={grade} data-testid={`map-legend-verdict-${grade}`}>
                <span className="map-legend-symbol" style={{ color: VERDICT_STYLES[grade].colour }} aria-hidden="true">{VERDICT_STYLES[grade].symbol}</span>
                <strong>{grade}</strong>: {VERDICT_STYLES[grade].advice}
              </li>
            ))}
          </ul>
        </div>
      )}
      {showHyperbolae && (
        <div className="map-legend-row" data-testid="map-legend-hyperbolae">
          <div className="map-legend-title">hyperbolae: delay quality</div>
          <div className="map-legend-bar" style={{ background: cssGradient(QUALITY_SCALE) }} />
          <div className="map-legend-ends">
            <span>poor</span>
            <span>excellent</span>
          </div>
        </div>
      )}
      {overlay !== null && (
        <div className="map-legend-row" data-testid="map-legend-overlay" data-min-value={overlay.minValue} data-max-value={overlay.maxValue}>
          <div className="map-legend-title">
            {overlay.title}
            {overlay.scaleKind === 'log' ? ' (log scale)' : ''}
          </div>
          <div className="map-legend-bar" style={{ background: `linear-gradient(to right, ${overlay.colours.join(', ')})` }} />
          <div className="map-legend-ends">
            <span>{overlay.minLabel}</span>
            <span>{overlay.maxLabel}</span>
          </div>
          {srpPeak && <div className="map-legend-peak" data-testid="map-legend-srp-peak"><span className="map-legend-symbol" style={{ color: '#6a3d9a' }} aria-hidden="true">◇</span> peak: the most likely place</div>}
        </div>
      )}
      {overlayError !== null && (
        <p className="map-legend-error" role="alert">
          {overlayError}
        </p>
      )}
    </div>
  );
}
