// The cursor's coordinates under the map: east/north metres, and latitude/longitude when the array has a WGS84 origin.
// Holds its own state, fed through a sink, so pointer moves re-render this box and not the whole map.

import { useEffect, useState, type RefObject } from 'react';
import { cursorReadout } from './cursorReadout';
import type { MapScale, ScreenPoint } from './mapScale';
import type { MapOrigin } from './types';

export type CursorSink = (point: ScreenPoint | null) => void;

export interface MapCursorReadoutProps {
  sinkRef: RefObject<CursorSink | null>;
  scale: MapScale;
  origin?: MapOrigin;
  planeUpMeters: number;
}

export function MapCursorReadout({ sinkRef, scale, origin, planeUpMeters }: MapCursorReadoutProps) {
  const [point, setPoint] = useState<ScreenPoint | null>(null);
  useEffect(() => {
    sinkRef.current = setPoint;
    return () => {
      sinkRef.current = null;
    };
  }, [sinkRef]);
  const readout = point === null ? null : cursorReadout(scale, point, origin, planeUpMeters);
  return (
    <div
      className="map-readout"
      data-testid="map-cursor-readout"
      data-east-meters={readout?.eastMeters}
      data-north-meters={readout?.northMeters}
      data-latitude-degrees={readout?.latitudeDegrees}
      data-longitude-degrees={readout?.longitudeDegrees}
      aria-live="off"
    >
      {readout === null ? (
        <span className="map-readout-idle">point at the map for coordinates</span>
      ) : (
        <>
          <span>{readout.localText}</span>
          {readout.geodeticText !== undefined && <span className="map-readout-geo">{readout.geodeticText}</span>}
        </>
      )}
    </div>
  );
}
