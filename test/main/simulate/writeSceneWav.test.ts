import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { memoryByteSource, readFrames, readWavInfo } from '../../../core/audio';
import { WhenceError } from '../../../core/errors';
import { prepareScene, renderScene, type SceneSpec } from '../../../core/simulate';
import { writeSceneWav } from '../../../main/simulate';

const folders: string[] = [];
function folder(): string {
  const path = mkdtempSync(join(tmpdir(), 'whence-scene-'));
  folders.push(path);
  return path;
}
afterAll(() => folders.forEach((path) => rmSync(path, { recursive: true, force: true })));

const SCENE: SceneSpec = {
  sampleRateHz: 48000, durationSeconds: 2.7, seed: 4, speedMetersPerSecond: 343, groundUpMeters: 0,
  microphones: [
    { label: 'A', channel: 1, eastMeters: 0, northMeters: 0, upMeters: 1.5 },
    { label: 'B', channel: 2, eastMeters: 35, northMeters: 0, upMeters: 2 },
    { label: 'C', channel: 3, eastMeters: 10, northMeters: 30, upMeters: 1 },
  ],
  sources: [
    { id: 'frog', kind: 'fm-call', eastMeters: 12, northMeters: 9, upMeters: 0.1, emissionTimeSeconds: 0.4, levelDb: -10, durationSeconds: 0.2, startFrequencyHz: 1600, endFrequencyHz: 2300, harmonicLevelsDb: [-6] },
    { id: 'knock', kind: 'click', eastMeters: 30, northMeters: 20, upMeters: 4, emissionTimeSeconds: 1.5, levelDb: -10, peakFrequencyHz: 3000 },
  ],
  background: { noiseLevelDb: -60, noiseColor: 'pink', wind: { levelDb: -50 } },
  interference: [{ kind: 'hum', id: 'pump', fundamentalHz: 100, levelDb: -60, bearingDegrees: 200 }],
};

function rendered(spec: SceneSpec): Float32Array[] {
  const prepared = prepareScene(spec);
  return renderScene(prepared, 0, prepared.frameCount, Array.from({ length: prepared.channelCount }, () => new Float32Array(prepared.frameCount)));
}

async function readBack(path: string) {
  const source = memoryByteSource(new Uint8Array(readFileSync(path)), path);
  const info = await readWavInfo(source);
  return { info, channels: await readFrames(source, info, 0, info.frameCount) };
}

describe('writeSceneWav()', () => {
  it('writeSceneWav() writes the rendered scene in blocks, 24-bit with a bext start time, read back to half an LSB', async () => {
    const path = join(folder(), 'scene.wav');
    const progress: number[] = [];
    const result = await writeSceneWav(SCENE, path, {
      bitsPerSample: 24,
      blockFrames: 10_007,
      bext: { description: 'test scene', originator: 'whence tests', originationDate: '2025-05-17', originationTime: '05:10:00', timeReferenceFrames: 18600 * 48000 },
      onProgress: (written) => progress.push(written),
    });
    expect(result).toMatchObject({ path, frameCount: 129_600, channelCount: 3, sampleRateHz: 48000, clippedSampleCount: 0 });
    expect(progress.length).toBe(Math.ceil(129_600 / 10_007));
    expect(progress[progress.length - 1]).toBe(129_600);
    const { info, channels } = await readBack(path);
    expect(info).toMatchObject({ channelCount: 3, sampleRateHz: 48000, bitsPerSample: 24, frameCount: 129_600, warnings: [] });
    expect(info.startTime?.isoLocal).toBe('2025-05-17T05:10:00.000');
    expect(readFileSync(path).length).toBe(result.fileLengthBytes);
    const expected = rendered(SCENE);
    let worst = 0;
    let peak = 0;
    for (let c = 0; c < 3; c++) {
      for (let i = 0; i < 129_600; i++) {
        worst = Math.max(worst, Math.abs(channels[c][i] - expected[c][i]));
        peak = Math.max(peak, Math.abs(expected[c][i]));
      }
    }
    // rounding to 24 bits moves a sample by at most half of 2^-23 (common practice)
    expect(worst).toBeLessThanOrEqual(2 ** -24);
    expect(result.peakAbsolute).toBe(peak);
  });

  it('writeSceneWav() writes 32-bit float samples exactly and the same file for any block size', async () => {
    const dir = folder();
    await writeSceneWav(SCENE, join(dir, 'a.wav'), { bitsPerSample: 32, sampleFormat: 'ieee-float', blockFrames: 65_536 });
    await writeSceneWav(SCENE, join(dir, 'b.wav'), { bitsPerSample: 32, sampleFormat: 'ieee-float', blockFrames: 333 });
    expect(readFileSync(join(dir, 'a.wav')).equals(readFileSync(join(dir, 'b.wav')))).toBe(true);
    const { channels } = await readBack(join(dir, 'a.wav'));
    const expected = rendered(SCENE);
    for (let c = 0; c < 3; c++) expect(channels[c].every((x, i) => x === expected[c][i])).toBe(true);
  });

  it('writeSceneWav() counts the samples it had to clip', async () => {
    const loud: SceneSpec = { ...SCENE, sources: [{ ...SCENE.sources[1], levelDb: 40 }] };
    const result = await writeSceneWav(loud, join(folder(), 'loud.wav'), { bitsPerSample: 16 });
    expect(result.clippedSampleCount).toBeGreaterThan(0);
    expect(result.peakAbsolute).toBeGreaterThan(1);
  });

  it('writeSceneWav() replaces an earlier file and leaves no temporary file behind', async () => {
    const dir = folder();
    const path = join(dir, 'scene.wav');
    writeFileSync(path, 'old');
    await writeSceneWav({ ...SCENE, durationSeconds: 0.1 }, path);
    expect(readdirSync(dir)).toEqual(['scene.wav']);
    expect(readFileSync(path).subarray(0, 4).toString('latin1')).toBe('RIFF');
  });

  it('writeSceneWav() keeps the earlier file intact and removes its temporary file when writing fails midway', async () => {
    const dir = folder();
    const path = join(dir, 'scene.wav');
    writeFileSync(path, 'precious');
    const failing = writeSceneWav(SCENE, path, {
      blockFrames: 4096,
      onProgress: (written) => { if (written > 20_000) throw new Error('disk pulled out'); },
    });
    await expect(failing).rejects.toMatchObject({ code: 'file-write-failed' });
    await expect(failing).rejects.toThrow(/disk pulled out.*previous file there is unchanged/);
    expect(readFileSync(path, 'utf8')).toBe('precious');
    expect(readdirSync(dir)).toEqual(['scene.wav']);
  });

  it('writeSceneWav() fails with file-write-failed when the folder does not exist, and checks the scene first', async () => {
    const missing = join(folder(), 'no', 'such', 'scene.wav');
    await expect(writeSceneWav(SCENE, missing)).rejects.toMatchObject({ code: 'file-write-failed' });
    const dir = folder();
    mkdirSync(join(dir, 'sub'));
    const bad = writeSceneWav({ ...SCENE, sampleRateHz: 0 }, join(dir, 'sub', 'x.wav'));
    await expect(bad).rejects.toBeInstanceOf(WhenceError);
    await expect(bad).rejects.toMatchObject({ code: 'scene-invalid' });
    expect(readdirSync(join(dir, 'sub'))).toEqual([]);
  });
});
