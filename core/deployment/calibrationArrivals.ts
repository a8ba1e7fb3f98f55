// Arrival of each calibration or shared sound at every microphone on its recorder's own clock: the loudest onset near the rough time
// (band energy in 2 ms frames) at each, then GCC-PHAT against the microphone that heard it best for the sub-sample delay.
import { createGccEngine, type FrequencyBand } from '../dsp';
import { median } from '../locate';
import type { ArrayMicrophone } from '../project';
import type { CalibrationSound } from './calibrationTable';
import type { SharedSound } from './sharedSoundTable';
import type { ClockObservation } from './clockFit';
import type { DeploymentRecording } from './deploymentRecording';

export interface ArrivalOptions {
  speedMetersPerSecond: number;
  /** How far from its rough time (plus the largest clock offset) a sound is looked for, seconds. Default 3. */
  searchSeconds?: number;
  /** Correlation band; default 300 Hz to 0.45 of the sample rate (at most 16 kHz). */
  bandHz?: FrequencyBand;
}

export interface CalibrationArrivals {
  observations: ClockObservation[];
  warnings: string[];
}

const FRAME_SECONDS = 0.002;
/** A sound must stand this far above the window's median frame energy (power ratio, 10 dB) to count as heard. */
const MIN_PEAK_TO_MEDIAN = 10;
/** Fine window: from this long before the coarse onset, this long in all; lags up to MAX_LAG. */
const FINE_LEAD_SECONDS = 0.03;
const FINE_WINDOW_SECONDS = 0.15;
const MAX_LAG_SECONDS = 0.02;

/** Coarse onset: the loudest 2 ms frame (first differences, so rumble does not count), walked back to where it rises out of the background. */
function coarseOnset(samples: Float32Array, sampleRateHz: number): { onsetFrame: number; peakToMedian: number } {
  const frame = Math.max(1, Math.round(FRAME_SECONDS * sampleRateHz));
  const count = Math.floor(samples.length / frame);
  const energy = new Float64Array(count);
  for (let f = 0; f < count; f++) {
    let sum = 0;
    for (let i = f * frame + 1; i < (f + 1) * frame; i++) { const d = samples[i]! - samples[i - 1]!; sum += d * d; }
    energy[f] = sum;
  }
  let peak = 0;
  for (let f = 1; f < count; f++) if (energy[f]! > energy[peak]!) peak = f;
  const background = median(Array.from(energy)) || Number.MIN_VALUE;
  const threshold = Math.max(background * 10, energy[peak]! * 0.01);
  let onset = peak;
  while (onset > 0 && energy[onset - 1]! > threshold) onset--;
  return { onsetFrame: onset * frame, peakToMedian: energy[peak]! / background };
}

export async function measureCalibrationArrivals(recording: DeploymentRecording, microphones: ReadonlyMap<string, ArrayMicrophone>, sounds: ReadonlyArray<CalibrationSound | SharedSound>, options: ArrivalOptions): Promise<CalibrationArrivals> {
  const { layout } = recording;
  const fs = layout.sampleRateHz;
  const c = options.speedMetersPerSecond;
  const search = options.searchSeconds ?? 3;
  const band = options.bandHz ?? { lowHz: 300, highHz: Math.min(16_000, 0.45 * fs) };
  const fineFrames = Math.round(FINE_WINDOW_SECONDS * fs);
  const engine = createGccEngine(fineFrames, { sampleRateHz: fs, weighting: 'phat', bandHz: band, maxLagSeconds: MAX_LAG_SECONDS });
  const observations: ClockObservation[] = [];
  const warnings: string[] = [];
  const used = layout.microphones.filter((m) => microphones.has(m.label));
  for (const [soundIndex, sound] of sounds.entries()) {
    // a shared sound's place is unknown: its range is taken as 0 here (the search span covers it) and fitted later
    const ranges = used.map((m) => {
      if (!('eastMeters' in sound)) return 0;
      const p = microphones.get(m.label)!;
      return Math.hypot(p.eastMeters - sound.eastMeters, p.northMeters - sound.northMeters, p.upMeters - sound.upMeters);
    });
    // Coarse: each microphone's loudest onset within the search span after the rough time plus its range.
    const coarse = await Promise.all(used.map(async (m, i) => {
      const startSeconds = sound.roughSeconds + ranges[i]! / c - search;
      const { channels, firstFrameSeconds, silent } = await recording.readRecorder(m.recorderIndex, startSeconds, Math.round(2 * search * fs));
      const { onsetFrame, peakToMedian } = coarseOnset(channels[m.indexInRecorder]!, fs);
      return { onsetSeconds: firstFrameSeconds + onsetFrame / fs, peakToMedian, silent };
    }));
    const heard = used.map((_, i) => i).filter((i) => coarse[i]!.peakToMedian >= MIN_PEAK_TO_MEDIAN);
    for (const i of used.map((_, index) => index).filter((index) => !heard.includes(index))) {
      warnings.push(`${'eastMeters' in sound ? 'Calibration' : 'Shared'} sound '${sound.label}' (line ${sound.lineNumber}) was not heard clearly at microphone '${used[i]!.label}'${coarse[i]!.silent ? ' (its recorder was not recording all that time: a gap, or before its first file or after its last)' : ''}; that arrival is left out.`);
    }
    if (heard.length === 0) continue;
    const reference = heard.reduce((a, b) => (coarse[b]!.peakToMedian > coarse[a]!.peakToMedian ? b : a));
    const fineOf = async (i: number) => recording.readRecorder(used[i]!.recorderIndex, coarse[i]!.onsetSeconds - FINE_LEAD_SECONDS, fineFrames);
    const referenceWindow = await fineOf(reference);
    engine.setChannel(1, referenceWindow.channels[used[reference]!.indexInRecorder]!);
    const referenceOnset = coarse[reference]!.onsetSeconds;
    const measured: Array<{ i: number; arrivalSeconds: number; sigmaSeconds: number }> = [];
    for (const i of heard) {
      if (i === reference) continue;
      const window = await fineOf(i);
      engine.setChannel(0, window.channels[used[i]!.indexInRecorder]!);
      const delay = engine.pairDelay(0, 1);
      // the common waveform sits (referenceOnset - reference window start) into the reference window, delay later in this one
      measured.push({ i, arrivalSeconds: window.firstFrameSeconds + (referenceOnset - referenceWindow.firstFrameSeconds) + delay.delaySeconds, sigmaSeconds: Math.max(delay.sigmaSeconds, 0.1 / fs) });
    }
    measured.push({ i: reference, arrivalSeconds: referenceOnset, sigmaSeconds: measured.length === 0 ? 0.1 / fs : median(measured.map((m) => m.sigmaSeconds)) });
    for (const { i, arrivalSeconds, sigmaSeconds } of measured) {
      const microphone = microphones.get(used[i]!.label)!;
      const positionSigma = Math.hypot(microphone.surveySigmaMeters, 'sigmaMeters' in sound ? sound.sigmaMeters : 0) / c;
      observations.push({ recorderIndex: used[i]!.recorderIndex, soundIndex, microphone: used[i]!.label, nominalArrivalSeconds: arrivalSeconds, rangeSeconds: ranges[i]! / c, sigmaSeconds: Math.hypot(sigmaSeconds, positionSigma) });
    }
  }
  return { observations, warnings };
}
