// Benchmark: time per microphone pair of GCC-PHAT, one-off (gccPairDelay) and with stored channel spectra (engine).
import { createGccEngine, gccPairDelay, type PeakInterpolation } from '../core/dsp';
import { seededRandom } from '../core/locate';
import { useWasmFft } from '../main/dsp';

function seededNoise(length: number, seed: number): Float64Array {
  const out = new Float64Array(length);
  const random = seededRandom(seed);
  for (let i = 0; i < length; i++) out[i] = random.uniform() * 2 - 1;
  return out;
}

function benchGcc(): void {
  const sampleRateHz = 48_000;
  console.log('gcc: one pair (two channels), GCC-PHAT, band 200-12000 Hz, lags within ±20 ms');
  const methods: PeakInterpolation[] = ['parabolic', 'gaussian', 'band-limited'];
  for (const windowPoints of [4096, 16384]) {
    const a = seededNoise(windowPoints, 1);
    const b = seededNoise(windowPoints, 2);
    for (let i = 0; i < windowPoints; i++) b[i] = 0.7 * b[i]! + (i >= 5 ? a[i - 5]! : 0);
    for (const interpolation of methods) {
      const options = { sampleRateHz, weighting: 'phat' as const, bandHz: { lowHz: 200, highHz: 12_000 }, maxLagSeconds: 0.02, interpolation };
      for (let i = 0; i < 20; i++) gccPairDelay(a, b, options);
      const repeats = windowPoints >= 16384 ? 200 : 800;
      const started = process.hrtime.bigint();
      for (let i = 0; i < repeats; i++) gccPairDelay(a, b, options);
      const milliseconds = Number(process.hrtime.bigint() - started) / 1e6 / repeats;
      console.log(`  ${String(windowPoints).padStart(5)} points, ${interpolation.padEnd(12)}: ${milliseconds.toFixed(3)} ms per pair`);
    }
  }
}

function benchEngine(): void {
  const sampleRateHz = 48_000;
  console.log('gcc engine: 8 channels transformed once, then all 28 pairs (GCC-PHAT, band-limited peak)');
  for (const windowPoints of [4096, 16384]) {
    const channels = Array.from({ length: 8 }, (_, c) => seededNoise(windowPoints, 10 + c));
    const engine = createGccEngine(windowPoints, { sampleRateHz, weighting: 'phat', bandHz: { lowHz: 200, highHz: 12_000 }, maxLagSeconds: 0.02 });
    const run = () => {
      channels.forEach((samples, index) => engine.setChannel(index, samples));
      for (let a = 0; a < 8; a++) for (let b = a + 1; b < 8; b++) engine.pairDelay(a, b, 0.02);
    };
    for (let i = 0; i < 5; i++) run();
    const repeats = windowPoints >= 16384 ? 20 : 80;
    const started = process.hrtime.bigint();
    for (let i = 0; i < repeats; i++) run();
    const milliseconds = Number(process.hrtime.bigint() - started) / 1e6 / repeats;
    console.log(`  ${String(windowPoints).padStart(5)} points: ${milliseconds.toFixed(2)} ms per event (8 channel transforms + 28 pairs), ${(milliseconds / 28).toFixed(3)} ms per pair`);
  }
}

// The FFT backend the command line uses (WHENCE_FFT=fft.js for the pure-JavaScript one).
const fft = await useWasmFft();
console.log(`real FFT backend: ${fft.backend}${fft.reason ? ` (${fft.reason})` : ''}`);
benchGcc();
benchEngine();
