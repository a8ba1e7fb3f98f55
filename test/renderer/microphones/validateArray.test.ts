import { describe, expect, it } from 'vitest';
import { geodeticToEnu, type GeodeticPosition } from '../../../core/geo';
import type { ArrayMicrophone } from '../../../core/project';
import { blankRow, rowsFromMicrophones, type MicrophoneRowText } from '../../../renderer/microphones/arrayRows';
import { lineFit, validateArray } from '../../../renderer/microphones/validateArray';

function row(channel: string, label: string, east: string, north: string, up = '', sigma = ''): MicrophoneRowText {
  return { ...blankRow(), channel, label, east, north, up, sigma };
}

function geoRow(channel: string, lat: string, lon: string, alt = ''): MicrophoneRowText {
  return { ...blankRow(), channel, lat, lon, alt };
}

const square = [row('1', 'A', '0', '0', '1.5', '0.02'), row('2', 'B', '50', '0'), row('3', '', '50', '50', '1.2'), row('4', 'D', '0', '50', '', '0.05')];

describe('validateArray()', () => {
  it('validateArray() reads a clean local table: blank up and sigma are 0, a blank label becomes M<channel>', () => {
    const result = validateArray(square);
    expect(result.errorRowCount).toBe(0);
    expect(result.table).toEqual([]);
    expect(result.microphones).toEqual([
      { channel: 1, label: 'A', eastMeters: 0, northMeters: 0, upMeters: 1.5, surveySigmaMeters: 0.02 },
      { channel: 2, label: 'B', eastMeters: 50, northMeters: 0, upMeters: 0, surveySigmaMeters: 0 },
      { channel: 3, label: 'M3', eastMeters: 50, northMeters: 50, upMeters: 1.2, surveySigmaMeters: 0 },
      { channel: 4, label: 'D', eastMeters: 0, northMeters: 50, upMeters: 0, surveySigmaMeters: 0.05 },
    ]);
    expect(result.rows.every((check) => check.messages.length === 0)).toBe(true);
  });

  it('validateArray() says at once when the array is beyond physical sense: 60 km across, or points around the equator', () => {
    // Limits of core/project arrayExtent (this project's): 50 km aperture, origin within -12..100 km of the ellipsoid.
    const wide = validateArray([row('1', 'A', '0', '0'), row('2', 'B', '60000', '0'), row('3', 'C', '0', '60000')]);
    expect(wide.table.map((m) => [m.severity, m.text])).toContainEqual(['error', expect.stringMatching(/^Microphones B and C are 84\.9 km apart, more than 50 km/)]);
    const equator = validateArray([geoRow('1', '0', '0'), geoRow('2', '0', '90'), geoRow('3', '0', '180'), geoRow('4', '0', '-90')], undefined, { mode: 'geodetic' });
    expect(equator.table.map((m) => m.text).join(' ')).toMatch(/The origin of the local frame is -6356\.8 km from the WGS84 ellipsoid/);
    expect(validateArray(square).table).toEqual([]);
  });

  it('validateArray() marks each row past MAX_MICROPHONES (256) as an error saying the limit', () => {
    // Expected: this project's limit (core/project MAX_MICROPHONES), as parseArrayCsv() and the project schema apply it.
    const rows = Array.from({ length: 258 }, (_, i) => row(String(i + 1), '', String(i), String((i * i) % 97)));
    const result = validateArray(rows);
    expect(result.errorRowCount).toBe(2);
    expect(result.rows[256]!.messages.map((m) => m.text)).toContain('Whence takes at most 256 microphones per array; remove this row or split the array.');
    expect(result.rows[255]!.messages.filter((m) => m.severity === 'error')).toEqual([]);
    expect(result.microphones).toHaveLength(256);
  });

  it('validateArray() marks text in a number cell on that cell and leaves the row out, keeping the others', () => {
    const rows = [...square];
    rows[1] = row('2', 'B', 'fifty', '0');
    const result = validateArray(rows);
    expect(result.rows[1]!.cells.east?.severity).toBe('error');
    expect(result.rows[1]!.cells.east?.text).toContain("'fifty' is not a number");
    expect(result.rows[1]!.microphone).toBeUndefined();
    expect(result.microphones.map((m) => m.channel)).toEqual([1, 3, 4]);
    expect(result.errorRowCount).toBe(1);
    expect(rows[1]!.east).toBe('fifty'); // the typed text is untouched
  });

  it('validateArray() says a decimal comma is a comma and shows the number meant', () => {
    const result = validateArray([row('1', 'A', '12,5', '0'), ...square.slice(1)]);
    expect(result.rows[0]!.cells.east?.text).toContain('(12.5)');
  });

  it('validateArray() names both rows of a duplicate channel and leaves out the later one', () => {
    const rows = [...square];
    rows[3] = row('2', 'D', '0', '50');
    const result = validateArray(rows);
    expect(result.rows[3]!.cells.channel?.severity).toBe('error');
    expect(result.rows[3]!.cells.channel?.text).toContain('already used by row 2 (B)');
    expect(result.rows[1]!.cells.channel?.severity).toBe('warning');
    expect(result.rows[1]!.cells.channel?.text).toContain('row 4 (D)');
    expect(result.microphones.map((m) => m.label)).toEqual(['A', 'B', 'M3']);
  });

  it('validateArray() names both rows of a duplicate position (within 1 mm)', () => {
    const rows = [...square, row('5', 'E', '50.0004', '50', '1.2')];
    const result = validateArray(rows);
    expect(result.rows[4]!.messages.map((m) => m.text).join(' ')).toContain('same position as row 3 (M3)');
    expect(result.rows[4]!.microphone).toBeUndefined();
    expect(result.rows[2]!.messages.map((m) => m.text).join(' ')).toContain('same position as row 5 (E)');
    expect(result.rows[2]!.microphone).toBeDefined();
  });

  it('validateArray() warns when all microphones lie on one line, and not for a square', () => {
    const line = [row('1', '', '0', '0'), row('2', '', '10', '5'), row('3', '', '20', '10'), row('4', '', '40', '20.1')];
    const onLine = validateArray(line);
    expect(onLine.table.map((m) => m.text).join(' ')).toMatch(/All 4 microphones lie on one line/);
    expect(validateArray(square).table).toEqual([]);
    // 2 m off a 40 m line (10 % of the radius): a usable, if poor, layout, not a line.
    const bent = validateArray([row('1', '', '0', '0'), row('2', '', '20', '2'), row('3', '', '40', '0')]);
    expect(bent.table).toEqual([]);
  });

  it('validateArray() marks a channel beyond the recording only when the channel count is known', () => {
    const rows = [...square.slice(0, 3), row('6', 'D', '0', '50')];
    expect(validateArray(rows).errorRowCount).toBe(0);
    const result = validateArray(rows, 4);
    expect(result.rows[3]!.cells.channel?.text).toBe("channel 6 is beyond the recording's 4 channels");
    expect(result.microphones).toHaveLength(3);
  });

  it('validateArray() refuses a latitude beyond 90° and a longitude beyond 180°, suggesting a swap', () => {
    const origin: GeodeticPosition = { latitudeDegrees: 52, longitudeDegrees: -1.6, heightMeters: 80 };
    const result = validateArray([geoRow('1', '95', '52'), geoRow('2', '52', '200')], undefined, { mode: 'geodetic', origin });
    expect(result.rows[0]!.cells.lat?.text).toContain('Are latitude and longitude swapped?');
    expect(result.rows[1]!.cells.lon?.text).toContain('within −180..180°');
    expect(result.microphones).toEqual([]);
  });

  it('validateArray() converts degrees-minutes-seconds rows about the origin like core/geo (IOGP example)', () => {
    // IOGP Guidance Note 7-2 (EPSG 9837 example): origin 55°N 5°E h 200 m; the point 53°48'33.82"N 2°07'46.38"E h 73 m
    // lies at E -189013.869, N -128642.040, U -4220.171 m (via its ECEF X 3771793.97, Y 140253.34, Z 5124304.35, EPSG 9602).
    const origin: GeodeticPosition = { latitudeDegrees: 55, longitudeDegrees: 5, heightMeters: 200 };
    const result = validateArray([geoRow('1', '53°48\'33.82"N', '2°07\'46.38"E', '73')], undefined, { mode: 'geodetic', origin });
    const microphone = result.microphones[0]!;
    expect(microphone.eastMeters).toBeCloseTo(-189013.869, 1);
    expect(microphone.northMeters).toBeCloseTo(-128642.04, 1);
    expect(microphone.upMeters).toBeCloseTo(-4220.171, 1);
    // 230 km from the origin: kept, with a warning to check the coordinates.
    expect(result.rows[0]!.cells.lat?.severity).toBe('warning');
    expect(result.rows[0]!.cells.lat?.text).toContain('km from the origin');
  });

  it('validateArray() in the geodetic mode without an origin uses the centroid of the microphones', () => {
    const rows = [geoRow('1', '52.2', '-1.62', '80'), geoRow('2', '52.2004', '-1.62', '80'), geoRow('3', '52.2002', '-1.6195', '80')];
    const result = validateArray(rows, undefined, { mode: 'geodetic' });
    expect(result.origin).toBeDefined();
    const sum = result.microphones.reduce((s, m) => ({ e: s.e + m.eastMeters, n: s.n + m.northMeters }), { e: 0, n: 0 });
    expect(Math.abs(sum.e)).toBeLessThan(1e-6);
    expect(Math.abs(sum.n)).toBeLessThan(1e-6);
    const check = geodeticToEnu({ latitudeDegrees: 52.2, longitudeDegrees: -1.62, heightMeters: 80 }, result.origin!);
    expect(result.microphones[0]!.eastMeters).toBeCloseTo(check.eastMeters, 9);
  });

  it('validateArray() treats an empty row as unfinished (no error, not used) and asks for a missing north', () => {
    const result = validateArray([...square, blankRow(), row('6', 'F', '10', '')]);
    expect(result.rows[4]!.blank).toBe(true);
    expect(result.rows[4]!.messages[0]!.severity).toBe('warning');
    expect(result.rows[5]!.cells.north?.text).toBe('north: enter metres north');
    expect(result.errorRowCount).toBe(1);
    expect(result.microphones).toHaveLength(4);
  });

  it('validateArray() refuses a negative survey sigma and a channel that is not a whole number from 1', () => {
    const result = validateArray([row('0', '', '0', '0'), row('2.5', '', '1', '0'), row('3', '', '2', '1', '', '-0.1')]);
    expect(result.rows[0]!.cells.channel?.text).toContain('whole number from 1');
    expect(result.rows[1]!.cells.channel?.text).toContain("'2.5' is not a channel");
    expect(result.rows[2]!.cells.sigma?.text).toContain('cannot be negative');
    expect(result.table[0]!.text).toContain('at least 3 microphones');
  });

  it('validateArray() gives back exactly the microphones a table was filled from, in both modes', () => {
    const origin: GeodeticPosition = { latitudeDegrees: 52.204512, longitudeDegrees: -1.621834, heightMeters: 84.2 };
    const microphones: ArrayMicrophone[] = [
      { channel: 1, label: 'gate', eastMeters: 0.123456789, northMeters: -3.000049, upMeters: 1.5, surveySigmaMeters: 0.025 },
      { channel: 3, label: 'oak', eastMeters: 38.41999, northMeters: 4.1, upMeters: 1.62, surveySigmaMeters: 0.03 },
      { channel: 2, label: 'pond', eastMeters: 52.05, northMeters: 36.77, upMeters: 1.4, surveySigmaMeters: 0.05 },
    ];
    expect(validateArray(rowsFromMicrophones(microphones, 'local', origin)).microphones).toEqual(microphones);
    const back = validateArray(rowsFromMicrophones(microphones, 'geodetic', origin), undefined, { mode: 'geodetic', origin }).microphones;
    back.forEach((m, i) => {
      expect(m.channel).toBe(microphones[i]!.channel);
      expect(Math.hypot(m.eastMeters - microphones[i]!.eastMeters, m.northMeters - microphones[i]!.northMeters, m.upMeters - microphones[i]!.upMeters)).toBeLessThan(1e-6);
    });
  });
});

describe('lineFit()', () => {
  it('lineFit() measures the largest distance from the best-fit line and the radius about the centroid', () => {
    // Symmetric about (10, 0): the principal axis is east, the points (10, ±0.2) lie 0.2 m off it (geometry).
    const fit = lineFit([{ eastMeters: 0, northMeters: 0 }, { eastMeters: 20, northMeters: 0 }, { eastMeters: 10, northMeters: 0.2 }, { eastMeters: 10, northMeters: -0.2 }]);
    expect(fit.offLineMeters).toBeCloseTo(0.2, 12);
    expect(fit.radiusMeters).toBeCloseTo(10, 12);
  });
});
