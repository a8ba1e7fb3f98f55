// `whence info FILE [--json]`: what a recording holds (format, channels, rate, length, start time, warnings).
// Reads the header only; frames are never decoded here.
import { readWavInfo, type WavInfo } from '../../../core/audio';
import { openFileByteSource } from '../../io';
import type { CliIo } from '../io';
import { parseCommandArgs, UsageError } from '../parse';
import { formatDurationClock, jsonForTerminal, terminalSafe } from '../format';
import { formatTable, printableText } from '../../../core/text';

export const infoHelp = `whence info FILE [--json]

  Prints what a WAV, RF64 or BW64 recording holds: format, channels, sample rate,
  bits per sample, frames, duration, the start time of its first sample (from a
  Broadcast Wave bext chunk) and any warnings about the file.

  --json   one JSON object: format, channels, sampleRateHz, bitsPerSample, frames,
           durationSeconds, startTime (when the file carries it), warnings
`;

export interface InfoJson {
  file: string;
  format: string;
  container: string;
  channels: number;
  sampleRateHz: number;
  bitsPerSample: number;
  frames: number;
  durationSeconds: number;
  startTime?: string;
  warnings: string[];
}

export function infoToJson(fileName: string, info: WavInfo): InfoJson {
  const json: InfoJson = {
    file: fileName,
    format: info.formatDescription,
    container: info.container,
    channels: info.channelCount,
    sampleRateHz: info.sampleRateHz,
    bitsPerSample: info.bitsPerSample,
    frames: info.frameCount,
    durationSeconds: info.durationSeconds,
    warnings: [...info.warnings],
  };
  if (info.startTime !== undefined) json.startTime = info.startTime.isoLocal;
  return json;
}

export function infoToText(fileName: string, info: WavInfo): string {
  const rows: Array<[string, string]> = [
    ['File', printableText(fileName, 300)],
    ['Format', `${info.formatDescription} (${info.container})`],
    ['Channels', String(info.channelCount)],
    ['Sample rate', `${info.sampleRateHz} Hz`],
    ['Bits', info.validBitsPerSample !== info.bitsPerSample ? `${info.validBitsPerSample} valid in ${info.bitsPerSample}` : String(info.bitsPerSample)],
    ['Frames', String(info.frameCount)],
    ['Duration', `${info.durationSeconds.toFixed(3)} s (${formatDurationClock(info.durationSeconds)})`],
    ['Start time', info.startTime?.isoLocal ?? 'not recorded in the file'],
  ];
  // Tags are text from the file: control characters escaped (a tag cannot clear the screen or forge a line), long ones cut.
  for (const [tag, value] of Object.entries(info.infoTags)) rows.push([`Tag ${printableText(tag, 8)}`, printableText(value, 200)]);
  if (info.warnings.length === 0) rows.push(['Warnings', 'none']);
  info.warnings.forEach((warning, index) => rows.push([index === 0 ? 'Warnings' : '', warning]));
  return terminalSafe(formatTable(rows));
}

export async function runInfo(argv: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseCommandArgs('info', argv, { json: { type: 'boolean' } });
  if (positionals.length !== 1) {
    throw new UsageError(`whence info takes one recording file; got ${positionals.length}. Example: whence info recording.wav`);
  }
  const path = positionals[0] as string;
  const source = await openFileByteSource(path);
  try {
    const info = await readWavInfo(source);
    io.writeStdout(values.json === true ? jsonForTerminal(infoToJson(path, info)) : infoToText(path, info));
    return 0;
  } finally {
    await source.close();
  }
}
