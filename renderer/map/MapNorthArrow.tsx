// The north arrow badge of the map (the local east/north/up frame is drawn north-up).
import { northArrow } from './northArrow';

export function MapNorthArrow({ sizePixels = 44 }: { sizePixels?: number }) {
  const arrow = northArrow(sizePixels);
  const points = (flat: number[]): string => flat.map((v, k) => `${v.toFixed(2)}${k % 2 === 0 ? ',' : ' '}`).join('').trim();
  return (
    <svg className="map-north-arrow" data-testid="map-north-arrow" width={sizePixels} height={sizePixels} role="img" aria-label="North is up">
      <polygon points={points(arrow.headPoints)} fill="#fffdf8" stroke="#1d2a2f" strokeWidth={1.2} strokeLinejoin="round" />
      <polygon points={points(arrow.shadedPoints)} fill="#1d2a2f" />
      <text x={arrow.label.xPixels} y={arrow.label.yPixels} textAnchor="middle" dominantBaseline="central" fontSize={12} fontWeight={700} fill="#1d2a2f">
        {arrow.label.text}
      </text>
    </svg>
  );
}
