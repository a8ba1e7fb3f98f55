// The scale bar of the map: a 1-2-5 length drawn to scale with its label, in alternating black and white halves.
import { scaleBar } from './scaleBar';

export function MapScaleBar({ metersPerPixel }: { metersPerPixel: number }) {
  const bar = scaleBar(metersPerPixel);
  const width = Math.max(1, Math.round(bar.lengthPixels));
  const half = width / 2;
  return (
    <div className="map-scale-bar" data-testid="map-scale-bar" data-length-meters={bar.lengthMeters} data-length-pixels={bar.lengthPixels.toFixed(3)}>
      <svg width={width + 2} height={10} aria-hidden="true">
        <rect x={1} y={2} width={half} height={6} fill="#1d2a2f" />
        <rect x={1 + half} y={2} width={half} height={6} fill="#fffdf8" stroke="#1d2a2f" strokeWidth={1} />
        <rect x={1} y={2} width={width} height={6} fill="none" stroke="#1d2a2f" strokeWidth={1} />
      </svg>
      <span>{bar.label}</span>
    </div>
  );
}
