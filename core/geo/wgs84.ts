// The WGS84 reference ellipsoid: defining constants and the quantities derived from them (metres, unitless).
// NIMA TR8350.2 (2000), Department of Defense World Geodetic System 1984, Table 3.1.

const SEMI_MAJOR_AXIS_METERS = 6378137;
const INVERSE_FLATTENING = 298.257223563;
const FLATTENING = 1 / INVERSE_FLATTENING;
const ECCENTRICITY_SQUARED = FLATTENING * (2 - FLATTENING);

export const WGS84 = Object.freeze({
  semiMajorAxisMeters: SEMI_MAJOR_AXIS_METERS,
  inverseFlattening: INVERSE_FLATTENING,
  flattening: FLATTENING,
  semiMinorAxisMeters: SEMI_MAJOR_AXIS_METERS * (1 - FLATTENING),
  /** First eccentricity squared, e² = f(2 − f). */
  eccentricitySquared: ECCENTRICITY_SQUARED,
  /** Second eccentricity squared, e'² = e²/(1 − e²). */
  secondEccentricitySquared: ECCENTRICITY_SQUARED / (1 - ECCENTRICITY_SQUARED),
});
