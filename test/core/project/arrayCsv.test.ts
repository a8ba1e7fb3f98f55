import { describe, expect, it } from 'vitest';
import { MAX_MICROPHONES, parseArrayCsv, parseDelaysCsv } from '../../../core/project';
import { geodeticToEnu } from '../../../core/geo';

describe('parseArrayCsv()', () => {
  it('reads local metres with labels, heights and survey sigmas', () => {
    const geometry = parseArrayCsv('channel,label,x_m,y_m,z_m,sigma_m\n1,pond,0,0,1.2,0.02\n2,reeds,40,0,1.5,0.03\n3,,0,35,\n', 'array.csv');
    expect(geometry.microphones).toEqual([
      { channel: 1, label: 'pond', eastMeters: 0, northMeters: 0, upMeters: 1.2, surveySigmaMeters: 0.02 },
      { channel: 2, label: 'reeds', eastMeters: 40, northMeters: 0, upMeters: 1.5, surveySigmaMeters: 0.03 },
      { channel: 3, label: 'M3', eastMeters: 0, northMeters: 35, upMeters: 0, surveySigmaMeters: 0 },
    ]);
    expect(geometry.origin).toBeUndefined();
    expect(geometry.warnings).toEqual([]);
  });

  it('warns that positions are taken as exact when there is no sigma_m column', () => {
    const geometry = parseArrayCsv('channel,x_m,y_m\n1,0,0\n2,10,0\n', 'array.csv');
    expect(geometry.warnings.join(' ')).toMatch(/no sigma_m column/);
  });

  it('converts WGS84 positions to local east/north/up about their centroid', () => {
    const text = 'channel,lat,lon,alt_m\n1,52.0,-1.0,100\n2,52.001,-1.0,100\n3,52.0,-0.998,100\n';
    const geometry = parseArrayCsv(text, 'geo.csv');
    const origin = geometry.origin!;
    expect(origin.latitudeDegrees).toBeCloseTo(52.000333, 5);
    // Round trip through core/geo: each microphone's ENU is its WGS84 position about the origin.
    const enu = geodeticToEnu({ latitudeDegrees: 52.001, longitudeDegrees: -1, heightMeters: 100 }, origin);
    expect(geometry.microphones[1]!.northMeters).toBeCloseTo(enu.northMeters, 6);
    // 0.001° of latitude is about 111 m (common practice).
    expect(geometry.microphones[1]!.northMeters - geometry.microphones[0]!.northMeters).toBeCloseTo(111.3, 0);
  });

  it('refuses duplicate channels, swapped coordinates and mixed position kinds with file, line and column', () => {
    expect(() => parseArrayCsv('channel,x_m,y_m\n1,0,0\n1,5,5\n', 'a.csv')).toThrow("a.csv, line 3, column 'channel': channel 1 is already used on line 2");
    expect(() => parseArrayCsv('channel,lat,lon\n1,-1.5,152.0\n2,152.0,-1.5\n', 'b.csv')).toThrow(/b\.csv, line 3, column 'lat'.*swapped/);
    expect(() => parseArrayCsv('channel,x_m,y_m,lat,lon\n1,0,0,1,1\n', 'c.csv')).toThrow(/both local columns/);
    expect(() => parseArrayCsv('channel,x_m,y_m\n0,0,0\n', 'd.csv')).toThrow(/whole number from 1/);
    expect(() => parseArrayCsv('channel,x_m,y_m\n1,zero,0\n', 'e.csv')).toThrow("e.csv, line 2, column 'x_m': 'zero' is not a number");
  });
});

