import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { readCsv } from '../../../core/csv';
import { writeSceneWav } from '../../../main/simulate';
import { runCliBinary, runCliInProcess } from '../../helpers/cli';
import { SQUARE_SITE_ARRAY_WGS84_CSV, squareSiteScene } from '../../helpers/squareSiteScene';

const spec = squareSiteScene;

let folder = '';
beforeAll(async () => {
  folder = mkdtempSync(join(tmpdir(), 'whence-locate-'));
  await writeSceneWav(spec, join(folder, 'site.wav'), { bitsPerSample: 24, bext: { description: 'test scene', originator: 'whence tests', originationDate: '2026-05-17', originationTime: '04:12:30', timeReferenceFrames: 727_200_000 } });
  await writeSceneWav({ ...spec, sources: [] }, join(folder, 'quiet.wav'), { bitsPerSample: 16 });
  await writeSceneWav({ ...spec, microphones: spec.microphones.slice(0, 3), sources: [] }, join(folder, 'three.wav'), { bitsPerSample: 16 });
  writeFileSync(join(folder, 'array.csv'), 'channel,label,x_m,y_m,z_m,sigma_m\n1,M1,0,0,1,0.02\n2,M2,40,0,1.5,0.02\n3,M3,40,40,1,0.02\n4,M4,0,40,2,0.02\n');
  // The scene's microphones in WGS84, east/north/up of M1 at 51.5° N, 2.5° W (computed by test/reference/cli_reference.py).
  writeFileSync(join(folder, 'array-geo.csv'), SQUARE_SITE_ARRAY_WGS84_CSV);
  writeFileSync(join(folder, 'array-ch9.csv'), 'channel,label,x_m,y_m\n1,M1,0,0\n2,M2,40,0\n9,M9,40,40\n');
  writeFileSync(join(folder, 'broken.wav'), 'RIFF....WAVEjunk');
});

