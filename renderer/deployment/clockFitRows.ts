// The clock fit as rows for the Clock fit panel: per recorder offset (ms), drift (ppm), their sigmas and residual RMS (µs);
// per sound its residual at each microphone (µs) and a shared sound's fitted place (m). Which clocks are in use, in words. Pure.
import { OFFSET_SIGMA_LIMITS_SECONDS, type DeploymentClockReport } from '../../core/deployment';

/** The clocks the open deployment is read through. */
export type ClocksInUse = { kind: 'files' } | { kind: 'fitted'; report: DeploymentClockReport };

export interface RecorderClockRow {
  name: string;
  reference: boolean;
  offsetMs: string;
  offsetSigmaMs: string;
  driftPpm: string;
  driftSigmaPpm: string;
  residualRmsMicroseconds: string;
  soundCount: number;
  warning?: string;
}

export interface SoundResidualRow {
  label: string;
  timeSeconds: string;
  /** A shared sound's fitted place, "12.03 ± 0.02" metres per axis ("—" for a sound the fit left out). */
  place?: { east: string; north: string; up: string };
  /** One cell per microphone of `microphones`: residual in µs, or undefined when that microphone did not hear it. */
  cells: Array<{ text: string; beyondSigmas: boolean } | undefined>;
}

/** A residual beyond this many of its sigmas is marked in the table. */
export const RESIDUAL_MARK_SIGMAS = 3;

function fixed(value: number, decimals: number): string {
  const text = value.toFixed(decimals);
  // no "-0.000"
  return Number(text) === 0 ? (0).toFixed(decimals) : text;
}

export function recorderClockRows(report: DeploymentClockReport): RecorderClockRow[] {
  return report.recorders.map((r) => {
    const row: RecorderClockRow = {
      name: r.name,
      reference: r.reference,
      offsetMs: fixed(r.offsetSeconds * 1e3, 3),
      offsetSigmaMs: fixed(r.offsetSigmaSeconds * 1e3, 3),
      driftPpm: fixed(r.driftPpm, 3),
      driftSigmaPpm: fixed(r.driftSigmaPpm, 3),
      residualRmsMicroseconds: fixed(r.residualRmsSeconds * 1e6, 1),
      soundCount: r.soundCount,
    };
    if (r.warning !== undefined && r.warning !== '') row.warning = r.warning;
    return row;
  });
}

/** The microphones in the order of the deployment's channels, then any other microphone the report names. */
export function residualMicrophones(report: DeploymentClockReport, deploymentMicrophones: readonly string[]): string[] {
  const heard = new Set(report.sounds.flatMap((sound) => sound.residuals.map((r) => r.microphone)));
  return [...deploymentMicrophones.filter((label) => heard.has(label)), ...[...heard].filter((label) => !deploymentMicrophones.includes(label))];
}

/** "12.03 ± 0.02" (metres to the centimetre); "12.03" without a sigma (a height held fixed); "—" when not fitted. */
function metresWithSigma(value: number, sigma: number): string {
  if (!Number.isFinite(value)) return '—';
  return sigma > 0 && Number.isFinite(sigma) ? `${fixed(value, 2)} ± ${fixed(sigma, 2)}` : fixed(value, 2);
}

export function soundResidualRows(report: DeploymentClockReport, microphones: readonly string[]): SoundResidualRow[] {
  return report.sounds.map((sound) => {
    const row: SoundResidualRow = {
      label: sound.label,
      timeSeconds: Number.isFinite(sound.timeSeconds) ? fixed(sound.timeSeconds, 3) : '—',
      cells: microphones.map((microphone) => {
        const residual = sound.residuals.find((r) => r.microphone === microphone);
        if (residual === undefined) return undefined;
        return { text: fixed(residual.residualSeconds * 1e6, 1), beyondSigmas: Math.abs(residual.residualSeconds) > RESIDUAL_MARK_SIGMAS * residual.sigmaSeconds };
      }),
    };
    const place = sound.place;
    if (place !== undefined) row.place = { east: metresWithSigma(place.eastMeters, place.sigmaEastMeters), north: metresWithSigma(place.northMeters, place.sigmaNorthMeters), up: metresWithSigma(place.upMeters, place.sigmaUpMeters) };
    return row;
  });
}

/** The words for a fit's kind of table: captions, notices and the choice in the Clock fit panel. */
export function clockFitKindWords(kind: DeploymentClockReport['kind']): { sounds: string; table: string } {
  return kind === 'calibration' ? { sounds: 'calibration sounds', table: 'calibration table' } : { sounds: 'shared sounds', table: 'shared-sound table' };
}

/**
 * The offset prior typed in the Clock fit panel, milliseconds (the command line's --offset-sigma is in seconds): empty
 * means the default by each recorder's stamp; else a number from 0.1 ms to an hour.
 */
export function offsetPriorFromMs(text: string): { seconds?: number } | { problem: string } {
  const trimmed = text.trim();
  if (trimmed === '') return {};
  const ms = Number(trimmed);
  const { min, max } = OFFSET_SIGMA_LIMITS_SECONDS;
  if (!Number.isFinite(ms) || ms * 1e-3 < min || ms * 1e-3 > max) return { problem: `The offset prior must be ${min * 1e3} to ${max * 1e3} ms (how far each recorder's stamps may be off, one sigma), or empty for the default by stamp (1000 ms, 2000 ms for whole-second stamps).` };
  return { seconds: ms * 1e-3 };
}

/** "files' own clocks" or "fitted from calibration.csv": what the time line, the locate runs and the survey log use. */
export function clocksInUseText(clocks: ClocksInUse): string {
  return clocks.kind === 'files' ? 'files\' own clocks' : `fitted from ${clocks.report.tableName}`;
}

/** The same in a sentence: "the files' own clocks", "the clocks fitted from calibration.csv". */
export function clocksPhrase(clocks: ClocksInUse): string {
  return clocks.kind === 'files' ? 'the files\' own clocks' : `the clocks fitted from ${clocks.report.tableName}`;
}
