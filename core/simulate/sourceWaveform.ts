// The waveform object for a source description (build once per scene, evaluate per sample).
import { ChirpWaveform } from './chirp';
import { ClickWaveform } from './click';
import { FmCallWaveform } from './fmCall';
import { KnockWaveform } from './knock';
import type { SceneSource } from './sceneTypes';
import type { SourceWaveform } from './waveform';

export function sourceWaveform(source: SceneSource, sampleRateHz: number): SourceWaveform {
  switch (source.kind) {
    case 'fm-call': return new FmCallWaveform(source, sampleRateHz);
    case 'click': return new ClickWaveform(source);
    case 'knock': return new KnockWaveform(source);
    case 'chirp': return new ChirpWaveform(source);
  }
}
