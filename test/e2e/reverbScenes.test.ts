// End to end in reverberant places (invented test scenes with image-source reflections, test/helpers/reverbScenes.ts):
// the share of sounds inside the array's hull fixed within 1 m, and the median error, per scene.
import { describe, expect, it } from 'vitest';
import { locateReverbScene, reverbScenes, scoreReverbScene, type ReverbSceneName } from '../helpers/reverbScenes';

// Targets: hall and courtyard >= 90 % within 1 m, corridor >= 75 % (issue 8). Measured (within 1 m inside the hull /
// median error) before -> after onset gating and closure choice of the direct path: hall 82.5 % / 0.36 m -> 100 % /
// 0.003 m, courtyard 100 % / 0.041 m -> 100 % / 0.037 m, corridor 8.8 % / 33 m -> 52.9 % / 0.77 m, shallow water
// 92.6 % / 0.012 m -> 92.6 % / 0.006 m. Then the simulator's tail no longer starts before a far microphone's direct sound
// (corridor 52.9 % -> 64.7 % / 0.66 m), and reverberant events that start sharply are also gated to each microphone's
// first milliseconds (core/pipeline/onsetGate.ts, short gate): corridor 64.7 % -> 94.1 % / 0.19 m, hall 100 % / 0.0017 m,
// courtyard and shallow water as before.
// Expected values: the scenes' own source positions are the truth; their reflections follow the image-source method
// (Allen & Berkley 1979, J. Acoust. Soc. Am. 65, 943-950) with Eyring walls for the RT60 (Eyring 1930, from memory of the
// formula's usual statement); the 1 m shares are issue 8's targets, the medians this project's own guard against drift.
const TARGETS: Record<ReverbSceneName, { within1m: number; medianMeters: number }> = {
  hall: { within1m: 0.9, medianMeters: 0.05 },
  courtyard: { within1m: 0.9, medianMeters: 0.15 },
  corridor: { within1m: 0.75, medianMeters: 0.5 },
  'shallow-water': { within1m: 0.85, medianMeters: 0.05 },
};

describe('locate pipeline in reverberant places', () => {
  it('the four scenes hold more than 200 sounds together', () => {
    expect(reverbScenes().reduce((sum, scene) => sum + scene.spec.sources.length, 0)).toBeGreaterThanOrEqual(200);
  });

  for (const scene of reverbScenes()) {
    it(`${scene.name}: every sound is found; inside the hull ≥ ${TARGETS[scene.name].within1m * 100} % within 1 m, median ≤ ${TARGETS[scene.name].medianMeters} m`, async () => {
      const { outcomes } = await locateReverbScene(scene);
      expect(outcomes.filter((o) => o.located === undefined)).toHaveLength(0);
      const score = scoreReverbScene(scene.name, outcomes);
      expect(score.within1mInsideHull).toBeGreaterThanOrEqual(TARGETS[scene.name].within1m);
      expect(score.medianErrorInsideMeters).toBeLessThanOrEqual(TARGETS[scene.name].medianMeters);
      // every pair says which rule chose its peak
      const choices = new Set(outcomes.flatMap((o) => o.located!.pairs.map((p) => p.peakChoice)));
      expect([...choices].every((c) => c !== undefined && ['strongest', 'closure', 'earliest'].includes(c))).toBe(true);
    }, 120_000);
  }
});
