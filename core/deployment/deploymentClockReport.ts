// The clock fit of an open deployment as plain, serialisable data (what the app's pipeline worker hands the workspace):
// per recorder offset (s), drift (ppm), sigmas, residual RMS (s); per calibration sound its residuals (s); the printed lines.
import { clockFitHeadLines, clockFitJson, clockFitText, soundResiduals } from './clockFitReport';
import type { DeploymentSync } from './syncDeployment';

export interface DeploymentClockReport {
  /** Name of the calibration table the fit came from. */
  calibrationName: string;
  recorders: Array<{
    name: string;
    /** True for the recorder that defines time (offset and drift fixed at 0). */
    reference: boolean;
    offsetSeconds: number;
    offsetSigmaSeconds: number;
    driftPpm: number;
    driftSigmaPpm: number;
    residualRmsSeconds: number;
    /** Calibration sounds this recorder heard. */
    soundCount: number;
    /** Why this recorder's fit is poor (or uncorrected), when it is. */
    warning?: string;
  }>;
  sounds: Array<{
    /** 0-based, in the order of the calibration table. */
    index: number;
    label: string;
    /** Emission time, seconds of deployment time (fitted, or as the table gives it). */
    timeSeconds: number;
    /** Observed minus modelled arrival at each microphone that heard it, with the arrival's one-sigma. */
    residuals: Array<{ microphone: string; residualSeconds: number; sigmaSeconds: number }>;
  }>;
  /** The fit as `whence sync` prints it (time base, clocks, calibration sounds, chi-square, warnings). */
  lines: string[];
  /** The fit as data: what `whence sync --json` gives for it (core/deployment clockFitJson). */
  headJson: Record<string, unknown>;
  /** The clock lines `whence locate --deployment` writes as notes in the survey log's head. */
  headLines: string[];
  warnings: string[];
}

/** The report of a clock fit (./syncDeployment) from the calibration table `calibrationName`. */
export function deploymentClockReport(sync: DeploymentSync, calibrationName: string): DeploymentClockReport {
  const { fit, observations } = sync;
  return {
    calibrationName,
    recorders: fit.recorders.map((r, index) => {
      const recorder: DeploymentClockReport['recorders'][number] = {
        name: r.name, reference: r.reference, offsetSeconds: r.clock.offsetSeconds, offsetSigmaSeconds: r.offsetSigmaSeconds,
        driftPpm: r.clock.drift * 1e6, driftSigmaPpm: r.driftSigma * 1e6, residualRmsSeconds: r.residualRmsSeconds,
        soundCount: new Set(observations.filter((obs) => obs.recorderIndex === index).map((obs) => obs.soundIndex)).size,
      };
      if (r.warnings.length > 0) recorder.warning = r.warnings.join(' ');
      return recorder;
    }),
    sounds: fit.sounds.map((sound, k) => ({ index: k, label: sound.label, timeSeconds: sound.emittedSeconds, residuals: soundResiduals(fit, observations, k) })),
    lines: clockFitText(fit, observations, sync.soundPositions),
    headJson: clockFitJson(fit, observations),
    headLines: clockFitHeadLines(fit),
    warnings: [...sync.warnings],
  };
}
