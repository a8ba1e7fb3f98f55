// Frequency-axis ticks of the spectrogram: 1-2-5 steps, labelled in kHz; y pixels from the top (high frequencies up).
import { niceStep125, ticksWithin } from './niceSteps';

export interface FrequencyTick {
  frequencyHz: number;
  yPixels: number;
  label: string;
}

/** Ticks about `targetSpacingPixels` apart from 0 to topHz over `heightPixels` (0 Hz at the bottom). */
export function frequencyTicks(topHz: number, heightPixels: number, targetSpacingPixels = 36): FrequencyTick[] {
  if (!(topHz > 0) || !(heightPixels > 0)) return [];
  const step = niceStep125((topHz / heightPixels) * targetSpacingPixels);
  const decimals = step >= 1000 ? 0 : Math.max(0, Math.ceil(-Math.log10(step / 1000) - 1e-9));
  return ticksWithin(0, topHz, step).map((frequencyHz) => ({
    frequencyHz,
    yPixels: heightPixels * (1 - frequencyHz / topHz),
    label: (frequencyHz / 1000).toFixed(decimals),
  }));
}
