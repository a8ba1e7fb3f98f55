// One flat record per located event, with units in every key, as the command line and the app export it.
// Angles of the ellipse are counter-clockwise from east (+x), in degrees; positions in local metres and WGS84.
import { enuToGeodetic, type GeodeticPosition } from '../geo';
import type { SolveResult, Verdict } from '../locate';

export type FixRecordValue = string | number | undefined;
export type FixRecord = Record<string, FixRecordValue>;

export const FIX_COLUMNS_2D = ['event', 'status', 'verdict', 'verdict_reason', 'x_m', 'y_m', 'z_m', 'lat', 'lon', 'alt_m', 'cov_xx_m2', 'cov_xy_m2', 'cov_yy_m2', 'semi_major_m', 'semi_minor_m', 'major_axis_deg', 'confidence', 'residual_rms_s', 'timing_sigma_s', 'sigma_source', 'chi_square', 'chi_square_dof', 'gdop', 'pairs_used', 'pairs_dropped', 'alternative_x_m', 'alternative_y_m', 'warnings'] as const;
export const FIX_COLUMNS_3D = [...FIX_COLUMNS_2D.slice(0, 13), 'cov_zz_m2', 'cov_xz_m2', 'cov_yz_m2', ...FIX_COLUMNS_2D.slice(13), 'alternative_z_m'] as const;

function finiteOrUndefined(value: number | undefined): number | undefined {
  return value !== undefined && Number.isFinite(value) ? value : undefined;
}

/** `value` to `digits` significant digits; undefined when it is missing or not finite. */
export function roundSignificant(value: number | undefined, digits: number): number | undefined {
  const finite = finiteOrUndefined(value);
  return finite === undefined ? undefined : Number(finite.toPrecision(digits));
}

/** `value` to `decimals` places after the point; undefined when it is missing or not finite. */
export function roundDecimals(value: number | undefined, decimals: number): number | undefined {
  const finite = finiteOrUndefined(value);
  return finite === undefined ? undefined : Number(finite.toFixed(decimals));
}

/** The record without its empty fields (undefined or ''), as JSON and GeoJSON write it. */
export function presentFields(record: FixRecord): FixRecord {
  return Object.fromEntries(Object.entries(record).filter(([, value]) => value !== undefined && value !== ''));
}

/** `verdict`: the plain-words verdict (core/locate fixVerdict), written as `verdict` and `verdict_reason` beside the status. */
export function fixRecord(event: string, result: SolveResult, dimensions: 2 | 3, origin: GeodeticPosition | undefined, verdict?: Pick<Verdict, 'grade' | 'reason'>): FixRecord {
  const record: FixRecord = { event, status: result.status, warnings: result.warnings.join(' | ') };
  if (verdict !== undefined) Object.assign(record, { verdict: verdict.grade, verdict_reason: verdict.reason });
  const fix = result.fix;
  if (fix === undefined) return record;
  const covariance = fix.covarianceMeters2;
  Object.assign(record, {
    x_m: roundSignificant(fix.eastMeters, 10), y_m: roundSignificant(fix.northMeters, 10), z_m: roundSignificant(fix.upMeters, 10),
    cov_xx_m2: roundSignificant(covariance[0]?.[0], 6), cov_xy_m2: roundSignificant(covariance[0]?.[1], 6), cov_yy_m2: roundSignificant(covariance[1]?.[1], 6),
    semi_major_m: roundSignificant(fix.ellipse.semiMajorMeters, 6), semi_minor_m: roundSignificant(fix.ellipse.semiMinorMeters, 6),
    major_axis_deg: roundSignificant(fix.ellipse.majorAxisDegreesFromEast, 5), confidence: fix.ellipse.confidence,
    residual_rms_s: roundSignificant(fix.residualRmsSeconds, 6), timing_sigma_s: roundSignificant(fix.timingSigmaSeconds, 6), sigma_source: fix.sigmaSource,
    chi_square: roundSignificant(fix.chiSquare.statistic, 6), chi_square_dof: fix.chiSquare.degreesOfFreedom,
    gdop: roundSignificant(fix.gdop, 6), pairs_used: fix.pairsUsed,
    pairs_dropped: fix.droppedPairs.map((pair) => `${pair.indexA + 1}-${pair.indexB + 1}`).join(' '),
  });
  if (dimensions === 3) {
    Object.assign(record, { cov_zz_m2: roundSignificant(covariance[2]?.[2], 6), cov_xz_m2: roundSignificant(covariance[0]?.[2], 6), cov_yz_m2: roundSignificant(covariance[1]?.[2], 6) });
  }
  if (fix.alternative !== undefined) {
    Object.assign(record, { alternative_x_m: roundSignificant(fix.alternative.eastMeters, 10), alternative_y_m: roundSignificant(fix.alternative.northMeters, 10) });
    if (dimensions === 3) record.alternative_z_m = roundSignificant(fix.alternative.upMeters, 10);
  }
  if (origin !== undefined) {
    const geodetic = enuToGeodetic({ eastMeters: fix.eastMeters, northMeters: fix.northMeters, upMeters: fix.upMeters }, origin);
    Object.assign(record, { lat: roundSignificant(geodetic.latitudeDegrees, 11), lon: roundSignificant(geodetic.longitudeDegrees, 11), alt_m: roundSignificant(geodetic.heightMeters, 8) });
  }
  return record;
}
