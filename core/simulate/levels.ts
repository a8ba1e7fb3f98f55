// Levels: decibels to amplitude ratios, 20 log10 (amplitude); 0 dB re full scale is an amplitude of 1.

export function dbToAmplitude(levelDb: number): number {
  return 10 ** (levelDb / 20);
}
