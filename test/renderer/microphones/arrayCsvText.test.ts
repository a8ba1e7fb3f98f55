import { describe, expect, it } from 'vitest';
import { readCsv } from '../../../core/csv';
import type { GeodeticPosition } from '../../../core/geo';
import { parseArrayCsv, type ArrayMicrophone } from '../../../core/project';
import { arrayCsvText, importArrayText } from '../../../renderer/microphones/arrayCsvText';

const origin: GeodeticPosition = { latitudeDegrees: 52.204512, longitudeDegrees: -1.621834, heightMeters: 84.2 };
const microphones: ArrayMicrophone[] = [
  { channel: 1, label: 'gate', eastMeters: 0, northMeters: 0, upMeters: 1.5, surveySigmaMeters: 0.03 },
  { channel: 2, label: 'oak, north side', eastMeters: 38.42, northMeters: 4.1, upMeters: 1.62, surveySigmaMeters: 0.03 },
  { channel: 3, label: 'pond', eastMeters: 52.05, northMeters: -36.77, upMeters: 1.4, surveySigmaMeters: 0.05 },
];

describe('arrayCsvText()', () => {
  // Expected values: round trips through core/csv (RFC 4180) and parseArrayCsv of the invented positions given; column names are this project's array format.
  it('arrayCsvText() writes the local columns of whence locate --array, read back unchanged by parseArrayCsv', () => {
    const text = arrayCsvText(microphones, 'local', undefined);
    expect(readCsv(text, 'a.csv').header).toEqual(['channel', 'label', 'x_m', 'y_m', 'z_m', 'sigma_m']);
    const geometry = parseArrayCsv(text, 'a.csv');
    expect(geometry.microphones).toEqual(microphones);
    expect(geometry.warnings).toEqual([]);
  });

  it('arrayCsvText() writes latitude/longitude columns that parseArrayCsv converts back to within 1 mm about the same origin', () => {
    const text = arrayCsvText(microphones, 'geodetic', origin);
    expect(readCsv(text, 'a.csv').header).toEqual(['channel', 'label', 'lat', 'lon', 'alt_m', 'sigma_m']);
    const back = parseArrayCsv(text, 'a.csv', origin).microphones;
    back.forEach((m, i) => {
      const expected = microphones[i]!;
      expect(m.label).toBe(expected.label);
      expect(Math.hypot(m.eastMeters - expected.eastMeters, m.northMeters - expected.northMeters, m.upMeters - expected.upMeters)).toBeLessThan(1e-3);
    });
  });
});

describe('importArrayText()', () => {
  // Expected values: the behaviour this project specifies (origin comment, centroid origin, messages); the centroid has zero mean east by definition.
  it('importArrayText() reads back the origin written as a comment, so a local table keeps its georeference', () => {
    const result = importArrayText(arrayCsvText(microphones, 'local', origin), 'a.csv', undefined);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.mode).toBe('local');
    expect(result.origin).toEqual(origin);
    expect(result.microphones).toEqual(microphones);
  });

  it('importArrayText() opens a latitude/longitude table in the geodetic mode about its centroid when no origin is known', () => {
    const text = 'channel,label,lat,lon,alt_m,sigma_m\n1,a,52.2051,-1.6221,85.6,0.02\n2,b,52.20525,-1.62152,86.1,0.02\n3,c,52.20488,-1.62131,85.2,0.04\n';
    const result = importArrayText(text, 'gnss.csv', undefined);
    expect(result.ok && result.mode).toBe('geodetic');
    if (!result.ok) return;
    expect(result.origin).toBeDefined();
    expect(Math.abs(result.microphones.reduce((sum, m) => sum + m.eastMeters, 0))).toBeLessThan(1e-6);
  });

  it('importArrayText() reports the reader\'s message for a broken table instead of throwing', () => {
    const result = importArrayText('channel,x_m,y_m\n1,0,0\n1,5,5\n', 'dup.csv', undefined);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.message).toContain('channel 1 is already used');
  });
});
