// A small deployment laid out by core/deployment for the renderer's tests: recorder A with two joined files (0-2 s),
// recorder B with two files and a gap (0.5-1.5 s, 2.0-3.0 s); 1 kHz mono BWF files starting at 05:00:00 on 2026-05-14. Invented.
import { encodeWavFile, memoryByteSource, readWavInfo } from '../../../core/audio';
import { layoutDeployment, parseDeploymentCsv, type DeploymentFileHeader, type DeploymentLayout } from '../../../core/deployment';

const FS = 1000;
const T0 = 5 * 3600;

function file(frames: number, secondsOfDay: number): Uint8Array {
  const bext = { description: '', originator: '', originationDate: '2026-05-14', originationTime: '05:00:00', timeReferenceFrames: Math.round(secondsOfDay * FS) };
  return encodeWavFile([new Float32Array(frames)], { channelCount: 1, sampleRateHz: FS, bitsPerSample: 32, sampleFormat: 'ieee-float', bext });
}

export const FIXTURE_TABLE = 'recorder,file,file_channel,microphone\nA,a1.wav,1,MA\nA,a2.wav,1,MA\nB,b1.wav,1,MB\nB,b2.wav,1,MB\n';

export async function fixtureLayout(): Promise<DeploymentLayout> {
  const files: Record<string, Uint8Array> = { 'a1.wav': file(1000, T0), 'a2.wav': file(1000, T0 + 1), 'b1.wav': file(1000, T0 + 0.5), 'b2.wav': file(1000, T0 + 2) };
  const headers: DeploymentFileHeader[] = await Promise.all(Object.entries(files).map(async ([name, bytes]) => ({ file: name, baseName: name, info: await readWavInfo(memoryByteSource(bytes, name)) })));
  return layoutDeployment(parseDeploymentCsv(FIXTURE_TABLE, 'deployment.csv'), headers);
}
