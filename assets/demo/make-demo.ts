// Writes the demo files: the synthesized recording (WAV, 24-bit, BWF start time), the array (WGS84 and local), the truth
// (sources and their true pair delays). Run: npx tsx assets/demo/make-demo.ts [outFolder]  (default assets/demo/out/).
import { mkdir } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { DEMO_FILE_NAMES } from '../../core/contract';
import { formatCsv } from '../../core/csv';
import { enuToGeodetic } from '../../core/geo';
import { sceneTruth } from '../../core/simulate';
import { CURRENT_PROJECT_SCHEMA_VERSION, serializeProjectDocument, type ProjectDocument } from '../../core/project';
import { writeFileAtomic } from '../../main/files';
import { writeSceneWav } from '../../main/simulate';
import { makeDeploymentDemo } from './make-deployment-demo';
import { DEMO_MICROPHONES, DEMO_SCENE, DEMO_SITE } from './scenario';

export const DEMO_FILES = Object.freeze({
  recording: DEMO_FILE_NAMES.recording,
  array: DEMO_FILE_NAMES.array,
  arrayLocal: 'demo-array-local.csv',
  truth: 'demo-truth.csv',
  delays: 'demo-delays.csv',
  project: DEMO_FILE_NAMES.project,
});

const NOTE = 'Invented demo data (core/simulate); not a measurement.';

/** Rounds to `digits` decimals for a table (positions to 0.1 mm, angles to 1e-9 degrees, times to 1 ns). */
function round(value: number, digits: number): number {
  const scale = 10 ** digits;
  return Math.round(value * scale) / scale;
}

function toWgs84(east: number, north: number, up: number) {
  return enuToGeodetic({ eastMeters: east, northMeters: north, upMeters: up }, DEMO_SITE.origin);
}

const originText = `${DEMO_SITE.origin.latitudeDegrees},${DEMO_SITE.origin.longitudeDegrees},${DEMO_SITE.origin.heightMeters}`;

/** channel,label,lat,lon,alt_m,sigma_m: WGS84 positions of the microphones (alt_m above the ellipsoid). */
export function demoArrayCsv(): string {
  const rows = DEMO_SCENE.microphones.map((m) => {
    const p = toWgs84(m.eastMeters, m.northMeters, m.upMeters);
    return [m.channel, m.label, round(p.latitudeDegrees, 9), round(p.longitudeDegrees, 9), round(p.heightMeters, 4), DEMO_SITE.surveySigmaMeters];
  });
  return formatCsv(['channel', 'label', 'lat', 'lon', 'alt_m', 'sigma_m'], rows, [`${DEMO_SITE.name}: microphones in WGS84. ${NOTE}`]);
}

/** channel,label,x_m,y_m,z_m,sigma_m: the same microphones in the local frame (x east, y north, z up about the survey peg). */
export function demoArrayLocalCsv(): string {
  const rows = DEMO_SCENE.microphones.map((m) => [m.channel, m.label, m.eastMeters, m.northMeters, m.upMeters, DEMO_SITE.surveySigmaMeters]);
  return formatCsv(['channel', 'label', 'x_m', 'y_m', 'z_m', 'sigma_m'], rows, [`${DEMO_SITE.name}: microphones in local metres about the survey peg at ${originText} (WGS84 lat, lon, ellipsoidal height). ${NOTE}`]);
}

/** id,kind,x_m,y_m,z_m,emission_s,lat,lon,alt_m: where and when each sound was made. */
export function demoTruthCsv(): string {
  const rows = DEMO_SCENE.sources.map((s) => {
    const p = toWgs84(s.eastMeters, s.northMeters, s.upMeters);
    return [s.id, s.kind, s.eastMeters, s.northMeters, s.upMeters, s.emissionTimeSeconds, round(p.latitudeDegrees, 9), round(p.longitudeDegrees, 9), round(p.heightMeters, 4)];
  });
  return formatCsv(['id', 'kind', 'x_m', 'y_m', 'z_m', 'emission_s', 'lat', 'lon', 'alt_m'], rows, [
    `${DEMO_SITE.name}: the sounds in the demo recording; x/y/z in local metres about ${originText}; emission_s from the first frame. ${NOTE}`,
  ]);
}

/** event,mic_a,mic_b,delay_s,sigma_s: the true delay of every pair for every sound (arrival at mic_a minus arrival at mic_b). */
export function demoDelaysCsv(): string {
  const truth = sceneTruth(DEMO_SCENE);
  const rows = truth.sources.flatMap((source) => source.pairDelays.map((pair) => [source.id, pair.channelA, pair.channelB, round(pair.delaySeconds, 9), DEMO_SITE.delaySigmaSeconds]));
  return formatCsv(['event', 'mic_a', 'mic_b', 'delay_s', 'sigma_s'], rows, [
    `${DEMO_SITE.name}: true pair delays at ${truth.speedMetersPerSecond.toFixed(3)} m/s (Cramer 1993, ${DEMO_SITE.temperatureCelsius} C, ${DEMO_SITE.relativeHumidityPercent} % RH); sigma_s is nominal. ${NOTE}`,
  ]);
}

