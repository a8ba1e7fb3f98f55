// The correlation weightings offered in the settings, in the order shown, with a short plain-words hint for each.
// Weightings of Knapp & Carter (1976) as core/dsp implements them; PHAT-β uses core/dsp's default exponent.
import { defaultPhatBeta, type GccWeighting } from '../../core/dsp';

export interface WeightingChoice {
  value: GccWeighting;
  name: string;
  hint: string;
}

export const WEIGHTING_CHOICES: readonly WeightingChoice[] = [
  { value: 'phat', name: 'PHAT', hint: 'Whitens the spectrum so every frequency counts alike: sharp peaks, robust to echoes. The usual choice for clicks, calls and claps.' },
  { value: 'phat-beta', name: 'PHAT-β', hint: `PHAT that keeps a little of the spectrum's shape (β = ${defaultPhatBeta}): a touch broader peaks, steadier when the sound is weak in noise.` },
  { value: 'scot', name: 'SCOT', hint: 'Normalises by both channels\' spectra: for microphones with different noise or frequency responses.' },
  { value: 'roth', name: 'Roth', hint: 'Normalises by the first channel\'s spectrum: suppresses bands where that channel is noisy.' },
  { value: 'ml', name: 'ML / HT', hint: 'Weights each frequency by how coherent the two channels are (maximum likelihood, Hannan-Thomson): best for long sounds in steady noise.' },
  { value: 'plain', name: 'plain', hint: 'No weighting: broad peaks led by the loudest frequencies. For low, narrow-band sounds where whitening only adds noise.' },
];

export function weightingChoice(value: GccWeighting): WeightingChoice {
  return WEIGHTING_CHOICES.find((choice) => choice.value === value) ?? WEIGHTING_CHOICES[0]!;
}
