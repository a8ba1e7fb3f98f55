// A deployment as one recording (core/pipeline RecordingAccess): windows in deployment (true) time, each channel read from
// its recorder's files through the recorder's clock, stitched across splits, silent (and flagged) in gaps. Frames at one rate.
import { readFrames, type ByteSource, type WavInfo, type WavStartTime } from '../audio';
import type { RecordingAccess, WindowAlignment } from '../pipeline';
import { clockNominalSeconds, clockTrueSeconds, uncorrectedClock, type RecorderClock } from './clockModel';
import type { DeploymentLayout, RecorderLayout } from './deploymentLayout';
import { formatLocalInstant, type LocalInstant } from './localTime';

/** Opens a file of the table (by the path the layout holds) for random access; close() is called when it is evicted. */
export type OpenDeploymentFile = (file: string) => Promise<ByteSource & { close?(): Promise<void> }>;

export interface DeploymentRecording extends RecordingAccess {
  readonly layout: DeploymentLayout;
  readonly clocks: readonly RecorderClock[];
  /** Per channel: true time of the sample read at `atSeconds` in a window read from `startFrame`, minus its nominal time. */
  windowAlignment(startFrame: number, frameCount: number, atSeconds: number, channelSeconds?: ReadonlyArray<number | undefined>): WindowAlignment;
  /**
   * Frames of one recorder on its own nominal time (no clock correction), from the whole frame nearest `nominalStartSeconds`:
   * one array per microphone of the recorder, the exact nominal time of the first frame, and whether any frame was in a gap.
   */
  readRecorder(recorderIndex: number, nominalStartSeconds: number, frameCount: number): Promise<{ channels: Float32Array[]; firstFrameSeconds: number; silent: boolean }>;
  /** The same deployment read through other clocks (e.g. fitted ones); it opens its own files. */
  withClocks(clocks: readonly RecorderClock[]): DeploymentRecording;
  close(): Promise<void>;
}

/**
 * Files of one recorder kept open at once: a window needs at most the file it is in and its neighbour across a split. Each
 * open file keeps a read buffer as large as the largest window read from it (core/audio), so stale files are closed.
 */
const OPEN_FILES_PER_RECORDER = 2;

interface Segment { fileIndex: number; base: number; kStart: number; kEnd: number }

/** The files of `recorder` touched by recorder frames [uStart, uStart + count) read from whole frame round(uStart - U_f) of each. */
function segmentsOf(recorder: RecorderLayout, uStart: number, count: number): Segment[] {
  const segments: Segment[] = [];
  const files = recorder.files;
  // binary search: the last file starting at or before the window's start
  let lo = 0;
  let hi = files.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (files[mid]!.recorderFrame <= uStart) lo = mid; else hi = mid - 1;
  }
  for (let f = lo; f < files.length; f++) {
    const file = files[f]!;
    if (file.recorderFrame >= uStart + count) break;
    const base = Math.round(uStart - file.recorderFrame);
    const kStart = Math.max(0, -base);
    const kEnd = Math.min(count, file.info.frameCount - base);
    if (kEnd > kStart) segments.push({ fileIndex: f, base, kStart, kEnd });
  }
  return segments;
}

function pad(value: number, width: number): string {
  return String(Math.floor(value)).padStart(width, '0');
}

/** The origin as a BWF start time, so survey logs give absolute local times. */
export function originStartTime(origin: LocalInstant, sampleRateHz: number): WavStartTime {
  const iso = formatLocalInstant(origin, 3);
  const framesSinceMidnight = origin.secondsOfDay * sampleRateHz;
  const seconds = origin.secondsOfDay;
  return {
    isoLocal: iso, originationDate: iso.slice(0, 10), originationTime: `${pad(seconds / 3600, 2)}:${pad((seconds % 3600) / 60, 2)}:${pad(seconds % 60, 2)}`,
    timeReferenceFrames: Math.round(framesSinceMidnight), basis: 'time-reference', dateIso: iso.slice(0, 10), framesSinceMidnight, sampleRateHz,
  };
}

