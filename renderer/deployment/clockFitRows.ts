// The clock fit as rows for the Clock fit panel: per recorder offset (ms), drift (ppm), their sigmas and residual RMS (µs);
// per calibration sound its residual at each microphone (µs). Which clocks are in use, in words. Pure.
import type { DeploymentClockReport } from '../../core/deployment';

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

export function soundResidualRows(report: DeploymentClockReport, microphones: readonly string[]): SoundResidualRow[] {
  return report.sounds.map((sound) => ({
    label: sound.label,
    timeSeconds: fixed(sound.timeSeconds, 3),
    cells: microphones.map((microphone) => {
      const residual = sound.residuals.find((r) => r.microphone === microphone);
      if (residual === undefined) return undefined;
      return { text: fixed(residual.residualSeconds * 1e6, 1), beyondSigmas: Math.abs(residual.residualSeconds) > RESIDUAL_MARK_SIGMAS * residual.sigmaSeconds };
    }),
  }));
}

/** "files' own clocks" or "fitted from calibration.csv": what the time line, the locate runs and the survey log use. */
export function clocksInUseText(clocks: ClocksInUse): string {
  return clocks.kind === 'files' ? 'files\' own clocks' : `fitted from ${clocks.report.calibrationName}`;
}

/** The same in a sentence: "the files' own clocks", "the clocks fitted from calibration.csv". */
export function clocksPhrase(clocks: ClocksInUse): string {
  return clocks.kind === 'files' ? 'the files\' own clocks' : `the clocks fitted from ${clocks.report.calibrationName}`;
}
