// Checks that an array fits Whence's flat local frame: an origin near the ground, microphones within 50 km of each
// other and near the origin's tangent plane. Metres; WGS84 ellipsoidal heights (NIMA TR8350.2).
import type { GeodeticPosition } from '../geo';
import { MAX_APERTURE_METERS } from '../locate';
import type { ArrayMicrophone } from './arrayGeometry';

/** Largest distance of a microphone from the origin of a georeferenced frame, metres. */
export const MAX_ORIGIN_DISTANCE_METERS = 50_000;
/** Heights of a plausible origin above the ellipsoid: the deepest sea floor to high in the atmosphere, metres (common practice). */
export const ORIGIN_HEIGHT_RANGE_METERS = Object.freeze({ lowest: -12_000, highest: 100_000 });

/** Sentences saying what is wrong with the array's extent and what to do; empty when it fits one local frame. */
export function arrayExtentProblems(microphones: readonly ArrayMicrophone[], origin: GeodeticPosition | undefined): string[] {
  const problems: string[] = [];
  if (origin !== undefined && !(origin.heightMeters >= ORIGIN_HEIGHT_RANGE_METERS.lowest && origin.heightMeters <= ORIGIN_HEIGHT_RANGE_METERS.highest)) {
    problems.push(
      `the origin of the local frame is ${(origin.heightMeters / 1000).toFixed(1)} km from the WGS84 ellipsoid (allowed ${ORIGIN_HEIGHT_RANGE_METERS.lowest / 1000} to ${ORIGIN_HEIGHT_RANGE_METERS.highest / 1000} km), ` +
        'towards the centre of the Earth, not at the array (an origin averaged from microphones spread around the globe lands there). Check the coordinates (lat/lon swapped or mistyped?) and give an origin at the array.',
    );
  }
  let apertureMeters = 0;
  let pair: [ArrayMicrophone, ArrayMicrophone] | undefined;
  for (let i = 0; i < microphones.length; i++) {
    for (let j = i + 1; j < microphones.length; j++) {
      const a = microphones[i]!;
      const b = microphones[j]!;
      const d = Math.hypot(a.eastMeters - b.eastMeters, a.northMeters - b.northMeters, a.upMeters - b.upMeters);
      if (!(d <= apertureMeters)) {
        apertureMeters = d;
        pair = [a, b];
      }
    }
  }
  if (pair !== undefined && !(apertureMeters <= MAX_APERTURE_METERS)) {
    problems.push(
      `microphones ${pair[0].label} and ${pair[1].label} are ${(apertureMeters / 1000).toPrecision(3)} km apart, more than ${MAX_APERTURE_METERS / 1000} km: ` +
        'one flat local frame and one speed of sound do not hold over such an array. Check the units (metres) and the coordinates, or split the array.',
    );
  }
  if (origin !== undefined) {
    let farthest: ArrayMicrophone | undefined;
    let distance = 0;
    for (const m of microphones) {
      const d = Math.hypot(m.eastMeters, m.northMeters, m.upMeters);
      if (farthest === undefined || d > distance) {
        farthest = m;
        distance = d;
      }
    }
    if (farthest !== undefined && !(distance <= MAX_ORIGIN_DISTANCE_METERS)) {
      problems.push(
        `microphone ${farthest.label} is ${(distance / 1000).toPrecision(3)} km from the origin, more than ${MAX_ORIGIN_DISTANCE_METERS / 1000} km: the microphones are not near the origin's tangent plane. ` +
          'Give an origin at the array (or leave it out to use the microphones\' centroid).',
      );
    }
  }
  return problems;
}
