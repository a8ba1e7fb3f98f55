// The legend of the map: hyperbola colours by delay quality and, when shown, the overlay's colours with its range.
import { cssGradient } from './colourScale';
import type { OverlayLegend } from './overlayRaster';
import { QUALITY_SCALE } from './qualityColour';

export interface MapLegendProps {
  showHyperbolae: boolean;
  overlay: OverlayLegend | null;
  overlayError: string | null;
}

export function MapLegend({ showHyperbolae, overlay, overlayError }: MapLegendProps) {
  if (!showHyperbolae && overlay === null && overlayError === null) return null;
  return (
    <div className="map-legend" data-testid="map-legend">
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
