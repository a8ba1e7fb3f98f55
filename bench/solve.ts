// Benchmark: solve time per fix for 4, 8 and 16 microphones (all pairs, 2-D and 3-D), and the precision map
// (200 x 200 cells, 8 microphones) for planning an array.
import { precisionMap, seededRandom, solveFix, type DelayMeasurement, type Microphone } from '../core/locate';

function ring(count: number, radiusMeters: number): Microphone[] {
  return Array.from({ length: count }, (_, i) => ({ label: `M${i + 1}`, eastMeters: radiusMeters * Math.cos((2 * Math.PI * i) / count), northMeters: radiusMeters * Math.sin((2 * Math.PI * i) / count), upMeters: 1 + (i % 3) * 1.5, surveySigmaMeters: 0.02 }));
}

function allPairDelays(microphones: Microphone[], source: [number, number, number], speed: number, seed: number): DelayMeasurement[] {
  const random = seededRandom(seed);
  const noise = () => (random.uniform() - 0.5) * 2e-5;
  const range = (m: Microphone) => Math.hypot(source[0] - m.eastMeters, source[1] - m.northMeters, source[2] - m.upMeters);
  const delays: DelayMeasurement[] = [];
  for (let a = 0; a < microphones.length; a++) for (let b = a + 1; b < microphones.length; b++) {
    delays.push({ indexA: a, indexB: b, delaySeconds: (range(microphones[a]!) - range(microphones[b]!)) / speed + noise(), sigmaSeconds: 2e-5 });
  }
  return delays;
}

console.log('solve: one fix from all pairs (sigma 20 µs, survey 2 cm), no Monte Carlo');
for (const count of [4, 8, 16]) {
  const microphones = ring(count, 30);
  for (const dimensions of [2, 3] as const) {
    const sets = Array.from({ length: 50 }, (_, i) => allPairDelays(microphones, [10 + (i % 7), -5 + (i % 5), dimensions === 3 ? 2 : 1], 343, i + 1));
    const options = { speedMetersPerSecond: 343, dimensions, sourceUpMeters: 1 };
    for (const delays of sets.slice(0, 5)) solveFix(microphones, delays, options);
    const repeats = 4;
    const started = process.hrtime.bigint();
    for (let r = 0; r < repeats; r++) for (const delays of sets) solveFix(microphones, delays, options);
    const milliseconds = Number(process.hrtime.bigint() - started) / 1e6 / (repeats * sets.length);
    console.log(`  ${String(count).padStart(2)} microphones (${(count * (count - 1)) / 2} pairs), ${dimensions}-D: ${milliseconds.toFixed(3)} ms per fix`);
  }
}

const microphones = ring(8, 30);
const cells = 200;
const output = { horizontalErrorMeters: new Float64Array(cells * cells), gdop: new Float64Array(cells * cells) };
const grid = { eastStartMeters: -100, northStartMeters: -100, eastStepMeters: 1, northStepMeters: 1, columns: cells, rows: cells };
for (let i = 0; i < 3; i++) precisionMap(microphones, grid, { speedMetersPerSecond: 343, timingSigmaSeconds: 1e-4, dimensions: 2 }, output);
const started = process.hrtime.bigint();
const repeats = 10;
for (let i = 0; i < repeats; i++) precisionMap(microphones, grid, { speedMetersPerSecond: 343, timingSigmaSeconds: 1e-4, dimensions: 2 }, output);
console.log(`precision map: 200 x 200 cells, 8 microphones: ${(Number(process.hrtime.bigint() - started) / 1e6 / repeats).toFixed(2)} ms`);