export function deploymentRecording(layout: DeploymentLayout, open: OpenDeploymentFile, clocks?: readonly RecorderClock[]): DeploymentRecording {
  const fs = layout.sampleRateHz;
  const recorderClocks = clocks ?? layout.recorders.map((recorder) => uncorrectedClock(recorder.clockStartSeconds));
  const channelCount = layout.microphones.length;
  const frameCount = Math.ceil(layout.durationSeconds * fs);
  const info: WavInfo = {
    container: 'RIFF', formatTag: 3, formatDescription: `deployment of ${layout.recorders.length} recorders`, sampleFormat: 'ieee-float', channelCount,
    bitsPerSample: 32, blockAlignBytes: 4 * channelCount, sampleRateHz: fs, validBitsPerSample: 32, channelMask: undefined, dataOffsetBytes: 0,
    dataLengthBytes: frameCount * 4 * channelCount, frameCount, durationSeconds: frameCount / fs, startTime: originStartTime(layout.origin, fs),
    infoTags: {}, bextDescription: undefined, warnings: [...layout.warnings],
  };
  /** Per recorder, the deployment channel of each of its microphones. */
  const channelsOfRecorder: number[][] = layout.recorders.map(() => []);
  for (const [c, mic] of layout.microphones.entries()) channelsOfRecorder[mic.recorderIndex]![mic.indexInRecorder] = c;
  /** Open files, least recently used first, with the recorder each belongs to and how many reads are using it. */
  const openFiles = new Map<string, { recorderIndex: number; source: Promise<ByteSource & { close?(): Promise<void> }>; users: number }>();
  function closeStaleFiles(recorderIndex: number): void {
    let open = 0;
    for (const entry of openFiles.values()) if (entry.recorderIndex === recorderIndex) open++;
    for (const [name, entry] of openFiles) {
      if (open < OPEN_FILES_PER_RECORDER) break;
      if (entry.recorderIndex !== recorderIndex || entry.users > 0) continue;
      openFiles.delete(name);
      open--;
      void entry.source.then((s) => s.close?.(), () => undefined);
    }
  }
  async function withSource<T>(recorderIndex: number, file: string, use: (source: ByteSource) => Promise<T>): Promise<T> {
    let entry = openFiles.get(file);
    if (entry === undefined) {
      closeStaleFiles(recorderIndex);
      entry = { recorderIndex, source: open(file), users: 0 };
    } else {
      openFiles.delete(file); // most recently used last
    }
    openFiles.set(file, entry);
    const held = entry;
    held.users++;
    try {
      return await use(await held.source);
    } finally {
      held.users--;
    }
  }

  /** Frames of the file channels no microphone takes: decoded (a file's frames are interleaved) and dropped, into one array kept for reuse. */
  let discarded = new Float32Array(0);
  const discardedFrames = (frames: number) => {
    if (discarded.length < frames) discarded = new Float32Array(frames);
    return discarded.subarray(0, frames);
  };

  /** Fills `outs` (one per microphone of the recorder, the recorder's channels in file order) from recorder frames uStart...; returns the segments. */
  async function fillRecorder(recorderIndex: number, uStart: number, count: number, outs: Array<Float32Array | undefined>): Promise<Segment[]> {
    const recorder = layout.recorders[recorderIndex]!;
    for (const out of outs) out?.fill(0, 0, count);
    const segments = segmentsOf(recorder, uStart, count);
    for (const segment of segments) {
      const file = recorder.files[segment.fileIndex]!;
      const frames = segment.kEnd - segment.kStart;
      // Each wanted file channel is decoded straight into its output; the file's other channels into one discarded scratch.
      const targets: Array<Float32Array | undefined> = new Array<Float32Array | undefined>(file.info.channelCount).fill(undefined);
      recorder.microphones.forEach((microphone, m) => {
        const channel = microphone.channelOfFile[segment.fileIndex];
        const out = outs[m];
        if (out !== undefined && channel !== undefined) targets[channel] = out.subarray(segment.kStart, segment.kEnd);
      });
      if (targets.every((target) => target === undefined)) continue;
      const unused = targets.includes(undefined) ? discardedFrames(frames) : undefined;
      const into = targets.map((target) => target ?? unused!);
      await withSource(recorderIndex, file.file, (source) => readFrames(source, file.info as WavInfo, segment.base + segment.kStart, frames, into));
    }
    return segments;
  }

  const recorderStartFrame = (recorderIndex: number, startFrame: number) => {
    const recorder = layout.recorders[recorderIndex]!;
    return (clockNominalSeconds(recorderClocks[recorderIndex]!, startFrame / fs) - recorder.clockStartSeconds) * fs;
  };

  function covered(segments: readonly Segment[], count: number): boolean {
    let total = 0;
    for (const s of segments) total += s.kEnd - s.kStart;
    return total >= count;
  }

  return {
    name: layout.tableName,
    info,
    layout,
    clocks: recorderClocks,
    async readFrames(startFrame, count, out) {
      const first = Math.min(startFrame, frameCount);
      const frames = Math.max(0, Math.min(frameCount, startFrame + count) - first);
      const channels = Array.from({ length: channelCount }, (_, c) => {
        const given = out?.[c];
        return given !== undefined && given.length >= frames ? given.subarray(0, frames) : new Float32Array(frames);
      });
      await Promise.all(layout.recorders.map((_, r) => fillRecorder(r, recorderStartFrame(r, first), frames, channelsOfRecorder[r]!.map((c) => channels[c]))));
      return channels;
    },
    windowAlignment(startFrame, count, atSeconds, channelSeconds) {
      const shiftSeconds: number[] = [];
      const silentChannels: number[] = [];
      layout.microphones.forEach((microphone, c) => {
        // The clock drifts on between the event's first arrival and this channel's own: its shift is taken where it hears it.
        const k = Math.min(Math.max(Math.round((channelSeconds?.[c] ?? atSeconds) * fs - startFrame), 0), Math.max(0, count - 1));
        const recorder = layout.recorders[microphone.recorderIndex]!;
        const clock = recorderClocks[microphone.recorderIndex]!;
        const segments = segmentsOf(recorder, recorderStartFrame(microphone.recorderIndex, startFrame), count)
          .filter((s) => recorder.microphones[microphone.indexInRecorder]!.channelOfFile[s.fileIndex] !== undefined);
        if (!covered(segments, count)) silentChannels.push(c);
        const at = segments.find((s) => k >= s.kStart && k < s.kEnd) ?? segments[0];
        if (at === undefined) { shiftSeconds.push(0); return; }
        const file = recorder.files[at.fileIndex]!;
        const nominal = recorder.clockStartSeconds + (file.recorderFrame + at.base + k) / fs;
        shiftSeconds.push(clockTrueSeconds(clock, nominal) - (startFrame + k) / fs);
      });
      return { shiftSeconds, silentChannels };
    },
    async readRecorder(recorderIndex, nominalStartSeconds, count) {
      const recorder = layout.recorders[recorderIndex]!;
      const uStart = Math.round((nominalStartSeconds - recorder.clockStartSeconds) * fs);
      const channels = recorder.microphones.map(() => new Float32Array(count));
      const segments = await fillRecorder(recorderIndex, uStart, count, channels);
      const middle = segments.find((s) => s.kEnd > count / 2) ?? segments[0];
      const firstFrameSeconds = middle === undefined
        ? recorder.clockStartSeconds + uStart / fs
        : recorder.clockStartSeconds + (recorder.files[middle.fileIndex]!.recorderFrame + middle.base) / fs;
      return { channels, firstFrameSeconds, silent: !covered(segments, count) };
    },
    withClocks: (fitted) => deploymentRecording(layout, open, fitted),
    async close() {
      const all = [...openFiles.values()];
      openFiles.clear();
      await Promise.all(all.map((entry) => entry.source.then((s) => s.close?.(), () => undefined)));
    },
  };
}
