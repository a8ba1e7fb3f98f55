import { mkdtempSync, readFileSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { runCliBinary, runCliInProcess } from '../../helpers/cli';

// The square array and source of ../shared/check-values.md ("TDOA geometry and bounds"): microphones (0,0), (50,0),
// (50,50), (0,50) m, c = 343 m/s, source (100, 150); differences to microphone 1 are -64.617, -199.633, -113.283 ms (computed).
const squareArray = 'channel,label,x_m,y_m,z_m,sigma_m\n1,SW,0,0,0,0\n2,SE,50,0,0,0\n3,NE,50,50,0,0\n4,NW,0,50,0,0\n';
const squareDelays = 'event,mic_a,mic_b,delay_s,sigma_s\nbark,2,1,-0.064617,0.0001\nbark,3,1,-0.199633,0.0001\nbark,4,1,-0.113283,0.0001\n';

let folder = '';
beforeAll(() => {
  folder = mkdtempSync(join(tmpdir(), 'whence-solve-'));
  writeFileSync(join(folder, 'array.csv'), squareArray);
  writeFileSync(join(folder, 'delays.csv'), squareDelays);
});

interface FixJson { event: string; status: string; verdict: string; verdict_reason: string; x_m: number; y_m: number; semi_major_m: number; semi_minor_m: number; pairs_used: number; lat?: number; lon?: number }

describe('whence solve', () => {
  it('recovers the check-values source from its published delays (JSON)', async () => {
    const run = await runCliInProcess(['solve', '--array', join(folder, 'array.csv'), '--delays', join(folder, 'delays.csv'), '--sound-speed', '343', '--json']);
    // The source lies outside the square, where the ellipse is long (CRLB semi-axes 1.399 and 0.102 m, check-values.md),
    // and three delays against one microphone leave nothing to cross-check: 'ok', but the verdict is doubtful.
    expect(run.stderr).toBe('verdicts: 0 firm, 1 doubtful, 0 unusable; see the verdict and verdict_reason columns before acting on a fix.\n');
    expect(run.exitCode).toBe(0);
    const [fix] = JSON.parse(run.stdout) as FixJson[];
    expect(fix!.status).toBe('ok');
    expect(fix!.verdict).toBe('doubtful');
    expect(fix!.verdict_reason).toBe('Outside the array: long ellipse.');
    // Delays are rounded to 1 µs in the source table, i.e. ≤ 0.2 mm of range difference: the fix lands within 5 cm.
    expect(fix!.x_m).toBeCloseTo(100, 1);
    expect(fix!.y_m).toBeCloseTo(150, 1);
    expect(fix!.pairs_used).toBe(3);
    // A delay table's sigmas are per pair and independent (Q = σ²I, σ = 0.1 ms), so the 95 % ellipse is the CRLB of that Q
    // scaled by sqrt(chi2 2 dof 95 %) = sqrt(5.991465): semi-axes 2.29381 / 0.23899 m, computed by
    // test/reference/cli_reference.py at the true source. The fix lies within 5 cm of it, which moves the axes by far
    // less than 0.1 %. (An arrival-time covariance σ²(I + 11ᵀ) would give 3.42 / 0.25 m; a 1-sigma ellipse 0.94 / 0.098 m.)
    expect(Math.abs(fix!.semi_major_m / 2.29381 - 1)).toBeLessThan(0.001);
    expect(Math.abs(fix!.semi_minor_m / 0.23899 - 1)).toBeLessThan(0.001);
  });

  it('writes CSV with the documented columns to standard output', () => {
    const run = runCliBinary(['solve', '--array', 'array.csv', '--delays', 'delays.csv', '--sound-speed', '343'], { cwd: folder });
    expect(run.exitCode).toBe(0);
    const [header, row] = run.stdout.trim().split('\n');
    for (const column of ['event', 'status', 'x_m', 'y_m', 'z_m', 'cov_xx_m2', 'cov_xy_m2', 'cov_yy_m2', 'semi_major_m', 'semi_minor_m', 'major_axis_deg', 'residual_rms_s', 'pairs_used', 'warnings']) {
      expect(header!.split(',')).toContain(column);
    }
    expect(row).toMatch(/^bark,ok,/);
  });

  it('writes GeoJSON with lat/lon when given an origin, atomically', async () => {
    const out = join(folder, 'fixes.geojson');
    const run = await runCliInProcess(['solve', '--array', join(folder, 'array.csv'), '--delays', join(folder, 'delays.csv'), '--sound-speed', '343', '--origin', '52.25,-1.5,80', '--out', out]);
    expect(run.exitCode).toBe(0);
    expect(run.stderr).toContain('wrote 1 fix');
    const geojson = JSON.parse(readFileSync(out, 'utf8')) as { type: string; features: Array<{ geometry: { type: string; coordinates: number[] } }> };
    expect(geojson.type).toBe('FeatureCollection');
    const point = geojson.features.find((f) => f.geometry.type === 'Point')!;
    // (100, 150, 0) m east/north/up of 52.25° N, 1.5° W is 52.251348021° N, -1.498535733° (WGS84, computed by
    // test/reference/cli_reference.py); the fix lies within 5 cm of the source, i.e. 4.5e-7° of latitude and
    // 7.3e-7° of longitude here. [lon, lat] order (RFC 7946 §3.1.1).
    const [lon, lat] = point.geometry.coordinates as [number, number];
    expect(Math.abs(lat - 52.251348021)).toBeLessThan(4.5e-7);
    expect(Math.abs(lon - -1.498535733)).toBeLessThan(7.3e-7);
  });

  it('refuses GeoJSON without a georeferenced array and leaves no file behind', async () => {
    const out = join(folder, 'nowhere.geojson');
    const run = await runCliInProcess(['solve', '--array', join(folder, 'array.csv'), '--delays', join(folder, 'delays.csv'), '--sound-speed', '343', '--out', out]);
    expect(run.exitCode).toBe(2);
    expect(run.stderr).toMatch(/GeoJSON needs WGS84 positions/);
    expect(existsSync(out)).toBe(false);
  });

  it('reports a bad delay cell with file, line and column and exits non-zero', () => {
    writeFileSync(join(folder, 'bad.csv'), 'mic_a,mic_b,delay_s\n2,1,-0.0646\n3,1,twelve\n');
    const run = runCliBinary(['solve', '--array', 'array.csv', '--delays', 'bad.csv', '--sound-speed', '343'], { cwd: folder });
    expect(run.exitCode).toBe(1);
    expect(run.stderr.trim()).toBe("whence solve: bad.csv, line 3, column 'delay_s': 'twelve' is not a number; expected seconds.");
    expect(run.stdout).toBe('');
  });

  it('reports an unknown channel and a missing file clearly', async () => {
    writeFileSync(join(folder, 'unknown.csv'), 'mic_a,mic_b,delay_s\n7,1,0.01\n');
    const unknown = await runCliInProcess(['solve', '--array', join(folder, 'array.csv'), '--delays', join(folder, 'unknown.csv'), '--sound-speed', '343']);
    expect(unknown.exitCode).toBe(1);
    expect(unknown.stderr).toContain("column 'mic_a': channel 7 is not in the array (its channels are 1, 2, 3, 4)");
    const missing = await runCliInProcess(['solve', '--array', join(folder, 'nope.csv'), '--delays', join(folder, 'delays.csv')]);
    expect(missing.exitCode).toBe(1);
    expect(missing.stderr).toMatch(/cannot read the array table .*nope\.csv: no such file/);
  });

  it('gives status insufficient, not a wrong fix, for a two-microphone table', async () => {
    writeFileSync(join(folder, 'pair.csv'), 'mic_a,mic_b,delay_s\n2,1,0.01\n');
    const run = await runCliInProcess(['solve', '--array', join(folder, 'array.csv'), '--delays', join(folder, 'pair.csv'), '--sound-speed', '343', '--json']);
    expect(run.exitCode).toBe(0);
    const [fix] = JSON.parse(run.stdout) as FixJson[];
    expect(fix!.status).toBe('insufficient');
    expect(fix).not.toHaveProperty('x_m');
    expect(run.stderr).toMatch(/1 of 1 event gave no unambiguous fix/);
  });

  it('refuses --sound-speed together with medium options', async () => {
    const run = await runCliInProcess(['solve', '--array', 'a.csv', '--delays', 'd.csv', '--sound-speed', '343', '--temperature', '12']);
    expect(run.exitCode).toBe(2);
    expect(run.stderr).toContain('--sound-speed replaces the medium options; leave out --temperature');
  });
});
