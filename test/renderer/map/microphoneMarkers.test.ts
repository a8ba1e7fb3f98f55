import { describe, expect, it } from 'vitest';
import { MapScale } from '../../../renderer/map/mapScale';
import { microphoneMarkers } from '../../../renderer/map/microphoneMarkers';

describe('microphoneMarkers()', () => {
  // Expected values: pixel = centre + (east - centreEast) / (m per px), y flipped (screen y down), worked by hand; title layout is this project's.
  it('microphoneMarkers() places each microphone through the scale with its label, channel and a title', () => {
    const scale = MapScale.create({ centerEastMeters: 10, centerNorthMeters: 10, metersPerPixel: 0.5, widthPixels: 400, heightPixels: 300 });
    const markers = microphoneMarkers(
      [
        { label: 'A1', channel: 3, eastMeters: 12, northMeters: -4.5, upMeters: 1.2 },
        { label: '', channel: 7, eastMeters: 10, northMeters: 10, upMeters: 0 },
      ],
      scale,
    );
    expect(markers[0]).toMatchObject({ index: 0, label: 'A1', channel: 3, xPixels: 204, yPixels: 179 });
    expect(markers[0].title).toBe('A1 · channel 3 · E 12.00 m, N −4.50 m, up 1.20 m');
    expect(markers[1]).toMatchObject({ index: 1, label: '#2', channel: 7, xPixels: 200, yPixels: 150 });
  });
});

describe('microphoneMarkers() with unusable positions', () => {
  // Expected values: the same scale worked by hand; leaving out non-finite positions is this project's choice.
  it('microphoneMarkers() leaves out a microphone without a finite position and keeps the others’ indices', () => {
    const scale = MapScale.create({ centerEastMeters: 0, centerNorthMeters: 0, metersPerPixel: 1, widthPixels: 100, heightPixels: 100 });
    const markers = microphoneMarkers(
      [
        { label: 'a', channel: 1, eastMeters: Number.NaN, northMeters: 0, upMeters: 0 },
        { label: 'b', channel: 2, eastMeters: 1, northMeters: 2, upMeters: 0 },
      ],
      scale,
    );
    expect(markers.map((m) => [m.index, m.label, m.xPixels, m.yPixels])).toEqual([[1, 'b', 51, 48]]);
  });
});