describe('whence locate', () => {
  it('writes a CSV survey log with one fix per sound, near where the scene put them', () => {
    const run = runCliBinary(['locate', 'site.wav', '--array', 'array.csv', '--sound-speed', '343', '--height', '1.2'], { cwd: folder });
    expect(run.exitCode).toBe(0);
    expect(run.stderr).toContain('2 events found, 2 ok');
    expect(run.stderr).toContain('verdicts: 1 firm, 1 doubtful, 0 unusable (see the verdict and verdict_reason columns).');
    const table = readCsv(run.stdout, 'stdout');
    const column = (name: string) => table.header.indexOf(name);
    expect(table.rows).toHaveLength(2);
    // The recording is named on every row, in the first column, as the app's fix log names it (core/export surveyLogColumns).
    expect(table.header.slice(0, 2)).toEqual(['recording', 'event']);
    expect(table.rows.map((row) => row.cells[column('recording')])).toEqual(['site.wav', 'site.wav']);
    const fixes = table.rows.map((row) => ({ status: row.cells[column('status')], x: Number(row.cells[column('x_m')]), y: Number(row.cells[column('y_m')]), time: Number(row.cells[column('time_s')]), arrival: Number(row.cells[column('arrival_s')]), local: row.cells[column('local_time')] }));
    expect(fixes.map((f) => f.status)).toEqual(['ok', 'ok']);
    // Verdicts with their reasons (DEVELOPERS.md, "Statuses and verdicts"): the tonal FM call correlates with peaks close in
    // height and four microphones leave closure too few spare pairs to be sure of them, so it is doubtful; the chirp is firm.
    expect(table.rows.map((row) => row.cells[column('verdict')])).toEqual(['doubtful', 'firm']);
    expect(table.rows.map((row) => row.cells[column('verdict_reason')])).toEqual(['Echoes or a tonal call: peaks close in height.', 'All microphones agree; small ellipse inside the array.']);
    // The scene's speed of sound is given, so each sound lies inside its 95 % ellipse: within its semi-major axis (3.7 and
    // 3.8 cm here) of where the scene put it.
    const semiMajor = table.rows.map((row) => Number(row.cells[column('semi_major_m')]));
    expect(semiMajor.every((axis) => axis > 0 && axis < 0.1)).toBe(true);
    expect(Math.hypot(fixes[0]!.x - 12, fixes[0]!.y - 25)).toBeLessThan(semiMajor[0]!);
    expect(Math.hypot(fixes[1]!.x - 28, fixes[1]!.y - 10)).toBeLessThan(semiMajor[1]!);
    // Onsets are picked on 2 ms band-energy frames (DEVELOPERS.md), so a sound's first arrival is found a few frames late
    // at most: within 10 ms of the scene's (the 200 ms FM call rises slowly and comes about 6 ms late, the chirp under 2 ms).
    // First arrivals (scene geometry, c = 343 m/s): 1.5 s + 19.2312 m (to M4) = 1.556067 s; 3.8 s + 15.6234 m (to M2) = 3.845549 s.
    const firstArrivalSeconds = [1.5 + Math.hypot(12, 15, 0.8) / 343, 3.8 + Math.hypot(12, 10, 0.3) / 343];
    const emissionSeconds = [1.5, 3.8];
    fixes.forEach((fix, i) => {
      expect(Math.abs(fix.arrival - firstArrivalSeconds[i]!)).toBeLessThan(0.01);
      expect(Math.abs(fix.time - emissionSeconds[i]!)).toBeLessThan(0.01);
    });
    // TimeReference 727 200 000 samples at 48 kHz = 04:12:30.000 (EBU Tech 3285 start time, common practice); the local
    // time is that start plus the arrival, to the millisecond it is printed with.
    fixes.forEach((fix) => {
      const match = /^2026-05-17T04:12:(\d\d\.\d\d\d)$/.exec(fix.local ?? '');
      expect(match, fix.local).not.toBeNull();
      expect(Math.abs(Number(match![1]) - (30 + fix.arrival))).toBeLessThanOrEqual(0.0005 + 1e-9);
    });
    for (const header of ['recording: site.wav, first sample at 2026-05-17T04:12:30.000', 'speed of sound 343.000', 'microphone M2: channel 2', 'Whence 0.1.0 survey log']) {
      expect(run.stdout).toContain(header);
    }
  });

  it('writes GeoJSON (RFC 7946) for a WGS84 array, with microphones, fixes and ellipses', async () => {
    const out = join(folder, 'log.geojson');
    const run = await runCliInProcess(['locate', join(folder, 'site.wav'), '--array', join(folder, 'array-geo.csv'), '--temperature', '20', '--out', out]);
    expect(run.exitCode).toBe(0);
    const geojson = JSON.parse(readFileSync(out, 'utf8')) as { type: string; whence: { recording: string }; features: Array<{ geometry: { type: string; coordinates: number[] }; properties: { feature: string } }> };
    expect(geojson.type).toBe('FeatureCollection');
    expect(geojson.whence.recording).toBe('site.wav');
    expect(geojson.features.filter((f) => f.properties.feature !== 'microphone').every((f) => (f.properties as unknown as { recording: string }).recording === 'site.wav')).toBe(true);
    const kinds = geojson.features.map((f) => `${f.properties.feature}:${f.geometry.type}`);
    expect(kinds.filter((k) => k === 'microphone:Point')).toHaveLength(4);
    expect(kinds.filter((k) => k === 'fix:Point')).toHaveLength(2);
    expect(kinds.filter((k) => k === 'uncertainty-ellipse:Polygon')).toHaveLength(2);
    // The sounds at (12, 25, 1.2) and (28, 10, 1.2) m east/north/up of the scene are at lat 51.500224700, lon -2.499827192 and
    // lat 51.500089879, lon -2.499596783 (WGS84; 111257.8 m per degree of latitude and 69440.5 m per degree of longitude at
    // 51.5° N; computed by test/reference/cli_reference.py). Each must lie inside its fix's 95 % ellipse, so within its
    // semi-major axis (5 to 6 cm here; --temperature 20 gives 343.36 m/s where the scene used 343, which moves a fix about
    // 1 cm). [lon, lat] order (RFC 7946 §3.1.1).
    const fixes = geojson.features.filter((f) => f.properties.feature === 'fix')
      .map((f) => ({ lonLat: f.geometry.coordinates as [number, number], semiMajorMeters: (f.properties as unknown as { semi_major_m: number }).semi_major_m }));
    const expected = [[-2.499827192, 51.5002247], [-2.499596783, 51.500089879]];
    fixes.forEach(({ lonLat: [lon, lat], semiMajorMeters }, i) => {
      expect(semiMajorMeters).toBeGreaterThan(0);
      expect(semiMajorMeters).toBeLessThan(0.1);
      const missMeters = Math.hypot((lon - expected[i]![0]!) * 69440.5, (lat - expected[i]![1]!) * 111257.8);
      expect(missMeters).toBeLessThan(semiMajorMeters);
    });
  });

  it('gives an empty log with a note when the recording holds no sounds', () => {
    const run = runCliBinary(['locate', 'quiet.wav', '--array', 'array.csv', '--sound-speed', '343', '--json'], { cwd: folder });
    expect(run.exitCode).toBe(0);
    const log = JSON.parse(run.stdout) as { fixes: unknown[]; log: { notes: string[] } };
    expect(log.fixes).toEqual([]);
    expect(log.log.notes.join(' ')).toMatch(/No events were found/);
    expect(run.stderr).toMatch(/0 events found/);
  });

  it('names both counts when the recording has fewer channels than the array uses', () => {
    const run = runCliBinary(['locate', 'three.wav', '--array', 'array.csv', '--sound-speed', '343'], { cwd: folder });
    expect(run.exitCode).toBe(1);
    expect(run.stderr.trim()).toMatch(/the array uses 4 microphones up to channel 4, but three\.wav has 3 channels: M4 \(channel 4\) is not in the recording/);
  });

  it('names a channel the recording does not have', async () => {
    const run = await runCliInProcess(['locate', join(folder, 'site.wav'), '--array', join(folder, 'array-ch9.csv'), '--sound-speed', '343']);
    expect(run.exitCode).toBe(1);
    expect(run.stderr).toContain('M9 (channel 9) is not in the recording');
  });

  it('reports a corrupt recording in one line, without a stack trace', () => {
    const run = runCliBinary(['locate', 'broken.wav', '--array', 'array.csv'], { cwd: folder });
    expect(run.exitCode).toBe(1);
    expect(run.stderr).toMatch(/^whence locate: /m);
    expect(run.stderr).not.toMatch(/\n\s+at /);
  });

  it('warns that the temperature was assumed when none is given', async () => {
    const run = await runCliInProcess(['locate', join(folder, 'quiet.wav'), '--array', join(folder, 'array.csv'), '--to', '1']);
    expect(run.exitCode).toBe(0);
    expect(run.stderr).toMatch(/assumed 20 °C/);
  });

  it('refuses a bad band and a span outside the recording', async () => {
    const band = await runCliInProcess(['locate', join(folder, 'site.wav'), '--array', join(folder, 'array.csv'), '--band', '6000-2000']);
    expect(band.exitCode).toBe(2);
    expect(band.stderr).toContain('upper edge must be above the lower');
    const span = await runCliInProcess(['locate', join(folder, 'site.wav'), '--array', join(folder, 'array.csv'), '--sound-speed', '343', '--from', '100']);
    expect(span.exitCode).toBe(1);
    expect(span.stderr).toContain('the span starts at 100 s but site.wav lasts 6.000 s');
  });
});
