import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { readCsv } from '../../../core/csv';
import type { SceneSpec } from '../../../core/simulate';
import { writeSceneWav } from '../../../main/simulate';
import { runCliBinary, runCliInProcess } from '../../helpers/cli';

// An invented test scene (core/simulate): four microphones 40 m apart, two sounds inside the array.
const spec: SceneSpec = {
  sampleRateHz: 48_000, durationSeconds: 6, seed: 21, speedMetersPerSecond: 343,
  microphones: [[0, 0, 1], [40, 0, 1.5], [40, 40, 1], [0, 40, 2]].map(([e, n, u], i) => ({ label: `M${i + 1}`, channel: i + 1, eastMeters: e!, northMeters: n!, upMeters: u! })),
  sources: [
    { id: 'a', kind: 'fm-call', eastMeters: 12, northMeters: 25, upMeters: 1.2, emissionTimeSeconds: 1.5, levelDb: -8, durationSeconds: 0.2, startFrequencyHz: 2000, endFrequencyHz: 3500 },
    { id: 'b', kind: 'chirp', eastMeters: 28, northMeters: 10, upMeters: 1.2, emissionTimeSeconds: 3.8, levelDb: -8, startFrequencyHz: 1000, endFrequencyHz: 6000, durationSeconds: 0.1 },
  ],
  background: { noiseLevelDb: -60, noiseColor: 'pink' },
};

let folder = '';
beforeAll(async () => {
  folder = mkdtempSync(join(tmpdir(), 'whence-locate-'));
  await writeSceneWav(spec, join(folder, 'site.wav'), { bitsPerSample: 24, bext: { description: 'test scene', originator: 'whence tests', originationDate: '2026-05-17', originationTime: '04:12:30', timeReferenceFrames: 727_200_000 } });
  await writeSceneWav({ ...spec, sources: [] }, join(folder, 'quiet.wav'), { bitsPerSample: 16 });
  await writeSceneWav({ ...spec, microphones: spec.microphones.slice(0, 3), sources: [] }, join(folder, 'three.wav'), { bitsPerSample: 16 });
  writeFileSync(join(folder, 'array.csv'), 'channel,label,x_m,y_m,z_m,sigma_m\n1,M1,0,0,1,0.02\n2,M2,40,0,1.5,0.02\n3,M3,40,40,1,0.02\n4,M4,0,40,2,0.02\n');
  writeFileSync(join(folder, 'array-geo.csv'), 'channel,label,lat,lon,alt_m,sigma_m\n1,M1,51.5,-2.5,101,0.02\n2,M2,51.5,-2.49942,101.5,0.02\n3,M3,51.50036,-2.49942,101,0.02\n4,M4,51.50036,-2.5,102,0.02\n');
  writeFileSync(join(folder, 'array-ch9.csv'), 'channel,label,x_m,y_m\n1,M1,0,0\n2,M2,40,0\n9,M9,40,40\n');
  writeFileSync(join(folder, 'broken.wav'), 'RIFF....WAVEjunk');
});

describe('whence locate', () => {
  it('writes a CSV survey log with one fix per sound, near where the scene put them', () => {
    const run = runCliBinary(['locate', 'site.wav', '--array', 'array.csv', '--sound-speed', '343', '--height', '1.2'], { cwd: folder });
    expect(run.exitCode).toBe(0);
    expect(run.stderr).toContain('2 events found, 2 fixed');
    const table = readCsv(run.stdout, 'stdout');
    const column = (name: string) => table.header.indexOf(name);
    expect(table.rows).toHaveLength(2);
    const fixes = table.rows.map((row) => ({ status: row.cells[column('status')], x: Number(row.cells[column('x_m')]), y: Number(row.cells[column('y_m')]), time: Number(row.cells[column('time_s')]), local: row.cells[column('local_time')] }));
    expect(fixes.map((f) => f.status)).toEqual(['ok', 'ok']);
    expect(Math.hypot(fixes[0]!.x - 12, fixes[0]!.y - 25)).toBeLessThan(0.3);
    expect(Math.hypot(fixes[1]!.x - 28, fixes[1]!.y - 10)).toBeLessThan(0.3);
    // Emission times estimated from the onsets: within a few milliseconds of the scene's 1.5 s and 3.8 s.
    expect(fixes[0]!.time).toBeCloseTo(1.5, 1);
    expect(fixes[1]!.time).toBeCloseTo(3.8, 1);
    // TimeReference 727 200 000 samples at 48 kHz = 04:12:30.000 (EBU Tech 3285 start time, common practice).
    expect(fixes[0]!.local).toMatch(/^2026-05-17T04:12:31\.5\d\d$/);
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
    const kinds = geojson.features.map((f) => `${f.properties.feature}:${f.geometry.type}`);
    expect(kinds.filter((k) => k === 'microphone:Point')).toHaveLength(4);
    expect(kinds.filter((k) => k === 'fix:Point')).toHaveLength(2);
    expect(kinds.filter((k) => k === 'uncertainty-ellipse:Polygon')).toHaveLength(2);
    const fix = geojson.features.find((f) => f.properties.feature === 'fix')!;
    // [lon, lat] order (RFC 7946 §3.1.1): longitude near -2.5, latitude near 51.5.
    expect(fix.geometry.coordinates[0]).toBeCloseTo(-2.4998, 3);
    expect(fix.geometry.coordinates[1]).toBeCloseTo(51.5002, 3);
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
