// Coverage of the 95 % ellipses and median Mahalanobis² of a JSON survey log against the demo's truth (demo-truth.csv),
// fixes matched to sounds by emission time. Usage: node scripts/demo-calibration.mjs LOG.json assets/demo/out/demo-truth.csv
import { readFileSync } from 'node:fs';
const [logPath, truthPath] = process.argv.slice(2);
const log = JSON.parse(readFileSync(logPath, 'utf8'));
const truth = readFileSync(truthPath, 'utf8').split('\n').filter((l) => l && !l.startsWith('#') && !l.startsWith('id,')).map((l) => { const c = l.split(','); return { id: c[0], x: +c[2], y: +c[3], z: +c[4], t: +c[5] }; });
const rows = [];
for (const f of log.fixes) {
  if (f.x_m === undefined) { rows.push({ event: f.event, status: f.status }); continue; }
  let best; for (const s of truth) if (!best || Math.abs(s.t - f.time_s) < Math.abs(best.t - f.time_s)) best = s;
  const dx = f.x_m - best.x, dy = f.y_m - best.y; const a = f.cov_xx_m2, b = f.cov_xy_m2, d = f.cov_yy_m2; const det = a * d - b * b;
  const m2 = (d * dx * dx - 2 * b * dx * dy + a * dy * dy) / det;
  rows.push({ event: f.event, id: best.id, dt: +(f.time_s - best.t).toFixed(4), status: f.status, err: +Math.hypot(dx, dy).toFixed(3), semi: `${f.semi_major_m}/${f.semi_minor_m}`, m2: +m2.toFixed(3), terms: f.ellipse_terms ?? '' });
}
console.table(rows);
const m = rows.filter((r) => r.m2 !== undefined && Math.abs(r.dt) < 0.2).map((r) => r.m2).sort((p, q) => p - q);
const med = m.length % 2 ? m[(m.length - 1) / 2] : (m[m.length / 2 - 1] + m[m.length / 2]) / 2;
console.log(`matched fixes ${m.length}; inside 95 % (M² <= 5.991) ${m.filter((v) => v <= 5.991465).length}/${m.length} = ${(100 * m.filter((v) => v <= 5.991465).length / m.length).toFixed(1)} %; median M² ${med.toFixed(3)} (chi-square 2-dof median 1.386); mean ${(m.reduce((s, v) => s + v, 0) / m.length).toFixed(3)}`);
