// Lays a deployment's files on one time line: each file's start (start_time, else BWF bext, else the file name), each
// recorder's files in order (contiguous splits joined exactly, gaps kept), one sample rate. Seconds from the earliest start.
import type { WavInfo, WavStartTime } from '../audio';
import { WhenceError } from '../errors';
import { printableText } from '../text';
import type { DeploymentTable } from './deploymentTable';
import { calendarDayMilliseconds, formatLocalInstant, secondsBetween, type LocalInstant } from './localTime';
import type { NameTimePattern } from './nameTime';

export type StartSource = 'start_time column' | 'bext TimeReference' | 'bext OriginationTime' | 'file name';

/** One file of a recorder, placed on the recorder's own clock. */
export interface RecorderFile {
  file: string;
  info: Pick<WavInfo, 'sampleRateHz' | 'frameCount' | 'channelCount'>;
  start: LocalInstant;
  startSource: StartSource;
  /** Nominal start, seconds from the deployment's origin (the recorder's clock as stamped). */
  startSeconds: number;
  /** Position of the file's first frame on the recorder's sample count from its first file (whole when joined to the previous file). */
  recorderFrame: number;
  /** True when it continues the previous file without a gap (its stamp was within the stamp's resolution of that file's end). */
  joined: boolean;
}

export interface RecorderLayout {
  name: string;
  files: RecorderFile[];
  /** Nominal start of its first file, seconds from the origin: t_start of its clock model. */
  clockStartSeconds: number;
  /** Microphone labels on this recorder, and for each the 0-based channel of every file (undefined: not in that file). */
  microphones: Array<{ label: string; channelOfFile: Array<number | undefined> }>;
  /** Gaps between its files, nominal seconds from the origin. */
  gaps: Array<{ fromSeconds: number; toSeconds: number }>;
}

export interface DeploymentLayout {
  tableName: string;
  /** The earliest nominal start of any file: deployment time 0. */
  origin: LocalInstant;
  sampleRateHz: number;
  /** From the origin to the last nominal end of any file. */
  durationSeconds: number;
  recorders: RecorderLayout[];
  /** Every microphone of the table in order of first appearance: the channels of the deployment's virtual recording. */
  microphones: Array<{ label: string; recorderIndex: number; indexInRecorder: number }>;
  warnings: string[];
}

/** A file as read: the table's path for it and its header. */
export interface DeploymentFileHeader { file: string; baseName: string; info: WavInfo }

/** Resolution of each kind of stamp, seconds: a file starting within it of the previous file's end continues that file. */
const STAMP_RESOLUTION_SECONDS: Record<StartSource, number> = {
  'start_time column': 0.002,
  'bext TimeReference': 0.002,
  'bext OriginationTime': 1,
  'file name': 1,
};

function bextInstant(start: WavStartTime): LocalInstant {
  const [year, month, day] = start.dateIso.split('-').map(Number);
  return { dayMilliseconds: calendarDayMilliseconds(year!, month!, day!)!, secondsOfDay: start.framesSinceMidnight / start.sampleRateHz };
}

function fileStart(header: DeploymentFileHeader, tableStart: LocalInstant | undefined, pattern: NameTimePattern | undefined, tableName: string): { start: LocalInstant; source: StartSource } {
  if (tableStart !== undefined) return { start: tableStart, source: 'start_time column' };
  const bext = header.info.startTime;
  if (bext !== undefined) return { start: bextInstant(bext), source: bext.basis === 'time-reference' ? 'bext TimeReference' : 'bext OriginationTime' };
  if (pattern !== undefined) {
    const named = pattern.read(header.baseName);
    if (named !== undefined) return { start: named, source: 'file name' };
    throw new WhenceError('no-start-time', `${printableText(header.file, 160)} has no BWF start time and its name does not match --name-time '${printableText(pattern.text, 80)}'. Fix the pattern, or give its start in the start_time column of ${printableText(tableName, 120)}.`);
  }
  throw new WhenceError('no-start-time', `${printableText(header.file, 160)} has no BWF start time (bext chunk). Give --name-time PATTERN if its name holds the time (e.g. 'REC_YYYYMMDD_hhmmss*'), or its start in the start_time column of ${printableText(tableName, 120)}.`);
}

