// The clock fit as text lines (command line, survey log head) and as plain data (JSON): per recorder offset, drift (ppm),
// their sigmas, residual RMS; per calibration sound its residual at each microphone. Seconds and microseconds.
import type { ClockFitResult, ClockObservation } from './clockFit';

/** One line per recorder, the form the survey log's head keeps (and `whence merge` compares). */
export function clockFitLines(fit: ClockFitResult): string[] {
  return fit.recorders.map((r) => `clock ${r.name}: ${r.reference ? 'reference, ' : ''}offset ${r.clock.offsetSeconds.toFixed(6)} s ± ${(r.offsetSigmaSeconds * 1e6).toFixed(1)} µs, drift ${(r.clock.drift * 1e6).toFixed(3)} ppm ± ${(r.driftSigma * 1e6).toFixed(3)}, from ${r.clock.clockStartSeconds.toFixed(6)} s, residual RMS ${(r.residualRmsSeconds * 1e6).toFixed(1)} µs over ${r.observationCount} arrivals`);
}

/** Sound k's residual at each microphone that heard it, in the order of the observations. */
export function soundResiduals(fit: ClockFitResult, observations: readonly ClockObservation[], k: number): Array<{ microphone: string; residualSeconds: number; sigmaSeconds: number }> {
  return observations.flatMap((obs, index) => (obs.soundIndex === k ? [{ microphone: obs.microphone, residualSeconds: fit.residualsSeconds[index]!, sigmaSeconds: obs.sigmaSeconds }] : []));
}

export function clockFitJson(fit: ClockFitResult, observations: readonly ClockObservation[]): Record<string, unknown> {
  return {
    timeBase: fit.timeBase,
    recorders: fit.recorders.map((r) => ({
      recorder: r.name, reference: r.reference, clockStartSeconds: r.clock.clockStartSeconds,
      offsetSeconds: r.clock.offsetSeconds, offsetSigmaSeconds: r.offsetSigmaSeconds, driftPpm: r.clock.drift * 1e6, driftSigmaPpm: r.driftSigma * 1e6,
      residualRmsSeconds: r.residualRmsSeconds, arrivals: r.observationCount, warnings: r.warnings,
    })),
    sounds: fit.sounds.map((sound, k) => ({
      label: sound.label, emittedSeconds: sound.emittedSeconds, emittedSigmaSeconds: sound.sigmaSeconds,
      residuals: soundResiduals(fit, observations, k),
    })),
    chiSquare: fit.chiSquare, degreesOfFreedom: fit.degreesOfFreedom, sigmaScale: fit.sigmaScale, warnings: fit.warnings,
  };
}
