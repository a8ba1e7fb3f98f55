// Input checks for solveFix: every number finite, indices in range, options in their domains, no duplicate microphones.
// Returns sentences naming the field (e.g. `delays[3].delaySeconds`) and what to do; empty when the input is usable.
import type { DelayMeasurement, Microphone, SolveOptions } from './types';
import { apertureMeters, microphoneDistanceMeters } from './aperture';

function describe(value: unknown): string {
  return typeof value === 'number' ? String(value) : value === undefined ? 'missing' : `a ${typeof value}`;
}

function finite(value: unknown): value is number {
  return typeof value === 'number' && Number.isFinite(value);
}

/** Distance below which two microphones count as the same position, metres. */
export const DUPLICATE_DISTANCE_METERS = 1e-9;
/** Largest distance between two microphones: one flat local frame and one speed of sound are meant for arrays up to this, metres. */
export const MAX_APERTURE_METERS = 50_000;
/** Largest local coordinate: beyond this a microphone is off the Earth's local tangent plane (or not in metres), metres. */
export const MAX_LOCAL_COORDINATE_METERS = 1_000_000;

export function validateInput(microphones: readonly Microphone[], delays: readonly DelayMeasurement[], options: SolveOptions): string[] {
  const problems: string[] = [];
  const need = (ok: boolean, field: string, value: unknown, what: string): void => {
    if (!ok) problems.push(`${field} is ${describe(value)}: ${what}.`);
  };
  if (!Array.isArray(microphones)) return ['microphones must be an array of positions in local east/north/up metres.'];
  if (!Array.isArray(delays)) return ['delays must be an array of pair delays.'];
  if (typeof options !== 'object' || options === null) return ['options must be given (speedMetersPerSecond and dimensions at least).'];

  need(finite(options.speedMetersPerSecond) && options.speedMetersPerSecond > 0, 'options.speedMetersPerSecond', options.speedMetersPerSecond, 'give the speed of sound in m/s, a positive number');
  if (options.speedSigmaMetersPerSecond !== undefined) {
    need(finite(options.speedSigmaMetersPerSecond) && options.speedSigmaMetersPerSecond >= 0, 'options.speedSigmaMetersPerSecond', options.speedSigmaMetersPerSecond, 'give a sigma of zero or more in m/s');
  }
  need(options.dimensions === 2 || options.dimensions === 3, 'options.dimensions', options.dimensions, 'choose 2 (source on a known height) or 3');
  if (options.sourceUpMeters !== undefined) need(finite(options.sourceUpMeters), 'options.sourceUpMeters', options.sourceUpMeters, 'give a finite height in metres');
  if (options.sourceUpSigmaMeters !== undefined) {
    need(finite(options.sourceUpSigmaMeters) && options.sourceUpSigmaMeters >= 0, 'options.sourceUpSigmaMeters', options.sourceUpSigmaMeters, 'give a sigma of zero or more in metres');
  }
  if (options.confidence !== undefined) {
    need(finite(options.confidence) && options.confidence > 0 && options.confidence < 1, 'options.confidence', options.confidence, 'give a probability between 0 and 1, e.g. 0.95');
  }
  if (options.defaultTimingSigmaSeconds !== undefined) {
    need(finite(options.defaultTimingSigmaSeconds) && options.defaultTimingSigmaSeconds > 0, 'options.defaultTimingSigmaSeconds', options.defaultTimingSigmaSeconds, 'give a positive sigma in seconds');
  }
  if (options.lagToleranceSeconds !== undefined) {
    need(finite(options.lagToleranceSeconds) && options.lagToleranceSeconds >= 0, 'options.lagToleranceSeconds', options.lagToleranceSeconds, 'give a tolerance of zero or more in seconds');
  }
  if (options.residualTestLevel !== undefined) {
    need(finite(options.residualTestLevel) && options.residualTestLevel > 0 && options.residualTestLevel < 1, 'options.residualTestLevel', options.residualTestLevel, 'give a significance level between 0 and 1, e.g. 0.01');
  }
  if (options.conditionNumberLimit !== undefined) {
    need(finite(options.conditionNumberLimit) && options.conditionNumberLimit > 1, 'options.conditionNumberLimit', options.conditionNumberLimit, 'give a number above 1, e.g. 1e6');
  }
  if (options.timingModel !== undefined) {
    need(options.timingModel === 'independent-pairs' || options.timingModel === 'arrival-times', 'options.timingModel', options.timingModel, "choose 'independent-pairs' or 'arrival-times'");
  }
  if (options.monteCarlo !== undefined) {
    const { trials, seed } = options.monteCarlo;
    need(Number.isInteger(trials) && trials >= 2, 'options.monteCarlo.trials', trials, 'give a whole number of trials, at least 2');
    need(finite(seed), 'options.monteCarlo.seed', seed, 'give a finite seed');
  }

  microphones.forEach((mic, i) => {
    for (const key of ['eastMeters', 'northMeters', 'upMeters'] as const) {
      need(finite(mic?.[key]), `microphones[${i}].${key}`, mic?.[key], 'give a finite coordinate in metres');
    }
    if (mic?.surveySigmaMeters !== undefined) {
      need(finite(mic.surveySigmaMeters) && mic.surveySigmaMeters >= 0, `microphones[${i}].surveySigmaMeters`, mic.surveySigmaMeters, 'give a sigma of zero or more in metres');
    }
  });
  if (options.arrivalTimesSeconds !== undefined) {
    if (!Array.isArray(options.arrivalTimesSeconds) || options.arrivalTimesSeconds.length > microphones.length) {
      problems.push(`options.arrivalTimesSeconds must be an array with at most one entry per microphone (${microphones.length}).`);
    } else {
      options.arrivalTimesSeconds.forEach((time, i) => {
        if (time !== undefined) need(finite(time), `options.arrivalTimesSeconds[${i}]`, time, 'give a finite time in seconds or leave it undefined');
      });
    }
  }
  delays.forEach((delay, k) => {
    for (const key of ['indexA', 'indexB'] as const) {
      const index = delay?.[key];
      need(Number.isInteger(index) && index >= 0 && index < microphones.length, `delays[${k}].${key}`, index, `give a microphone index from 0 to ${microphones.length - 1}`);
    }
    if (delay && delay.indexA === delay.indexB && Number.isInteger(delay.indexA)) {
      problems.push(`delays[${k}] pairs microphone ${delay.indexA} with itself: a delay needs two different microphones.`);
    }
    need(finite(delay?.delaySeconds), `delays[${k}].delaySeconds`, delay?.delaySeconds, 'give a finite delay in seconds');
    if (delay?.sigmaSeconds !== undefined) {
      need(finite(delay.sigmaSeconds) && delay.sigmaSeconds > 0, `delays[${k}].sigmaSeconds`, delay.sigmaSeconds, 'give a positive sigma in seconds or leave it out');
    }
  });
  if (problems.length > 0) return problems;

  microphones.forEach((mic, i) => {
    const largest = Math.max(Math.abs(mic.eastMeters), Math.abs(mic.northMeters), Math.abs(mic.upMeters));
    if (largest > MAX_LOCAL_COORDINATE_METERS) {
      problems.push(
        `microphones[${i}] ('${mic.label}') is ${largest.toExponential(2)} m from the origin of the local frame, beyond ${MAX_LOCAL_COORDINATE_METERS / 1000} km: ` +
          'local east/north/up metres only hold near one tangent plane of the Earth. Check the units (metres) and the coordinates, or put the origin at the array.',
      );
    }
  });
  if (problems.length > 0) return problems;
  const aperture = apertureMeters(microphones);
  if (aperture > MAX_APERTURE_METERS) {
    problems.push(
      `The microphones span ${(aperture / 1000).toPrecision(3)} km, more than ${MAX_APERTURE_METERS / 1000} km: one flat local frame and one speed of sound ` +
        'do not hold over such a distance. Check the units (metres) and the coordinates, or split the array.',
    );
    return problems;
  }

  for (let i = 0; i < microphones.length; i++) {
    for (let j = i + 1; j < microphones.length; j++) {
      const a = microphones[i];
      const b = microphones[j];
      if (microphoneDistanceMeters(a, b) <= DUPLICATE_DISTANCE_METERS) {
        problems.push(
          `microphones[${i}] ('${a.label}') and microphones[${j}] ('${b.label}') are at the same position ` +
            `(${a.eastMeters}, ${a.northMeters}, ${a.upMeters}) m: correct the survey or remove one of them.`,
        );
      }
    }
  }
  return problems;
}