export function layoutDeployment(table: DeploymentTable, headers: readonly DeploymentFileHeader[], pattern?: NameTimePattern): DeploymentLayout {
  const headerOf = new Map(headers.map((header) => [header.file, header]));
  const rates = new Set(headers.map((header) => header.info.sampleRateHz));
  if (rates.size > 1) {
    const example = (rate: number) => headers.find((header) => header.info.sampleRateHz === rate)!.file;
    throw new WhenceError('mixed-sample-rates', `the deployment's files have different sample rates (${[...rates].map((rate) => `${rate} Hz in ${printableText(example(rate), 80)}`).join(', ')}). Record at one rate, or resample the files to one rate first.`);
  }
  const sampleRateHz = headers[0]!.info.sampleRateHz;
  const warnings: string[] = [];
  const recorderNames = [...new Set(table.rows.map((row) => row.recorder))];
  const starts = new Map<string, { start: LocalInstant; source: StartSource }>();
  for (const row of table.rows) {
    if (starts.has(row.file)) continue;
    const header = headerOf.get(row.file);
    if (header === undefined) throw new WhenceError('internal', `no header read for ${row.file}`);
    starts.set(row.file, fileStart(header, row.startTime, pattern, table.fileName));
  }
  for (const row of table.rows) {
    const channels = headerOf.get(row.file)!.info.channelCount;
    if (row.fileChannel > channels) throw new WhenceError('channel-mismatch', `${printableText(table.fileName, 120)} line ${row.lineNumber}: file_channel ${row.fileChannel} of ${printableText(row.file, 120)}, which has ${channels} channel${channels === 1 ? '' : 's'}. Check the recorder's channel order.`);
  }
  const origin = [...starts.values()].map((s) => s.start).reduce((a, b) => (secondsBetween(b, a) < 0 ? b : a));
  const microphones: DeploymentLayout['microphones'] = [];
  let endSeconds = 0;
  const recorders = recorderNames.map((name, recorderIndex): RecorderLayout => {
    const rows = table.rows.filter((row) => row.recorder === name);
    const fileNames = [...new Set(rows.map((row) => row.file))];
    const placed = fileNames.map((file) => {
      const { start, source } = starts.get(file)!;
      return { file, info: headerOf.get(file)!.info, start, startSource: source, startSeconds: secondsBetween(start, origin), recorderFrame: 0, joined: false };
    }).sort((a, b) => a.startSeconds - b.startSeconds);
    const clockStartSeconds = placed[0]!.startSeconds;
    const gaps: RecorderLayout['gaps'] = [];
    placed.forEach((file, index) => {
      const stamped = (file.startSeconds - clockStartSeconds) * sampleRateHz;
      if (index === 0) return;
      const previous = placed[index - 1]!;
      const previousEnd = previous.recorderFrame + previous.info.frameCount;
      const differenceSeconds = (stamped - previousEnd) / sampleRateHz;
      if (Math.abs(differenceSeconds) <= STAMP_RESOLUTION_SECONDS[file.startSource]) {
        file.recorderFrame = previousEnd;
        file.joined = true;
      } else if (differenceSeconds < 0) {
        throw new WhenceError('overlapping-files', `recorder '${printableText(name, 40)}': ${printableText(file.file, 120)} starts at ${formatLocalInstant(file.start, 3)} (${file.startSource}), ${(-differenceSeconds).toFixed(3)} s before ${printableText(previous.file, 120)} ends. A recorder writes one file at a time: check the start times, or whether a file belongs to another recorder.`);
      } else {
        file.recorderFrame = stamped;
        gaps.push({ fromSeconds: clockStartSeconds + previousEnd / sampleRateHz, toSeconds: file.startSeconds });
      }
    });
    const last = placed[placed.length - 1]!;
    endSeconds = Math.max(endSeconds, clockStartSeconds + (last.recorderFrame + last.info.frameCount) / sampleRateHz);
    const labels = [...new Set(rows.map((row) => row.microphone))];
    const recorderMicrophones = labels.map((label, indexInRecorder) => {
      microphones.push({ label, recorderIndex, indexInRecorder });
      return { label, channelOfFile: placed.map((file) => { const row = rows.find((r) => r.file === file.file && r.microphone === label); return row === undefined ? undefined : row.fileChannel - 1; }) };
    });
    for (const microphone of recorderMicrophones) {
      const missing = placed.filter((_, index) => microphone.channelOfFile[index] === undefined).map((file) => file.file);
      if (missing.length > 0) warnings.push(`Microphone '${printableText(microphone.label, 40)}' of recorder '${printableText(name, 40)}' is not listed for ${missing.length} of its files (${printableText(missing.slice(0, 3).join(', '), 200)}${missing.length > 3 ? ', ...' : ''}); it is silent (a gap) there.`);
    }
    return { name, files: placed, clockStartSeconds, microphones: recorderMicrophones, gaps };
  });
  return { tableName: table.fileName, origin, sampleRateHz, durationSeconds: endSeconds, recorders, microphones, warnings };
}

/** One line per file: where its start time came from. */
export function describeStartSources(layout: DeploymentLayout): string[] {
  return layout.recorders.flatMap((recorder) => recorder.files.map((file) => `${recorder.name}: ${file.file} starts ${formatLocalInstant(file.start, 6)} (${file.startSource}${file.joined ? '; continues the previous file' : ''})`));
}
