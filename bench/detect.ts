// Benchmark: streaming event detection over 8 channels of generated noise at 48 kHz (samples per second per channel).
import { createDetector } from '../core/detect';
import { seededRandom } from '../core/locate';

const sampleRateHz = 48_000;
const channelCount = 8;
const seconds = 120;
const blockFrames = 48_000;
const blocks = Array.from({ length: 4 }, (_, b) => Array.from({ length: channelCount }, (_, c) => {
  const samples = new Float32Array(blockFrames);
  const random = seededRandom(1 + b * 97 + c * 13);
  for (let i = 0; i < blockFrames; i++) samples[i] = (random.uniform() - 0.5) * 0.01;
  return samples;
}));
const detector = createDetector({ sampleRateHz, channelCount, maxArrayDelaySeconds: 0.2, frameSeconds: 0.002 });
const started = process.hrtime.bigint();
for (let s = 0; s < seconds; s++) detector.push(blocks[s % blocks.length]!, blockFrames);
detector.finish();
const elapsedSeconds = Number(process.hrtime.bigint() - started) / 1e9;
console.log(`detect: ${seconds} s of ${channelCount} channels at 48 kHz in ${elapsedSeconds.toFixed(2)} s: ${((seconds * sampleRateHz) / elapsedSeconds / 1e6).toFixed(1)} M samples/s per channel, ${(seconds / elapsedSeconds).toFixed(0)}x real time`);
