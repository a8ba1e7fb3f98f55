import { createHash } from 'node:crypto';
import { mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { basename, join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { memoryByteSource, readFrames, readWavInfo } from '../../../core/audio';
import { writeDeploymentScene, writeSceneWav } from '../../../main/simulate';
import { deploymentScene } from '../../helpers/deploymentScenes';

const folder = mkdtempSync(join(tmpdir(), 'whence-deployment-scene-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

/** A short deployment of the test scenes (invented): six mono recorders, a split each and a gap in recorder 3. */
const scene = deploymentScene({ recorderSeconds: 3, splitSeconds: 1.1, gap: { fromSeconds: 1.9, toSeconds: 2.2 }, calibrationSeconds: [0.5], soundSeconds: [1.4, 2.0] });
const origin = { dayMilliseconds: Date.UTC(2026, 4, 14), secondsOfDay: 5 * 3600 };

function sha256(path: string): string {
  return createHash('sha256').update(readFileSync(path)).digest('hex').slice(0, 16);
}

describe('writeDeploymentScene()', () => {
  it('writes each recorder file as rendered, read back to half an LSB of 24 bits', async () => {
    mkdirSync(join(folder, 'read'));
    const written = await writeDeploymentScene(scene.spec, join(folder, 'read'), { origin });
    expect(written.files).toHaveLength(13); // six recorders with a split, recorder 3 with a gap as well
    const r = 2;
    const f = 2; // recorder 3's file after its gap
    const path = written.files[2 * r + f]!;
    const source = memoryByteSource(new Uint8Array(readFileSync(path)), path);
    const info = await readWavInfo(source);
    const [samples] = await readFrames(source, info, 0, info.frameCount);
    const expected = [new Float32Array(info.frameCount)];
    written.prepared.renderFile(r, f, 0, info.frameCount, expected);
    let worst = 0;
    for (let i = 0; i < info.frameCount; i++) worst = Math.max(worst, Math.abs(samples![i]! - expected[0]![i]!));
    expect(worst).toBeLessThanOrEqual(0.5 / 2 ** 23); // rounding to 24 bits: half a least significant bit (common practice)
  }, 60_000);

  it('writes the same bytes as the writer did before it shared writeSceneWav\'s block loop, for a deployment and a scene', async () => {
    mkdirSync(join(folder, 'hash'));
    const written = await writeDeploymentScene(scene.spec, join(folder, 'hash'), { origin, calibrationSoundIds: scene.calibrationIds });
    const multichannel = join(folder, 'hash', 'multichannel.wav');
    await writeSceneWav(scene.spec.scene, multichannel, { blockFrames: 30_000 });
    const hashes = Object.fromEntries([...written.files, multichannel].map((path) => [basename(path), sha256(path)]));
    // computed: SHA-256 (first 16 hex digits) of the files written by writeDeploymentScene and writeSceneWav at commit
    // 781bd00, before they shared one block writer; a deliberate change to the scene renderer changes them too
    expect(hashes).toEqual({
      'R1_20260514_050000_1.wav': 'f1c9bc40bc9eb517', 'R1_20260514_050001_2.wav': '1127978643d3970d',
      'R2_20260514_050001_1.wav': '609cf80745fe7285', 'R2_20260514_050002_2.wav': '569edc1b5d25a0ff',
      'R3_20260514_050001_1.wav': '620b74bef0653b4c', 'R3_20260514_050002_2.wav': 'ebfe6a171d4962ba', 'R3_20260514_050003_3.wav': '4214a02065cd2603',
      'R4_20260514_050000_1.wav': '49852fa76c134955', 'R4_20260514_050001_2.wav': '2e20f3b1ef4980f5',
      'R5_20260514_050001_1.wav': 'db302dad58ac0386', 'R5_20260514_050002_2.wav': '5ae3465dce274514',
      'R6_20260514_050001_1.wav': 'b49c75d66c772d5f', 'R6_20260514_050002_2.wav': '044959fc539c2d57',
      'multichannel.wav': '9173e486f04ee664',
    });
  }, 60_000);
});
