// Renders any window of a scene's recording into caller-owned Float32Arrays, one per channel (full scale = 1).
// Each frame is computed the same way whatever the window (paths, then diffuse tails), so any split gives the same samples bit for bit.
import { WhenceError } from '../errors';
import { PreparedScene, prepareScene } from './prepareScene';
import type { SceneSpec } from './sceneTypes';

/**
 * Fills out[channel][0 .. frameCount) with frames [startFrame, startFrame + frameCount) of the recording: noise and wind,
 * hums, then every source along each path. Pass a PreparedScene when rendering many windows (a SceneSpec is built each call).
 */
export function renderScene(scene: SceneSpec | PreparedScene, startFrame: number, frameCount: number, out: Float32Array[]): Float32Array[] {
  const prepared = scene instanceof PreparedScene ? scene : prepareScene(scene);
  if (!Number.isSafeInteger(startFrame) || startFrame < 0 || !Number.isSafeInteger(frameCount) || frameCount < 0 || startFrame + frameCount > prepared.frameCount) {
    throw new WhenceError('scene-window-invalid', `renderScene() needs whole frames within the recording (0..${prepared.frameCount}); got start ${startFrame}, count ${frameCount}.`);
  }
  if (out.length < prepared.channelCount) {
    throw new WhenceError('scene-window-invalid', `renderScene() was given ${out.length} output arrays for ${prepared.channelCount} channels; pass one Float32Array per channel.`);
  }
  for (let c = 0; c < prepared.channelCount; c++) {
    if (out[c].length < frameCount) {
      throw new WhenceError('scene-window-invalid', `renderScene(): the output array of channel ${c + 1} holds ${out[c].length} frames, fewer than the ${frameCount} asked for.`);
    }
  }
  for (let c = 0; c < prepared.channelCount; c++) {
    if (prepared.noise === undefined) out[c].fill(0, 0, frameCount);
    else prepared.noise.copyTo(c, startFrame, frameCount, out[c], 0);
  }
  for (const hum of prepared.hums) hum.addTo(out, startFrame, frameCount);
  const endFrame = startFrame + frameCount;
  const rate = prepared.sampleRateHz;
  for (const path of prepared.paths) {
    const from = Math.max(path.firstFrame, startFrame);
    const to = Math.min(path.endFrame, endFrame);
    if (from < to) path.waveform.addTo(out[path.channelIndex], startFrame, from, to, path.offsetSeconds, path.gain, rate);
  }
  for (const tail of prepared.tails) {
    if (tail.endFrame <= startFrame || tail.firstFrame >= endFrame) continue;
    const { waveform } = tail;
    for (let i = 0; i < tail.delaysSeconds.length; i++) {
      const offsetSeconds = tail.emissionTimeSeconds + tail.delaysSeconds[i]!;
      const from = Math.max(Math.ceil((offsetSeconds + waveform.startSeconds) * rate), startFrame);
      const to = Math.min(Math.floor((offsetSeconds + waveform.endSeconds) * rate) + 1, endFrame);
      if (from < to) waveform.addTo(out[tail.channelIndex], startFrame, from, to, offsetSeconds, tail.gains[i]!, rate);
    }
  }
  return out;
}