describe('parseArrayCsv() bad input', () => {
  // Expected: the refusals this project specifies (issue 11); before, extra cells were dropped and positions shifted.
  it('parseArrayCsv() refuses a comma-decimal row with its line number and says the decimal mark is the problem', () => {
    const text = 'channel,x_m,y_m,z_m\n1,0,0,1\n2,12,5,3,25,1\n3,0,40,1\n';
    expect(() => parseArrayCsv(text, 'comma.csv')).toThrow(/^comma\.csv, line 3: it has 6 cells but the header names 4 columns; the numbers seem to use a comma as the decimal mark/);
  });

  it('parseArrayCsv() refuses any row with more cells than the header, naming the line; trailing empty cells are allowed', () => {
    expect(() => parseArrayCsv('channel,x_m,y_m\n1,0,0\n2,five,0,extra\n', 'extra.csv')).toThrow(/^extra\.csv, line 3: it has 4 cells but the header names 3 columns \(separated by commas\)/);
    expect(parseArrayCsv('channel,x_m,y_m\n1,0,0,,\n2,5,0\n3,0,5\n', 'trailing.csv').microphones).toHaveLength(3);
  });

  it('parseArrayCsv() and parseDelaysCsv() keep labels and event names printable: control characters escaped, 200 characters at most', () => {
    const geometry = parseArrayCsv(`channel,label,x_m,y_m\n1,"\u001b[2Jre\reds",0,0\n2,${'k'.repeat(500)},5,0\n3,plain,0,5\n`, 'labels.csv');
    expect(geometry.microphones.map((m) => m.label)).toEqual(['\\x1b[2Jre\\x0deds', `${'k'.repeat(197)}...`, 'plain']);
    const events = parseDelaysCsv('event,mic_a,mic_b,delay_s\n"frog\u0007\u009b1",2,1,0.001\n', 'd.csv', new Set([1, 2]));
    expect(events[0]!.event).toBe('frog\\x07\\x9b1');
  });

  it('parseArrayCsv() takes MAX_MICROPHONES microphones and refuses one more, saying the limit', () => {
    const rows = (count: number) => Array.from({ length: count }, (_, i) => `${i + 1},${i},${(i * i) % 97}`).join('\n');
    expect(MAX_MICROPHONES).toBe(256);
    expect(parseArrayCsv(`channel,x_m,y_m\n${rows(MAX_MICROPHONES)}\n`, 'full.csv').microphones).toHaveLength(MAX_MICROPHONES);
    expect(() => parseArrayCsv(`channel,x_m,y_m\n${rows(20_000)}\n`, 'huge.csv')).toThrow(/^huge\.csv, line 258: the table has 20000 microphones; Whence takes at most 256 per array/);
  });
});

describe('parseDelaysCsv()', () => {
  const channels = new Set([1, 2, 3, 4]);

  it('groups rows by event in order of appearance, with optional sigmas', () => {
    const events = parseDelaysCsv('event,mic_a,mic_b,delay_s,sigma_s\nfrog-1,2,1,0.0125,0.0001\nfrog-1,3,1,-0.004,\nfrog-2,2,1,0.001,0.0002\n', 'd.csv', channels);
    expect(events.map((e) => e.event)).toEqual(['frog-1', 'frog-2']);
    expect(events[0]!.rows).toEqual([
      { channelA: 2, channelB: 1, delaySeconds: 0.0125, sigmaSeconds: 0.0001, lineNumber: 2 },
      { channelA: 3, channelB: 1, delaySeconds: -0.004, sigmaSeconds: undefined, lineNumber: 3 },
    ]);
  });

  it('refuses unknown channels, a pair of one microphone and a non-positive sigma, naming the place', () => {
    expect(() => parseDelaysCsv('mic_a,mic_b,delay_s\n2,9,0.01\n', 'd.csv', channels)).toThrow("d.csv, line 2, column 'mic_b': channel 9 is not in the array (its channels are 1, 2, 3, 4).");
    expect(() => parseDelaysCsv('mic_a,mic_b,delay_s\n2,2,0.01\n', 'd.csv', channels)).toThrow(/two different microphones/);
    expect(() => parseDelaysCsv('mic_a,mic_b,delay_s,sigma_s\n2,1,0.01,0\n', 'd.csv', channels)).toThrow(/must be positive/);
    expect(() => parseDelaysCsv('mic_a,delay_s\n2,0.01\n', 'd.csv', channels)).toThrow(/missing column 'mic_b'/);
  });
});
