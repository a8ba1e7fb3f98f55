// `whence locate RECORDING --array ARRAY.csv`: find each sound in a multichannel recording, measure its time
// differences by GCC, fix its position with an uncertainty ellipse, and write the survey log (CSV, JSON or GeoJSON).
import { availableParallelism } from 'node:os';
import { basename } from 'node:path';
import { readWavInfo } from '../../../core/audio';
import type { GccWeighting } from '../../../core/dsp';
import { fixesToGeoJson, locatedEventRecord, surveyLogCsv, surveyLogJson, surveyLogMetadata, surveyLogRunNotes, type FixRecord, type SurveyLogContext } from '../../../core/export';
import { parseArrayCsv } from '../../../core/project';
import { DEFAULT_LOCATE_SETTINGS, mapArrayToRecording, recordingAccess, type LocateContext, type LocatedEvent, type LocateSettings } from '../../../core/pipeline';
import { WHENCE_VERSION } from '../../../core/version';
import { writeFileAtomic } from '../../files';
import { openFileByteSource } from '../../io';
import { verdictTally } from '../format';
import type { CliIo } from '../io';
import { fixOptionSpec, fixShapeFromOptions, outputFromOptions, parseOrigin, requireGeoJsonOrigin } from '../fixOptions';
import { chooseSpeed } from '../mediumOptions';
import { oneOf, optionalNumber, optionalString, parseCommandArgs, UsageError, type ParsedCommand } from '../parse';
import { deploymentHelp, deploymentOptionSpec } from '../deploymentOptions';
import { runLocateDeployment } from './locateDeployment';
import { readTextFile } from '../readInput';
import { scanAndLocate } from '../locateScan';

export const locateHelp = `whence locate RECORDING --array ARRAY.csv [options]

  Finds each sound in a multichannel WAV/RF64/BW64 recording (an event, numbered from 1),
  measures the time difference of arrival of every microphone pair by GCC, and fixes its
  position with an uncertainty ellipse. Writes the survey log, one row per event: CSV to
  standard output, or --out. Its columns are the app's fix log export's (label and note empty).

  --array FILE          microphones: channel (1 = first channel of the recording) and
                        x_m,y_m[,z_m] (local metres) or lat,lon[,alt_m] (WGS84);
                        optional label, sigma_m
  --medium M            air (default), seawater or freshwater; with --temperature C and
                        the options of 'whence speed' (default 20 °C, with a warning)
  --temperature-sigma K uncertainty of the temperature (default 1 K; 5 K when assumed)
  --sound-speed M_S     speed of sound in m/s instead of a medium
  --dims 2|3            2 (default): source on a known height; 3: full 3-D fix
  --height M            source height for 2-D (default: microphones' mean height)
  --height-range LO,HI  2-D: the source is somewhere between LO and HI metres up; its
                        sigma, (HI - LO) / sqrt(12), widens the ellipse (height: the middle)
  --height-sigma M      2-D: one-sigma uncertainty of the source height instead
  --band LO-HI          correlation band in Hz, e.g. 1500-6000 (default: chosen per event)
  --weighting W         phat (default), phat-beta, scot, roth, ml or plain
  --threshold DB        detection threshold above the noise floor (default 10 dB)
  --min-channels N      channels that must hear a sound for it to count
  --from S --to S       scan only this span (seconds from the start of the recording)
  --confidence P        confidence of the ellipse (default 0.95)
  --origin LAT,LON[,ALT]  WGS84 origin of a local-metres array (gives lat/lon)
  --workers N           worker threads for locating (default: cores - 1)
  --json                JSON survey log on standard output instead of CSV
  --out FILE            write FILE.csv, FILE.json or FILE.geojson (atomically)

whence locate --deployment D.csv --array ARRAY.csv [--calibration C.csv] [options]

  Locates over separate recorders read as one recording: each recorder's files on its
  own clock (fitted from --calibration; otherwise its file stamps are taken as true).
  --from/--to take local ISO times or seconds from the deployment's earliest start.
${deploymentHelp}`;

const weightings = ['phat', 'phat-beta', 'scot', 'roth', 'ml', 'plain'] as const;

