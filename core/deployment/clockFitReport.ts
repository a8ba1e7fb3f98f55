// The clock fit as text lines (command line, survey log head) and as plain data (JSON): per recorder offset, drift (ppm),
// their sigmas, residual RMS; per sound its residual at each microphone (and a shared sound's fitted place). Seconds, µs, metres.
import { formatTable } from '../text';
import type { ClockFitResult, ClockObservation } from './clockFit';

/** One line per recorder, the form the survey log's head keeps (and `whence merge` compares). */
export function clockFitLines(fit: ClockFitResult): string[] {
  return fit.recorders.map((r) => `clock ${r.name}: ${r.reference ? 'reference, ' : ''}offset ${r.clock.offsetSeconds.toFixed(6)} s ± ${(r.offsetSigmaSeconds * 1e6).toFixed(1)} µs, drift ${(r.clock.drift * 1e6).toFixed(3)} ppm ± ${(r.driftSigma * 1e6).toFixed(3)}, from ${r.clock.clockStartSeconds.toFixed(6)} s, residual RMS ${(r.residualRmsSeconds * 1e6).toFixed(1)} µs over ${r.observationCount} arrivals`);
}

/** Sound k's residual at each microphone that heard it, in the order of the observations. */
export function soundResiduals(fit: ClockFitResult, observations: readonly ClockObservation[], k: number): Array<{ microphone: string; residualSeconds: number; sigmaSeconds: number }> {
  return observations.flatMap((obs, index) => (obs.soundIndex === k ? [{ microphone: obs.microphone, residualSeconds: fit.residualsSeconds[index]!, sigmaSeconds: obs.sigmaSeconds }] : []));
}

/** Fitted places of shared sounds, metres east/north/up of the array's origin, with their one-sigmas (sharedSoundFit), in the sounds' order. */
export interface FittedSoundPlaces {
  positions: ReadonlyArray<{ eastMeters: number; northMeters: number; upMeters: number }>;
  sigmas: ReadonlyArray<{ eastMeters: number; northMeters: number; upMeters: number }>;
}

/** The fit as `whence sync --json` gives it (after the deployment and start times); shared sounds with their fitted places. */
export function clockFitJson(fit: ClockFitResult, observations: readonly ClockObservation[], places?: FittedSoundPlaces): Record<string, unknown> {
  return {
    timeBase: fit.timeBase,
    recorders: fit.recorders.map((r) => ({
      recorder: r.name, reference: r.reference, clockStartSeconds: r.clock.clockStartSeconds,
      offsetSeconds: r.clock.offsetSeconds, offsetSigmaSeconds: r.offsetSigmaSeconds, driftPpm: r.clock.drift * 1e6, driftSigmaPpm: r.driftSigma * 1e6,
      residualRmsSeconds: r.residualRmsSeconds, arrivals: r.observationCount, warnings: r.warnings,
    })),
    sounds: fit.sounds.map((sound, k) => {
      const at = places?.positions[k];
      const sigma = places?.sigmas[k];
      return {
        label: sound.label, emittedSeconds: sound.emittedSeconds, emittedSigmaSeconds: sound.sigmaSeconds,
        residuals: soundResiduals(fit, observations, k),
        ...(at !== undefined ? { fittedEastMeters: at.eastMeters, fittedNorthMeters: at.northMeters, fittedUpMeters: at.upMeters } : {}),
        ...(sigma !== undefined ? { fittedSigmaEastMeters: sigma.eastMeters, fittedSigmaNorthMeters: sigma.northMeters, fittedSigmaUpMeters: sigma.upMeters } : {}),
      };
    }),
    chiSquare: fit.chiSquare, degreesOfFreedom: fit.degreesOfFreedom, sigmaScale: fit.sigmaScale, warnings: fit.warnings,
  };
}

/** The clock lines of a survey log's head (`whence locate --deployment`, and the app's exports): the time base, then one per recorder. */
export function clockFitHeadLines(fit: ClockFitResult): string[] {
  return [`clock time base: ${fit.timeBase}`, ...clockFitLines(fit)];
}

/**
 * The fit as `whence sync` prints it after the start times, one line each: time base, the clocks, the sounds with their
 * residuals (µs) and fitted places (shared sounds), chi-square and the warnings.
 */
export function clockFitText(fit: ClockFitResult, observations: readonly ClockObservation[], places?: FittedSoundPlaces): string[] {
  const rows: Array<readonly [string, string]> = fit.recorders.map((r) => [r.name, `${r.reference ? 'reference  ' : ''}offset ${r.clock.offsetSeconds.toFixed(6)} s ± ${(r.offsetSigmaSeconds * 1e6).toFixed(1)} µs, drift ${(r.clock.drift * 1e6).toFixed(3)} ± ${(r.driftSigma * 1e6).toFixed(3)} ppm, residual RMS ${(r.residualRmsSeconds * 1e6).toFixed(1)} µs (${r.observationCount} arrivals)${r.warnings.length > 0 ? '  POOR FIT' : ''}`]);
  const soundRows = fit.sounds.map((sound, k) => {
    const residuals = soundResiduals(fit, observations, k).map((r) => `${r.microphone} ${(r.residualSeconds * 1e6).toFixed(1)}`);
    const at = places?.positions[k];
    const sigma = places?.sigmas[k];
    const place = at === undefined ? '' : ` at ${at.eastMeters.toFixed(2)}, ${at.northMeters.toFixed(2)}, ${at.upMeters.toFixed(2)} m${sigma === undefined ? '' : ` ± ${sigma.eastMeters.toFixed(2)}, ${sigma.northMeters.toFixed(2)}, ${sigma.upMeters.toFixed(2)}`}`;
    return [sound.label, `emitted ${sound.emittedSeconds.toFixed(6)} s${place}; residuals µs: ${residuals.join(', ')}`] as const;
  });
  return [
    `time base: ${fit.timeBase}`,
    'clocks:', ...formatTable(rows).trimEnd().split('\n'),
    places !== undefined ? 'shared sounds (places fitted):' : 'calibration sounds:', ...formatTable(soundRows).trimEnd().split('\n'),
    `chi-square ${fit.chiSquare.toFixed(1)} on ${fit.degreesOfFreedom} degrees of freedom; sigmas scaled by ${fit.sigmaScale.toFixed(2)}`,
    ...fit.warnings.map((warning) => `warning: ${warning}`),
  ];
}
