// `whence solve`: position fixes from measured time differences (a delay table) and the array, one record per event,
// with covariance, uncertainty ellipse, residuals and warnings; CSV to stdout, or JSON/GeoJSON.
import { fixesToCsv, fixesToGeoJson, fixesToJson, fixRecord, FIX_COLUMNS_2D, FIX_COLUMNS_3D, type FixRecord } from '../../../core/export';
import { fixVerdict, solveFix, type DelayMeasurement, type Microphone, type SolveOptions } from '../../../core/locate';
import { parseArrayCsv, parseDelaysCsv, type ArrayGeometry, type DelayEvent } from '../../../core/project';
import { writeFileAtomic } from '../../files';
import { verdictTally } from '../format';
import type { CliIo } from '../io';
import { fixOptionSpec, fixShapeFromOptions, outputFromOptions, parseOrigin, requireGeoJsonOrigin } from '../fixOptions';
import { chooseSpeed } from '../mediumOptions';
import { optionalNumber, optionalString, parseCommandArgs, UsageError } from '../parse';
import { readTextFile } from '../readInput';

export const solveHelp = `whence solve --array ARRAY.csv --delays DELAYS.csv [options]

  Position fixes from measured time differences of arrival. One fix per event.

  --array FILE          microphones: channel and x_m,y_m[,z_m] (local metres: x east,
                        y north, z up) or lat,lon[,alt_m] (WGS84); optional label, sigma_m
  --delays FILE         mic_a,mic_b,delay_s (arrival at a minus arrival at b, seconds;
                        mic numbers are channels); optional sigma_s, event
  --sound-speed M_S     speed of sound in m/s (instead of --medium/--temperature)
  --sound-speed-sigma M_S  its standard deviation (default 0)
  --medium M            air (default), seawater or freshwater, with --temperature C and
                        the options of 'whence speed'
  --temperature-sigma K uncertainty of the temperature (default 1 K; 5 K when assumed)
  --dims 2|3            2 (default): source on a known height; 3: full 3-D fix
  --height M            source height for 2-D, metres up (default: microphones' mean)
  --height-range LO,HI  2-D: the source is somewhere between LO and HI metres up; its
                        sigma, (HI - LO) / sqrt(12), widens the ellipse (height: the middle)
  --height-sigma M      2-D: one-sigma uncertainty of the source height instead
  --confidence P        confidence of the ellipse, 0..1 (default 0.95)
  --timing-sigma S      standard deviation for delays without sigma_s (default: estimated
                        from the residuals when there are enough pairs, else 0.0001 s)
  --origin LAT,LON[,ALT]  WGS84 origin of the local frame (default for lat/lon arrays:
                        their centroid); gives lat/lon in the output
  --monte-carlo N       also estimate the covariance from N seeded noisy trials
  --seed N              seed of the Monte Carlo trials (default 1)
  --json                JSON array on standard output instead of CSV
  --out FILE            write FILE.csv, FILE.json or FILE.geojson instead (atomically)

  Output columns: event, status (ok, ambiguous, ill-conditioned, inconsistent,
  insufficient or invalid-input), verdict (firm, doubtful or unusable) and
  verdict_reason (why, in one sentence), x_m, y_m, z_m, lat, lon, alt_m, covariance (m²),
  semi_major_m, semi_minor_m, major_axis_deg (counter-clockwise from east),
  residual_rms_s, pairs_used, alternative_x_m/_y_m (the other solution of an
  ambiguous fix), warnings, and more.
`;