export function parseBand(text: string | undefined): { lowHz: number; highHz: number } | undefined {
  if (text === undefined) return undefined;
  const match = /^\s*(\d+(?:\.\d+)?)\s*-\s*(\d+(?:\.\d+)?)\s*$/.exec(text);
  if (match === null) throw new UsageError(`--band needs LOW-HIGH in hertz, e.g. 1500-6000; got '${text}'.`);
  const lowHz = Number(match[1]);
  const highHz = Number(match[2]);
  if (!(highHz > lowHz)) throw new UsageError(`--band: the upper edge must be above the lower; got ${lowHz}-${highHz} Hz.`);
  return { lowHz, highHz };
}

export function settingsFromOptions(values: ParsedCommand['values'], speed: { speedMetersPerSecond: number; speedSigmaMetersPerSecond: number }): LocateSettings {
  const settings: LocateSettings = {
    ...speed,
    ...fixShapeFromOptions(values, DEFAULT_LOCATE_SETTINGS.confidence),
    weighting: oneOf('weighting', optionalString(values, 'weighting'), weightings, 'phat') as GccWeighting,
  };
  const band = parseBand(optionalString(values, 'band'));
  if (band !== undefined) settings.bandHz = band;
  const threshold = optionalNumber(values, 'threshold', 'decibels');
  if (threshold !== undefined) {
    if (!(threshold >= 3 && threshold <= 60)) throw new UsageError(`--threshold must be 3 to 60 dB above the noise floor; got ${threshold}.`);
    settings.detectionThresholdDb = threshold;
  }
  const minChannels = optionalNumber(values, 'min-channels', 'a number of channels');
  if (minChannels !== undefined) {
    if (!Number.isInteger(minChannels) || minChannels < 2) throw new UsageError(`--min-channels must be a whole number from 2; got ${minChannels}.`);
    settings.minChannels = minChannels;
  }
  return settings;
}

export function settingsForLog(settings: LocateSettings, values: ParsedCommand['values']): Record<string, string | number | boolean> {
  const logged: Record<string, string | number | boolean> = { dims: settings.dimensions, confidence: settings.confidence, weighting: settings.weighting, band_hz: settings.bandHz ? `${settings.bandHz.lowHz}-${settings.bandHz.highHz}` : 'per event' };
  if (settings.sourceUpMeters !== undefined) logged.height_m = settings.sourceUpMeters;
  if (settings.sourceUpSigmaMeters !== undefined) logged.height_sigma_m = Number(settings.sourceUpSigmaMeters.toPrecision(4));
  if (settings.detectionThresholdDb !== undefined) logged.threshold_db = settings.detectionThresholdDb;
  if (settings.minChannels !== undefined) logged.min_channels = settings.minChannels;
  for (const name of ['from', 'to']) if (typeof values[name] === 'string') logged[`${name}_s`] = Number(values[name]);
  return logged;
}

/** --workers: a whole number of threads from 0 (locate in this thread) to 64; by default the cores less one, at most 4. */
export function workerCountFromOptions(values: ParsedCommand['values']): number {
  const workersOption = optionalNumber(values, 'workers', 'a number of threads');
  if (workersOption !== undefined && (!Number.isInteger(workersOption) || workersOption < 0 || workersOption > 64)) throw new UsageError(`--workers must be a whole number from 0 to 64; got ${workersOption}.`);
  return workersOption ?? Math.min(4, Math.max(1, availableParallelism() - 1));
}

/**
 * The survey log's records of a locate run, each made as its event is solved (runPipeline onLocated), so the run keeps
 * a record per event and neither its measured nor its solved event.
 */
export function locateLogRecords(logContext: SurveyLogContext): { records: FixRecord[]; onLocated: (located: LocatedEvent) => void } {
  const records: FixRecord[] = [];
  return { records, onLocated: (located) => { records.push(locatedEventRecord(located, logContext)); } };
}

