// The clock fit of an open deployment as plain, serialisable data (what the app's pipeline worker hands the workspace):
// per recorder offset (s), drift (ppm), sigmas, residual RMS (s); per sound its residuals (s), a shared sound's fitted place (m).
import { clockFitHeadLines, clockFitJson, clockFitText, soundResiduals } from './clockFitReport';
import type { DeploymentSync } from './syncDeployment';

/** Which table the clocks were fitted from: calibration sounds at surveyed points, or shared sounds at unknown places. */
export type ClockFitKind = 'calibration' | 'shared-sounds';

export interface DeploymentClockReport {
  kind: ClockFitKind;
  /** Name of the calibration or shared-sound table the fit came from. */
  tableName: string;
  recorders: Array<{
    name: string;
    /** True for the recorder that defines time (offset and drift fixed at 0). */
    reference: boolean;
    offsetSeconds: number;
    offsetSigmaSeconds: number;
    driftPpm: number;
    driftSigmaPpm: number;
    residualRmsSeconds: number;
    /** Sounds of the table this recorder heard. */
    soundCount: number;
    /** Shared sounds: the one-sigma of the offset prior the fit was steadied by (the command line's --offset-sigma). */
    offsetPriorSigmaSeconds?: number;
    /** Why this recorder's fit is poor (or uncorrected), when it is. */
    warning?: string;
  }>;
  sounds: Array<{
    /** 0-based, in the order of the table. */
    index: number;
    label: string;
    /** Emission time, seconds of deployment time (fitted, or as the table gives it); NaN for a shared sound left out. */
    timeSeconds: number;
    /** Its one-sigma, seconds (0 when the table gives it). */
    timeSigmaSeconds: number;
    /** Shared sounds: the fitted place, metres east/north/up of the array's origin, with its one-sigma per axis. */
    place?: { eastMeters: number; northMeters: number; upMeters: number; sigmaEastMeters: number; sigmaNorthMeters: number; sigmaUpMeters: number };
    /** Observed minus modelled arrival at each microphone that heard it, with the arrival's one-sigma. */
    residuals: Array<{ microphone: string; residualSeconds: number; sigmaSeconds: number }>;
  }>;
  /** The fit as `whence sync` prints it (time base, clocks, sounds, chi-square, warnings). */
  lines: string[];
  /** The fit as data: what `whence sync --json` gives for it (core/deployment clockFitJson). */
  headJson: Record<string, unknown>;
  /** The clock lines `whence locate --deployment` writes as notes in the survey log's head. */
  headLines: string[];
  warnings: string[];
}

/** The report of a clock fit (./syncDeployment) from the table `tableName`; shared sounds when the sync has fitted places. */
export function deploymentClockReport(sync: DeploymentSync, tableName: string): DeploymentClockReport {
  const { fit, observations, soundPlaces } = sync;
  return {
    kind: soundPlaces === undefined ? 'calibration' : 'shared-sounds',
    tableName,
    recorders: fit.recorders.map((r, index) => {
      const recorder: DeploymentClockReport['recorders'][number] = {
        name: r.name, reference: r.reference, offsetSeconds: r.clock.offsetSeconds, offsetSigmaSeconds: r.offsetSigmaSeconds,
        driftPpm: r.clock.drift * 1e6, driftSigmaPpm: r.driftSigma * 1e6, residualRmsSeconds: r.residualRmsSeconds,
        soundCount: new Set(observations.filter((obs) => obs.recorderIndex === index).map((obs) => obs.soundIndex)).size,
      };
      const prior = sync.offsetPriorSigmasSeconds?.[index];
      if (prior !== undefined) recorder.offsetPriorSigmaSeconds = prior;
      if (r.warnings.length > 0) recorder.warning = r.warnings.join(' ');
      return recorder;
    }),
    sounds: fit.sounds.map((sound, k) => {
      const entry: DeploymentClockReport['sounds'][number] = { index: k, label: sound.label, timeSeconds: sound.emittedSeconds, timeSigmaSeconds: sound.sigmaSeconds, residuals: soundResiduals(fit, observations, k) };
      const at = soundPlaces?.positions[k];
      const sigma = soundPlaces?.sigmas[k];
      if (at !== undefined && sigma !== undefined) entry.place = { ...at, sigmaEastMeters: sigma.eastMeters, sigmaNorthMeters: sigma.northMeters, sigmaUpMeters: sigma.upMeters };
      return entry;
    }),
    lines: clockFitText(fit, observations, soundPlaces),
    headJson: clockFitJson(fit, observations, soundPlaces),
    headLines: clockFitHeadLines(fit),
    warnings: [...sync.warnings],
  };
}
