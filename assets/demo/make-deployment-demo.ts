// Writes the demo's second scenario: the same dawn at Quillmere Pond heard by six separate recorders, each with its own
// clock (offset, drift), one file split each and a gap in one, clapper shots at two surveyed points at both ends, and hand
// claps at unsurveyed spots after them (the shared sounds). Run: npx tsx assets/demo/make-deployment-demo.ts [outFolder]  (default assets/demo/out/deployment/). Invented data.
import { mkdir } from 'node:fs/promises';
import { resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { LocalInstant } from '../../core/deployment';
import type { DeploymentSceneSpec, SceneSource } from '../../core/simulate';
import { writeDeploymentScene } from '../../main/simulate';
import { DEMO_SCENE, DEMO_SITE } from './scenario';

/** Seconds the dawn minute is moved later, to leave room for the clapper shots before it. */
const LEAD_SECONDS = 10;
const CLAPPER_POINTS = [{ eastMeters: 12.0, northMeters: 20.0, upMeters: 1.5 }, { eastMeters: -15.0, northMeters: -22.0, upMeters: 1.5 }];
const CLAPPER_SECONDS = [2, 7, LEAD_SECONDS + 63, LEAD_SECONDS + 68];

const clapper: SceneSource[] = CLAPPER_SECONDS.map((t, i) => ({ id: `clapper-${i + 1}`, kind: 'click', ...CLAPPER_POINTS[i % 2]!, emissionTimeSeconds: t, levelDb: 0, peakFrequencyHz: 3500 }));
/** Hand claps after the last clapper shot, 5 s apart, where the team walked back past the recorders: places not surveyed. */
const CLAP_POINTS = [
  { eastMeters: 20.0, northMeters: -5.0, upMeters: 1.4 }, { eastMeters: -8.0, northMeters: 24.0, upMeters: 2.8 }, { eastMeters: -22.0, northMeters: -2.0, upMeters: 0.6 },
  { eastMeters: 6.0, northMeters: -28.0, upMeters: 2.2 }, { eastMeters: 26.0, northMeters: 22.0, upMeters: 0.9 }, { eastMeters: -3.0, northMeters: 3.0, upMeters: 3.2 },
];
const CLAP_SECONDS = CLAP_POINTS.map((_, i) => LEAD_SECONDS + 74 + 5 * i);
const claps: SceneSource[] = CLAP_POINTS.map((place, i) => ({ id: `clap-${i + 1}`, kind: 'click', ...place, emissionTimeSeconds: CLAP_SECONDS[i]!, levelDb: -2, peakFrequencyHz: 3000 }));
/** The shared sounds: every sound each recorder heard clearly and alone, by rough time only (clapper shots and claps). */
const SHARED_SOUNDS = [...clapper, ...claps];

/** Clocks as cheap recorders keep them: set by hand to within about a second, crystals tens of ppm apart. */
const CLOCKS = [
  { offsetSeconds: 0.0, drift: 8e-6 }, { offsetSeconds: 0.84, drift: -27e-6 }, { offsetSeconds: -1.12, drift: 41e-6 },
  { offsetSeconds: 0.37, drift: -12e-6 }, { offsetSeconds: -0.58, drift: 33e-6 }, { offsetSeconds: 1.05, drift: -44e-6 },
];

export const DEPLOYMENT_DEMO: DeploymentSceneSpec = (() => {
  const fs = DEMO_SCENE.sampleRateHz;
  const seconds = 60 + LEAD_SECONDS + 12 + 5 * CLAP_POINTS.length;
  const total = seconds * fs;
  return {
    // hums are not rendered per recorder (core/simulate deployment scenes); the pump house is left out
    scene: { ...DEMO_SCENE, durationSeconds: seconds + 3, interference: [], sources: [...clapper, ...claps, ...DEMO_SCENE.sources.map((s) => ({ ...s, emissionTimeSeconds: s.emissionTimeSeconds + LEAD_SECONDS }))] },
    recorders: DEMO_SCENE.microphones.map((m, r) => ({
      name: `rec-${r + 1}`, microphones: [m.label], clock: { ...CLOCKS[r]!, clockStartSeconds: r * 0.25 },
      files: r === 3
        ? [{ recorderFrame: 0, frameCount: 40 * fs }, { recorderFrame: 40 * fs, frameCount: 10 * fs }, { recorderFrame: 52 * fs, frameCount: total - 52 * fs }]
        : [{ recorderFrame: 0, frameCount: 40 * fs }, { recorderFrame: 40 * fs, frameCount: total - 40 * fs }],
    })),
  };
})();

export async function makeDeploymentDemo(outFolder: string): Promise<string> {
  const folder = resolve(outFolder);
  await mkdir(folder, { recursive: true });
  const [hours, minutes, secondsOfMinute] = DEMO_SITE.recordingTime.split(':').map(Number) as [number, number, number];
  const [year, month, day] = DEMO_SITE.recordingDate.split('-').map(Number) as [number, number, number];
  const origin: LocalInstant = { dayMilliseconds: Date.UTC(year, month - 1, day), secondsOfDay: hours * 3600 + minutes * 60 + secondsOfMinute - LEAD_SECONDS };
  await writeDeploymentScene(DEPLOYMENT_DEMO, folder, { origin, calibrationSoundIds: clapper.map((s) => s.id), sharedSoundIds: SHARED_SOUNDS.map((s) => s.id), surveySigmaMeters: 0.03 });
  return folder;
}

const invokedDirectly = process.argv[1] !== undefined && import.meta.url === pathToFileURL(resolve(process.argv[1])).href;
if (invokedDirectly) {
  makeDeploymentDemo(process.argv[2] ?? fileURLToPath(new URL('./out/deployment/', import.meta.url))).then(
    (folder) => console.log(`Wrote the deployment demo to ${folder}.`),
    (error: unknown) => { console.error(error instanceof Error ? error.message : String(error)); process.exitCode = 1; },
  );
}