/** Writes a locate run's survey log (to --out atomically, or standard output) and its summary lines on standard error. */
export async function writeLocateLog(
  io: CliIo,
  output: { outPath: string | undefined; outputKind: string; geoJsonOrigin: Parameters<typeof fixesToGeoJson>[1] | undefined },
  result: { records: readonly FixRecord[]; eventsFound: number; warnings: readonly string[] },
  logContext: SurveyLogContext,
  notes: string[],
): Promise<void> {
  const { outPath, outputKind, geoJsonOrigin } = output;
  const { records } = result;
  let text: string;
  if (geoJsonOrigin !== undefined) text = fixesToGeoJson(records, geoJsonOrigin, true, { metadata: { ...surveyLogMetadata(logContext), notes }, microphones: logContext.geometry.microphones });
  else if (outputKind === 'json') text = surveyLogJson(records, logContext, notes);
  else text = surveyLogCsv(records, logContext, notes);
  if (outPath !== undefined) await writeFileAtomic(outPath, text);
  else io.writeStdout(text);
  const fixed = records.filter((record) => record.status === 'ok').length;
  io.writeStderr(`${result.eventsFound} event${result.eventsFound === 1 ? '' : 's'} found, ${fixed} ok${records.length > fixed ? `, ${records.length - fixed} with another status (see the status and warnings columns)` : ''}${outPath !== undefined ? `; wrote ${outPath}` : ''}.\n`);
  if (records.length > 0) io.writeStderr(`verdicts: ${verdictTally(records)} (see the verdict and verdict_reason columns).\n`);
  for (const warning of result.warnings) io.writeStderr(`note: ${warning}\n`);
}

export async function runLocate(argv: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseCommandArgs('locate', argv, {
    ...fixOptionSpec, array: { type: 'string' }, band: { type: 'string' }, weighting: { type: 'string' }, threshold: { type: 'string' },
    'min-channels': { type: 'string' }, from: { type: 'string' }, to: { type: 'string' }, workers: { type: 'string' }, ...deploymentOptionSpec,
  });
  if (values.deployment !== undefined) {
    if (positionals.length > 0) throw new UsageError(`whence locate --deployment reads the recordings the table lists; remove '${positionals[0]}'.`);
    return runLocateDeployment(values, io);
  }
  if (positionals.length !== 1) throw new UsageError(`whence locate takes one recording; got ${positionals.length}. Example: whence locate site.wav --array array.csv`);
  const recordingPath = positionals[0]!;
  const arrayPath = optionalString(values, 'array');
  if (arrayPath === undefined) throw new UsageError('whence locate needs --array ARRAY.csv (the microphones and their channels).');
  const { outPath, kind: outputKind } = outputFromOptions(values);
  const speed = chooseSpeed(values);
  const settings = settingsFromOptions(values, speed);
  const origin = parseOrigin(optionalString(values, 'origin'));
  const workerCount = workerCountFromOptions(values);
  const fromSeconds = optionalNumber(values, 'from', 'seconds');
  const toSeconds = optionalNumber(values, 'to', 'seconds');

  const geometry = parseArrayCsv(await readTextFile(arrayPath, 'array table'), arrayPath, origin);
  const geoJsonOrigin = outputKind === 'geojson' ? requireGeoJsonOrigin(geometry.origin) : undefined;
  const source = await openFileByteSource(recordingPath);
  try {
    const info = await readWavInfo(source);
    const recording = recordingAccess(source, info);
    const mapping = mapArrayToRecording(geometry, info.channelCount, basename(recordingPath));
    for (const warning of [...info.warnings, ...geometry.warnings, ...mapping.warnings, ...speed.warnings]) io.writeStderr(`warning: ${warning}\n`);
    const context: LocateContext = { geometry, channelIndexOfMicrophone: mapping.channelIndexOfMicrophone, settings };
    const logContext: SurveyLogContext = {
      recordingName: basename(recordingPath), recordingStartTime: info.startTime, sampleRateHz: info.sampleRateHz, geometry,
      medium: { description: speed.description, speedMetersPerSecond: speed.speedMetersPerSecond, speedSigmaMetersPerSecond: speed.speedSigmaMetersPerSecond, reference: speed.reference },
      softwareVersion: WHENCE_VERSION, settings: settingsForLog(settings, values), dimensions: settings.dimensions,
    };
    const { records, onLocated } = locateLogRecords(logContext);
    const result = await scanAndLocate(recording, context, { workerRecording: recordingPath, workerCount, fromSeconds, toSeconds, onLocated }, io);
    await writeLocateLog(io, { outPath, outputKind, geoJsonOrigin }, { ...result, records }, logContext, surveyLogRunNotes(result));
    return 0;
  } finally {
    await source.close();
  }
}
