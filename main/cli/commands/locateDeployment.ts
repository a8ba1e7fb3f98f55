// `whence locate --deployment D.csv --array A.csv [--calibration C.csv | --shared-sounds S.csv]`: locates over a recorder deployment read as one
// recording (core/deployment), optionally over a span (--from/--to: local ISO times or seconds from its earliest start).
import { basename } from 'node:path';
import { deploymentChannelIndices, deploymentSeconds } from '../../../core/deployment';
import { surveyLogRunNotes, type SurveyLogContext } from '../../../core/export';
import { parseArrayCsv } from '../../../core/project';
import type { LocateContext } from '../../../core/pipeline';
import { printableText } from '../../../core/text';
import { WHENCE_VERSION } from '../../../core/version';
import { deploymentHeadNotes, openDeploymentFromOptions } from '../deploymentOptions';
import { outputFromOptions, parseOrigin, requireGeoJsonOrigin } from '../fixOptions';
import type { CliIo } from '../io';
import { chooseSpeed } from '../mediumOptions';
import { optionalString, UsageError, type ParsedCommand } from '../parse';
import { readTextFile } from '../readInput';
import { scanAndLocate } from '../locateScan';
import { locateLogRecords, settingsForLog, settingsFromOptions, workerCountFromOptions, writeLocateLog } from './locate';

function spanBound(values: ParsedCommand['values'], name: 'from' | 'to', origin: Parameters<typeof deploymentSeconds>[1]): number | undefined {
  const text = optionalString(values, name);
  if (text === undefined) return undefined;
  const seconds = deploymentSeconds(text, origin);
  if (seconds === undefined) throw new UsageError(`--${name} needs a local time (YYYY-MM-DDTHH:MM:SS[.fff]) or seconds from the deployment's earliest start; got '${printableText(text, 60)}'.`);
  return seconds;
}

export async function runLocateDeployment(values: ParsedCommand['values'], io: CliIo): Promise<number> {
  const arrayPath = optionalString(values, 'array');
  if (arrayPath === undefined) throw new UsageError('whence locate needs --array ARRAY.csv (the microphones, labelled as in the deployment table).');
  const { outPath, kind: outputKind } = outputFromOptions(values);
  const speed = chooseSpeed(values);
  const settings = settingsFromOptions(values, speed);
  const geometry = parseArrayCsv(await readTextFile(arrayPath, 'array table'), arrayPath, parseOrigin(optionalString(values, 'origin')));
  const geoJsonOrigin = outputKind === 'geojson' ? requireGeoJsonOrigin(geometry.origin) : undefined;
  const workerCount = workerCountFromOptions(values);
  const opened = await openDeploymentFromOptions(values, geometry, speed.speedMetersPerSecond, io, optionalString(values, 'band'));
  const { recording } = opened;
  try {
    const channelIndexOfMicrophone = deploymentChannelIndices(recording.layout, geometry);
    const labels = recording.layout.microphones.map((m) => m.label);
    const unused = labels.filter((label) => !geometry.microphones.some((m) => m.label === label));
    const warnings = [...recording.info.warnings, ...geometry.warnings, ...speed.warnings];
    if (unused.length > 0) warnings.push(`The deployment's microphone${unused.length === 1 ? '' : 's'} ${unused.map((l) => `'${l}'`).join(', ')} ${unused.length === 1 ? 'is' : 'are'} not in the array table and ${unused.length === 1 ? 'is' : 'are'} ignored.`);
    for (const warning of warnings) io.writeStderr(`warning: ${warning}\n`);
    const context: LocateContext = { geometry, channelIndexOfMicrophone, settings };
    const fromSeconds = spanBound(values, 'from', recording.layout.origin);
    const toSeconds = spanBound(values, 'to', recording.layout.origin);
    // Worker threads open the deployment's files themselves, through the same layout and clocks.
    const tablePath = optionalString(values, 'deployment')!;
    const deployment = { tablePath, layout: recording.layout, clocks: [...recording.clocks] };
    const logged = settingsForLog(settings, {});
    if (fromSeconds !== undefined) logged.from_s = fromSeconds;
    if (toSeconds !== undefined) logged.to_s = toSeconds;
    const logContext: SurveyLogContext = {
      recordingName: basename(tablePath), recordingStartTime: recording.info.startTime, sampleRateHz: recording.info.sampleRateHz, geometry,
      medium: { description: speed.description, speedMetersPerSecond: speed.speedMetersPerSecond, speedSigmaMetersPerSecond: speed.speedSigmaMetersPerSecond, reference: speed.reference },
      softwareVersion: WHENCE_VERSION, settings: logged, dimensions: settings.dimensions,
    };
    const { records, onLocated } = locateLogRecords(logContext);
    const result = await scanAndLocate(recording, context, { workerRecording: tablePath, deployment, workerCount, fromSeconds, toSeconds, onLocated }, io);
    await writeLocateLog(io, { outPath, outputKind, geoJsonOrigin }, { ...result, records }, logContext, [...deploymentHeadNotes(opened), ...surveyLogRunNotes(result)]);
    return 0;
  } finally {
    await recording.close();
  }
}
