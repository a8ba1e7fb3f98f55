import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { runCliInProcess } from '../../helpers/cli';

// The square array and source of ../shared/check-values.md ("TDOA geometry and bounds"): (0,0), (50,0), (50,50), (0,50) m,
// c = 343 m/s, source (100, 150); delays to microphone 1 -64.617, -199.633, -113.283 ms, so 3-2 is -135.016 ms (computed).
// Statuses, verdicts and messages: the behaviour this project specifies.
const squareArray = 'channel,label,x_m,y_m\n1,SW,0,0\n2,SE,50,0\n3,NE,50,50\n4,NW,0,50\n';
const files: Record<string, string> = {
  'square.csv': squareArray,
  // Pair 3-2 off by 150 ms: the triple 1-2-3 misses closure by 150 ms, 8660 times its combined sigma.
  'unclosed.csv': 'event,mic_a,mic_b,delay_s,sigma_s\nbad,2,1,-0.064617,0.00001\nbad,3,1,-0.199633,0.00001\nbad,3,2,0.014984,0.00001\n',
  'disconnected.csv': 'event,mic_a,mic_b,delay_s,sigma_s\nsplit,2,1,-0.064617,0.0001\nsplit,4,3,0.086350,0.0001\n',
  'line.csv': 'channel,label,x_m,y_m\n1,A,0,0\n2,B,50,0\n3,C,100,0\n',
  'far.csv': 'channel,label,x_m,y_m\n1,A,0,0\n2,B,1e15,0\n3,C,1e15,1e15\n4,D,0,1e15\n',
  'wide.csv': 'channel,label,x_m,y_m\n1,A,0,0\n2,B,60000,0\n3,C,60000,60000\n4,D,0,60000\n',
  'equator.csv': 'channel,label,lat,lon,alt_m\n1,A,0,0,0\n2,B,0,90,0\n3,C,0,180,0\n4,D,0,-90,0\n',
  'good.csv': 'event,mic_a,mic_b,delay_s,sigma_s\nbark,2,1,-0.064617,0.0001\nbark,3,1,-0.199633,0.0001\nbark,4,1,-0.113283,0.0001\n',
};
// Source (30, 40) m beside the line y = 0: ranges 50, 44.7214, 80.6226 m (computed, Pythagoras).
const lineDelays = `event,mic_a,mic_b,delay_s,sigma_s\nside,2,1,${((44.72135955 - 50) / 343).toFixed(9)},0.00001\nside,3,1,${((80.62257748 - 50) / 343).toFixed(9)},0.00001\nside,3,2,${((80.62257748 - 44.72135955) / 343).toFixed(9)},0.00001\n`;

let folder = '';
beforeAll(() => {
  folder = mkdtempSync(join(tmpdir(), 'whence-refusals-'));
  for (const [name, text] of Object.entries(files)) writeFileSync(join(folder, name), text);
  writeFileSync(join(folder, 'line-delays.csv'), lineDelays);
});

interface FixJson { status: string; verdict: string; verdict_reason: string; warnings: string; semi_major_m?: number; x_m?: number; y_m?: number; alternative_x_m?: number; alternative_y_m?: number }

async function solve(array: string, delays: string, ...extra: string[]): Promise<{ exitCode: number; stderr: string; fixes: FixJson[] }> {
  const run = await runCliInProcess(['solve', '--array', join(folder, array), '--delays', join(folder, delays), '--sound-speed', '343', '--json', ...extra]);
  return { exitCode: run.exitCode, stderr: run.stderr, fixes: run.exitCode === 0 ? (JSON.parse(run.stdout) as FixJson[]) : [] };
}

describe('whence solve gives no confident nonsense', () => {
  it("a triple failing closure by 150 ms is 'inconsistent' and unusable, not 'ok' with a 1 cm ellipse", async () => {
    const { exitCode, stderr, fixes } = await solve('square.csv', 'unclosed.csv');
    expect(exitCode).toBe(0);
    expect(fixes[0]!.status).toBe('inconsistent');
    expect(fixes[0]!.verdict).toBe('unusable');
    expect(fixes[0]!.verdict_reason).toBe('The microphones disagree: no single spot fits.');
    expect(fixes[0]!.warnings).toMatch(/-150\.0 ms \(8660\.3 sigma\)/);
    expect(stderr).toMatch(/1 unusable/);
  });

  it('carries the verdict into the GeoJSON point of the fix', async () => {
    const out = join(folder, 'unclosed.geojson');
    const run = await runCliInProcess(['solve', '--array', join(folder, 'square.csv'), '--delays', join(folder, 'unclosed.csv'), '--sound-speed', '343', '--origin', '52.25,-1.5,80', '--out', out]);
    expect(run.exitCode).toBe(0);
    const geojson = JSON.parse(readFileSync(out, 'utf8')) as { features: Array<{ geometry: { type: string }; properties: Record<string, unknown> }> };
    const point = geojson.features.find((f) => f.geometry.type === 'Point')!;
    expect(point.properties).toMatchObject({ status: 'inconsistent', verdict: 'unusable', verdict_reason: 'The microphones disagree: no single spot fits.' });
  });

  it('two disconnected pairs are refused with a message naming the groups', async () => {
    const { fixes } = await solve('square.csv', 'disconnected.csv');
    expect(fixes[0]!.status).toBe('insufficient');
    expect(fixes[0]!.x_m).toBeUndefined();
    expect(fixes[0]!.verdict).toBe('unusable');
    expect(fixes[0]!.warnings).toMatch(/2 separate groups of microphones with no microphone in common \(SW-SE; NE-NW\)/);
  });

  it("a collinear array is 'ambiguous' and carries the mirror position", async () => {
    const { fixes } = await solve('line.csv', 'line-delays.csv');
    const fix = fixes[0]!;
    expect(fix.status).toBe('ambiguous');
    expect(fix.verdict).toBe('doubtful');
    expect(fix.verdict_reason).toBe('Two spots fit equally: check the other one.');
    expect(fix.x_m).toBeCloseTo(30, 2);
    expect(Math.abs(fix.y_m!)).toBeCloseTo(40, 2);
    expect(fix.alternative_x_m).toBeCloseTo(30, 2);
    expect(fix.alternative_y_m).toBeCloseTo(-fix.y_m!, 2);
  });

  it('refuses microphones at 1e15 m, a 60 km array, WGS84 points around the equator and an Earth-centre origin', async () => {
    const far = await solve('far.csv', 'good.csv');
    expect(far.exitCode).toBe(1);
    expect(far.stderr).toMatch(/far\.csv: microphones A and C are 1\.41e\+12 km apart, more than 50 km.*Check the units/);
    const wide = await solve('wide.csv', 'good.csv');
    expect(wide.exitCode).toBe(1);
    expect(wide.stderr).toMatch(/wide\.csv: microphones A and C are 84\.9 km apart/);
    const equator = await solve('equator.csv', 'good.csv');
    expect(equator.exitCode).toBe(1);
    expect(equator.stderr).toMatch(/equator\.csv: the origin of the local frame is -6356\.8 km from the WGS84 ellipsoid/);
    const centre = await solve('square.csv', 'good.csv', '--origin', '0,0,-6371000');
    expect(centre.exitCode).toBe(1);
    expect(centre.stderr).toMatch(/square\.csv: the origin of the local frame is -6371\.0 km from the WGS84 ellipsoid.*give an origin at the array/);
  });
});
