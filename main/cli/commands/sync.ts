// `whence sync --deployment D.csv --array A.csv --calibration C.csv` (or --shared-sounds S.csv): fits every recorder's clock
// (offset, drift) and prints the fit: per recorder offset, drift ppm, their sigmas, residual RMS; per sound its residuals.
import { basename } from 'node:path';
import { clockFitJson, clockFitText, describeStartSources } from '../../../core/deployment';
import { parseArrayCsv } from '../../../core/project';
import { writeFileAtomic } from '../../files';
import { deploymentHelp, deploymentOptionSpec, openDeploymentFromOptions } from '../deploymentOptions';
import { fixOptionSpec, parseOrigin } from '../fixOptions';
import { jsonForTerminal } from '../format';
import type { CliIo } from '../io';
import { chooseSpeed } from '../mediumOptions';
import { optionalString, parseCommandArgs, UsageError } from '../parse';
import { readTextFile } from '../readInput';

export const syncHelp = `whence sync --deployment D.csv --array A.csv (--calibration C.csv | --shared-sounds S.csv) [options]

  Fits each recorder's clock, t_true = t_start + (1 + drift) t_rec + offset, from
  calibration sounds made at surveyed points: measures every sound's arrival at every
  microphone, then offsets and drifts by weighted least squares. One recorder is the
  reference (offset 0, drift 0) unless the calibration table gives emitted_at times.
  Without calibration sounds, --shared-sounds fits the clocks jointly with the places
  and times of sounds every recorder heard (needs sounds spread over the recording).

${deploymentHelp}  --array FILE          microphones (labels as in the deployment table) and positions
  --sound-speed M_S     speed of sound, or --medium/--temperature as for 'whence locate'
  --band LO-HI          correlation band in Hz (default 300 Hz to 0.45 of the sample rate)
  --json                the fit as JSON on standard output
  --out FILE            write the fit to FILE (.json: JSON, else text), atomically
`;

export async function runSync(argv: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseCommandArgs('sync', argv, { ...fixOptionSpec, ...deploymentOptionSpec, array: { type: 'string' }, band: { type: 'string' } });
  if (positionals.length > 0) throw new UsageError(`whence sync takes no recording; give --deployment TABLE.csv. Got '${positionals[0]}'.`);
  const arrayPath = optionalString(values, 'array');
  if (arrayPath === undefined) throw new UsageError('whence sync needs --array ARRAY.csv (the microphones, labelled as in the deployment table).');
  if (optionalString(values, 'calibration') === undefined && optionalString(values, 'shared-sounds') === undefined) throw new UsageError('whence sync needs --calibration CALIBRATION.csv (time,x_m,y_m,z_m of the sounds made on purpose) or, without them, --shared-sounds SOUNDS.csv (rough times of sounds every recorder heard).');
  const outPath = optionalString(values, 'out');
  if (outPath !== undefined && values.json === true) throw new UsageError('give either --json (standard output) or --out FILE, not both.');
  const speed = chooseSpeed(values);
  for (const warning of speed.warnings) io.writeStderr(`warning: ${warning}\n`);
  const geometry = parseArrayCsv(await readTextFile(arrayPath, 'array table'), arrayPath, parseOrigin(optionalString(values, 'origin')));
  const opened = await openDeploymentFromOptions(values, geometry, speed.speedMetersPerSecond, io, optionalString(values, 'band'));
  try {
    const { recording, sync } = opened;
    const fit = sync!.fit;
    const sources = describeStartSources(recording.layout);
    const asJson = values.json === true || (outPath !== undefined && outPath.toLowerCase().endsWith('.json'));
    let text: string;
    let data: unknown;
    if (asJson) {
      const json = clockFitJson(fit, sync!.observations, sync!.soundPlaces);
      data = { deployment: basename(optionalString(values, 'deployment')!), origin: recording.info.startTime?.isoLocal, speedOfSoundMetersPerSecond: speed.speedMetersPerSecond, startTimes: sources, ...json };
      text = JSON.stringify(data, null, 2) + '\n';
    } else {
      text = [
        `deployment ${basename(optionalString(values, 'deployment')!)}: ${recording.layout.recorders.length} recorders, time 0 = ${recording.info.startTime?.isoLocal ?? '?'}`,
        'start times:', ...sources.map((line) => `  ${line}`),
        ...clockFitText(fit, sync!.observations, sync!.soundPlaces),
      ].join('\n') + '\n';
    }
    if (outPath !== undefined) {
      await writeFileAtomic(outPath, text);
      io.writeStderr(`wrote ${outPath}\n`);
    } else {
      io.writeStdout(values.json === true ? jsonForTerminal(data) : text);
    }
    return 0;
  } finally {
    await opened.recording.close();
  }
}
