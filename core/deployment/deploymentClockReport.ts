// The clock fit of an open deployment as plain, serialisable data (what the app's pipeline worker hands the workspace):
// per recorder offset (s), drift (ppm), sigmas, residual RMS (s); per calibration sound its residuals (s); the printed lines.

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
