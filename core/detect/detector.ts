// Streaming event detector: band energy per hop and channel, adaptive floor, channel triggers, multichannel events.
// Blocks of any size in, events out (times in seconds); work per sample is three filter sections and a square;
// memory is fixed by the settings (the floor windows, the first second's hop energies), not by the recording's length.
import { WhenceError } from '../errors';
import { createBandEnergyBank } from './bandEnergy';
import { ChannelTrigger } from './channelTrigger';
import { resolveDetectorConfig } from './config';
import { EventAssembler } from './eventAssembler';
import { createNoiseFloorTracker, type NoiseFloorTracker } from './noiseFloor';
import type { DetectedEvent, DetectorConfig, StreamingDetector } from './types';

/** Frames filtered per channel before the hops are examined (bounds the hop buffers whatever the block size). */
const chunkFrames = 8192;
/** Keeps the level of digital silence finite (-200 dB). */
const tinyMeanSquare = 1e-20;

/**
 * A detector for one recording. Behaviour worth knowing:
 * - The floor is first estimated from the first `initialNoiseSeconds` (default 1 s), which are then searched like the
 *   rest: a tone or hum present from the start is background and never triggers.
 * - A steady sound that starts later (a generator switched on) triggers once, at its start: that event lasts until the
 *   floor has risen to it (about 80 % of the 4 s noise window) and is cut at maxEventSeconds, flagged 'truncated'.
 *   Its channels re-arm only after they fall back near the floor, so it never triggers again.
 * - Sounds in the first 4 periods of the band's lower edge (20 ms at 200 Hz) are not called while the filter settles.
 * - Events less than the array's largest delay apart are merged ('merged') unless the result would be longer than
 *   maxEventSeconds ('close-to-previous'); windows that overlap are flagged 'overlaps-previous'.
 * - An event is reported once no later detection can merge with it and its whole window has been pushed, i.e. about
 *   0.5 s after its sound ends with the defaults and a 0.15 s array; finish() reports the rest.
 * - Blocks may have any size: the same recording gives the same events (bit for bit) whatever its blocks.
 */
export function createDetector(config: DetectorConfig): StreamingDetector {
  const settings = resolveDetectorConfig(config);
  const { channelCount, hopFrames, floorBlockHops, initialHops, settleHops, sampleRateHz } = settings;
  const filters = createBandEnergyBank(settings.detectionBandHz, sampleRateHz, hopFrames, channelCount);
  const floors: NoiseFloorTracker[] = [];
  const triggers: ChannelTrigger[] = [];
  const hopBuffers: Float64Array[] = [];
  for (let c = 0; c < channelCount; c++) {
    floors.push(createNoiseFloorTracker(settings.floorWindowBlocks, settings.noiseQuantile));
    triggers.push(new ChannelTrigger(hopFrames, settings.thresholdDb, settings.releaseDb, settings.hangoverHops));
    hopBuffers.push(new Float64Array(Math.ceil(chunkFrames / hopFrames) + 1));
  }
  const assembler = new EventAssembler(settings, triggers);
  const blockSums = new Float64Array(channelCount);
  const hopEnergies = new Float64Array(channelCount);
  /** Hop energies of the first `initialHops` hops, kept to be searched once the first floor is known. */
  let initialEnergies: Float64Array | null = new Float64Array(initialHops * channelCount);
  let blockHopCount = 0;
  let hopCount = 0;
  let framesSeen = 0;
  let finished = false;

  function addFloorLevels(hopsInBlock: number): void {
    for (let c = 0; c < channelCount; c++) {
      const meanSquare = blockSums[c]! / (hopsInBlock * hopFrames);
      floors[c]!.addLevelDb(10 * Math.log10(meanSquare + tinyMeanSquare));
      blockSums[c] = 0;
      if (initialEnergies === null) triggers[c]!.setFloor(10 ** (floors[c]!.floorDb / 10));
    }
    blockHopCount = 0;
  }

  function stepAll(hop: number, energies: Float64Array, offset: number, out: DetectedEvent[]): void {
    const armed = hop >= settleHops;
    for (let c = 0; c < channelCount; c++) triggers[c]!.step(hop, energies[offset + c]!, armed);
    assembler.step(hop, out);
  }

  /** The first floor is known: search the hops that served to estimate it. */
  function completeInitialFloor(out: DetectedEvent[]): void {
    const stored = initialEnergies!;
    if (blockHopCount > 0 && floors[0]!.levelCount === 0) addFloorLevels(blockHopCount);
    initialEnergies = null;
    for (let c = 0; c < channelCount; c++) triggers[c]!.setFloor(10 ** (floors[c]!.floorDb / 10));
    for (let hop = 0; hop < hopCount; hop++) stepAll(hop, stored, hop * channelCount, out);
  }

  function processHop(out: DetectedEvent[]): void {
    const hop = hopCount++;
    for (let c = 0; c < channelCount; c++) blockSums[c] = blockSums[c]! + hopEnergies[c]!;
    blockHopCount++;
    if (initialEnergies !== null) {
      initialEnergies.set(hopEnergies, hop * channelCount);
      if (blockHopCount === floorBlockHops) addFloorLevels(floorBlockHops);
      if (hopCount === initialHops) completeInitialFloor(out);
      return;
    }
    stepAll(hop, hopEnergies, 0, out);
    if (blockHopCount === floorBlockHops) addFloorLevels(floorBlockHops);
  }

  return {
    push(block: readonly Float32Array[], frameCount: number): DetectedEvent[] {
      if (finished) {
        throw new WhenceError('detect-finished', 'The detector has already been finished; create a new one for another recording.');
      }
      if (block.length !== channelCount) {
        throw new WhenceError(
          'detect-block-channels',
          `The detector was set up for ${channelCount} channels but a block has ${block.length}; pass one array per channel.`,
        );
      }
      if (!Number.isInteger(frameCount) || frameCount < 0) {
        throw new WhenceError('detect-block-frames', `A block's frame count must be a whole number of frames, got ${frameCount}.`);
      }
      for (let c = 0; c < channelCount; c++) {
        if (block[c]!.length < frameCount) {
          throw new WhenceError(
            'detect-block-frames',
            `Channel ${c + 1} of the block holds ${block[c]!.length} frames but the block claims ${frameCount}; pass arrays at least that long.`,
          );
        }
      }
      const out: DetectedEvent[] = [];
      for (let from = 0; from < frameCount; from += chunkFrames) {
        const to = Math.min(frameCount, from + chunkFrames);
        const hops = filters.run(block, from, to, hopBuffers);
        for (let j = 0; j < hops; j++) {
          for (let c = 0; c < channelCount; c++) hopEnergies[c] = hopBuffers[c]![j]!;
          processHop(out);
        }
      }
      framesSeen += frameCount;
      return out;
    },

    finish(): DetectedEvent[] {
      if (finished) {
        throw new WhenceError('detect-finished', 'The detector has already been finished; create a new one for another recording.');
      }
      finished = true;
      const out: DetectedEvent[] = [];
      if (hopCount === 0) return out;
      if (initialEnergies !== null) completeInitialFloor(out);
      assembler.flush(hopCount, framesSeen / sampleRateHz, out);
      return out;
    },
  };
}