export function solveEvents(geometry: ArrayGeometry, events: readonly DelayEvent[], options: SolveOptions): FixRecord[] {
  const microphones: Microphone[] = geometry.microphones.map((m) => ({ label: m.label, eastMeters: m.eastMeters, northMeters: m.northMeters, upMeters: m.upMeters, surveySigmaMeters: m.surveySigmaMeters }));
  const indexOfChannel = new Map(geometry.microphones.map((m, index) => [m.channel, index]));
  return events.map((event) => {
    const delays: DelayMeasurement[] = event.rows.map((row) => {
      const measurement: DelayMeasurement = { indexA: indexOfChannel.get(row.channelA)!, indexB: indexOfChannel.get(row.channelB)!, delaySeconds: row.delaySeconds };
      if (row.sigmaSeconds !== undefined) measurement.sigmaSeconds = row.sigmaSeconds;
      return measurement;
    });
    const result = solveFix(microphones, delays, options);
    const verdict = fixVerdict({ status: result.status, ...(result.fix !== undefined ? { fix: result.fix } : {}), microphones });
    return fixRecord(event.event, result, options.dimensions, geometry.origin, verdict);
  });
}

export async function runSolve(argv: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseCommandArgs('solve', argv, {
    ...fixOptionSpec, array: { type: 'string' }, delays: { type: 'string' }, 'timing-sigma': { type: 'string' }, 'monte-carlo': { type: 'string' }, seed: { type: 'string' },
  });
  if (positionals.length > 0) throw new UsageError(`whence solve takes its files as --array and --delays; unexpected '${positionals.join(' ')}'.`);
  const arrayPath = optionalString(values, 'array');
  const delaysPath = optionalString(values, 'delays');
  if (arrayPath === undefined || delaysPath === undefined) throw new UsageError('whence solve needs --array ARRAY.csv and --delays DELAYS.csv.');
  const shape = fixShapeFromOptions(values, 0.95);
  const output = outputFromOptions(values);
  const origin = parseOrigin(optionalString(values, 'origin'));
  const speed = chooseSpeed(values);
  const options: SolveOptions = { speedMetersPerSecond: speed.speedMetersPerSecond, speedSigmaMetersPerSecond: speed.speedSigmaMetersPerSecond, ...shape };
  const timingSigma = optionalNumber(values, 'timing-sigma', 'seconds');
  if (timingSigma !== undefined) {
    if (!(timingSigma > 0)) throw new UsageError(`--timing-sigma must be positive; got ${timingSigma}.`);
    options.defaultTimingSigmaSeconds = timingSigma;
  }
  const trials = optionalNumber(values, 'monte-carlo', 'a number of trials');
  if (trials !== undefined) {
    if (!Number.isInteger(trials) || trials < 10 || trials > 100_000) throw new UsageError(`--monte-carlo must be a whole number of trials from 10 to 100000; got ${trials}.`);
    options.monteCarlo = { trials, seed: optionalNumber(values, 'seed', 'a whole number') ?? 1 };
  }

  const geometry = parseArrayCsv(await readTextFile(arrayPath, 'array table'), arrayPath, origin);
  const events = parseDelaysCsv(await readTextFile(delaysPath, 'delay table'), delaysPath, new Set(geometry.microphones.map((m) => m.channel)));
  for (const warning of [...geometry.warnings, ...speed.warnings]) io.writeStderr(`warning: ${warning}\n`);
  const records = solveEvents(geometry, events, options);
  let text: string;
  if (output.kind === 'geojson') text = fixesToGeoJson(records, requireGeoJsonOrigin(geometry.origin), true);
  else if (output.kind === 'json') text = fixesToJson(records);
  else text = fixesToCsv(shape.dimensions === 3 ? FIX_COLUMNS_3D : FIX_COLUMNS_2D, records);
  if (output.outPath !== undefined) {
    await writeFileAtomic(output.outPath, text);
    io.writeStderr(`wrote ${records.length} fix${records.length === 1 ? '' : 'es'} to ${output.outPath}\n`);
  } else {
    io.writeStdout(text);
  }
  const notFirm = records.filter((record) => record.verdict !== 'firm').length;
  if (notFirm > 0) {
    io.writeStderr(`verdicts: ${verdictTally(records)}; see the verdict and verdict_reason columns before acting on a fix.\n`);
  }
  const failed = records.filter((record) => record.status !== 'ok').length;
  if (failed > 0) io.writeStderr(`${failed} of ${records.length} event${records.length === 1 ? '' : 's'} gave no unambiguous fix; see the status and warnings columns.\n`);
  return 0;
}