/**
 * The demo project the app opens on start: the array with its WGS84 origin, the morning's air, and settings for
 * 2-D fixes at 0.3 m, where most of the morning's callers sit (on the water).
 */
export function demoProject(recording: { sizeBytes: number; frameCount: number }): ProjectDocument {
  return {
    schemaVersion: CURRENT_PROJECT_SCHEMA_VERSION,
    name: 'Quillmere Pond dawn survey (invented demo)',
    array: {
      microphones: DEMO_MICROPHONES.map((m) => ({ channel: m.channel, label: m.label, eastMeters: m.eastMeters, northMeters: m.northMeters, upMeters: m.upMeters, surveySigmaMeters: DEMO_SITE.surveySigmaMeters })),
      origin: { ...DEMO_SITE.origin },
      sourceName: DEMO_FILES.array,
    },
    medium: { medium: 'air', temperatureCelsius: DEMO_SITE.temperatureCelsius, relativeHumidityPercent: DEMO_SITE.relativeHumidityPercent, pressureKilopascals: DEMO_SITE.pressureKilopascals, temperatureSigmaKelvin: 1 },
    settings: { dimensions: 2, sourceUpMeters: 0.3, confidence: 0.95, weighting: 'phat', bandHz: 'automatic' },
    recording: { name: DEMO_FILES.recording, sizeBytes: recording.sizeBytes, channelCount: DEMO_MICROPHONES.length, sampleRateHz: DEMO_SCENE.sampleRateHz, frameCount: recording.frameCount },
    fixes: [],
  };
}

export interface MakeDemoResult {
  folder: string;
  files: string[];
  seconds: number;
  clippedSampleCount: number;
  peakAbsolute: number;
}

/** Writes every demo file into `outFolder` (created if missing), each atomically. */
export async function makeDemo(outFolder: string): Promise<MakeDemoResult> {
  const started = performance.now();
  const folder = resolve(outFolder);
  await mkdir(folder, { recursive: true });
  const [hours, minutes, seconds] = DEMO_SITE.recordingTime.split(':').map(Number) as [number, number, number];
  const wav = await writeSceneWav(DEMO_SCENE, join(folder, DEMO_FILES.recording), {
    bitsPerSample: 24,
    bext: {
      description: `Whence demo: ${DEMO_SITE.name}, synthesized`,
      originator: 'Whence demo generator',
      originationDate: DEMO_SITE.recordingDate,
      originationTime: DEMO_SITE.recordingTime,
      timeReferenceFrames: (hours * 3600 + minutes * 60 + seconds) * DEMO_SCENE.sampleRateHz,
    },
  });
  await writeFileAtomic(join(folder, DEMO_FILES.array), demoArrayCsv());
  await writeFileAtomic(join(folder, DEMO_FILES.arrayLocal), demoArrayLocalCsv());
  await writeFileAtomic(join(folder, DEMO_FILES.truth), demoTruthCsv());
  await writeFileAtomic(join(folder, DEMO_FILES.delays), demoDelaysCsv());
  await writeFileAtomic(join(folder, DEMO_FILES.project), serializeProjectDocument(demoProject({ sizeBytes: wav.fileLengthBytes, frameCount: wav.frameCount })));
  // The second scenario: the same dawn heard by six separate recorders with their own clocks (./make-deployment-demo.ts).
  await makeDeploymentDemo(join(folder, 'deployment'));
  return {
    folder,
    files: Object.values(DEMO_FILES),
    seconds: (performance.now() - started) / 1000,
    clippedSampleCount: wav.clippedSampleCount,
    peakAbsolute: wav.peakAbsolute,
  };
}

const invokedDirectly = process.argv[1] !== undefined && import.meta.url === pathToFileURL(resolve(process.argv[1])).href;
if (invokedDirectly) {
  const defaultFolder = fileURLToPath(new URL('./out/', import.meta.url));
  makeDemo(process.argv[2] ?? defaultFolder).then(
    (result) => {
      console.log(`Wrote ${result.files.join(', ')} to ${result.folder} in ${result.seconds.toFixed(2)} s (peak ${(20 * Math.log10(result.peakAbsolute)).toFixed(1)} dBFS).`);
      if (result.clippedSampleCount > 0) console.warn(`Warning: ${result.clippedSampleCount} samples were clipped; lower the levels in scenario.ts.`);
    },
    (error: unknown) => {
      console.error(error instanceof Error ? error.message : String(error));
      process.exitCode = 1;
    },
  );
}
