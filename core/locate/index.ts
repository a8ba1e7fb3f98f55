// Public face of core/locate: TDOA position fixes with covariance, ellipse, residual tests, CRLB, GDOP, precision maps.
// Local east/north/up metres, seconds, m². Chan & Ho (1994) / Smith & Abel (1987) starts, weighted Gauss-Newton/LM.

export type {
  Microphone,
  DelayMeasurement,
  FixStatus,
  TimingModel,
  SolveOptions,
  ErrorEllipse,
  ErrorEllipsoid,
  PairResidual,
  UncertaintyBudget,
  Position,
  Fix,
  SolveResult,
} from './types';
export { solveFix, MIN_DOF_FOR_RESIDUAL_SIGMA } from './solveFix';
export { chiSquareQuantile, chiSquareCdf, chiSquareUpperTail, fDistributionUpperTail } from './chiSquare';
export { errorEllipse, errorEllipsoid } from './errorEllipse';
export { crlbCovariance, gdop, type CrlbOptions, type GdopOptions } from './crlb';
export { precisionMap, type PrecisionMapGrid, type PrecisionMapOptions, type PrecisionMapOutput } from './precisionMap';
export { physicalLimitViolations, closureFailures, type LimitViolation, type ClosureFailure } from './delayChecks';
export { closureTest, type ClosureTest } from './delayChecks';
export { apertureMeters } from './aperture';
export { MAX_APERTURE_METERS } from './validateInput';
export { fixVerdict, horizontalHull, insideHull, VERDICT_GRADES, VERDICT_LIMITS, type Verdict, type VerdictGrade, type VerdictInput } from './verdict';
export { seededRandom, type SeededRandom } from './seededRandom';
export { median } from './median';

// Map geometry (another engineer's modules): pair hyperbolae on a map plane and steered-response-power maps.
export * from './hyperbola';
export * from './srpGrid';
export * from './srpMap';
export * from './srpPeak';
export * from './srpRefine';
