// Public types of the TDOA solver: microphones, pair delays, options and the fix with its uncertainty.
// Positions in local east/north/up metres, times in seconds, covariances in square metres.
// A delay of pair (a, b) is the arrival time at a minus the arrival time at b: (|s - m_a| - |s - m_b|) / c.

export interface Microphone {
  label: string;
  eastMeters: number;
  northMeters: number;
  upMeters: number;
  /** One-sigma survey error of each coordinate (east, north and up), metres. Default 0. */
  surveySigmaMeters?: number;
}

/** Indices into the microphone list; arrival at A minus arrival at B. */
export interface DelayMeasurement {
  indexA: number;
  indexB: number;
  delaySeconds: number;
  sigmaSeconds?: number;
}

/**
 * `ok`: consistent delays (closure and chi-square pass at the test level) and a determined geometry. `inconsistent`: a
 * position exists but the delays contradict each other beyond their sigmas. The others say what else is wrong.
 */
export type FixStatus = 'ok' | 'ambiguous' | 'ill-conditioned' | 'inconsistent' | 'insufficient' | 'invalid-input';

/**
 * How the delay errors are correlated.
 * - `independent-pairs` (default): every delay has its own independent error (sigmaSeconds per delay). This is
 *   the usual assumption for delays measured pair by pair with GCC; it ignores the correlation of pairs sharing a channel.
 * - `arrival-times`: every delay is a difference of arrival times picked per microphone with independent errors of
 *   one common sigma; delays against one reference then have covariance sigma^2 (I + 11^T). A delay's sigmaSeconds
 *   is the sigma of the difference, i.e. sqrt(2) times the per-microphone sigma.
 */
export type TimingModel = 'independent-pairs' | 'arrival-times';

export interface SolveOptions {
  speedMetersPerSecond: number;
  /** Default 0. E.g. a temperature sigma times core/medium's sensitivity (m/s per K). */
  speedSigmaMetersPerSecond?: number;
  dimensions: 2 | 3;
  /** 2-D only: the known source height; default the microphones' mean height. */
  sourceUpMeters?: number;
  /** 2-D only: one-sigma uncertainty of that height, propagated into the budget. Default 0. */
  sourceUpSigmaMeters?: number;
  /** Confidence of the ellipse and ellipsoid; default 0.95. */
  confidence?: number;
  /**
   * Timing sigma used when no delay states one and fewer than 3 delays are redundant (per delay, or per arrival in the
   * `arrival-times` model); default 1e-4 s.
   */
  defaultTimingSigmaSeconds?: number;
  /** Drop delays beyond the physical limit and outlier pairs; default true. */
  rejectOutliers?: boolean;
  /** Added to d/c for the physical-limit check; default three times the delay's sigma. */
  lagToleranceSeconds?: number;
  /** Per microphone, when known (absolute clock): gives the emission time. */
  arrivalTimesSeconds?: ReadonlyArray<number | undefined>;
  /** Seeded Monte Carlo of the whole budget (timing, speed, survey, source height). */
  monteCarlo?: { trials: number; seed: number };
  /** Default `independent-pairs`. */
  timingModel?: TimingModel;
  /** Significance level of the residual tests (chi-square, outlier tests); default 0.01. */
  residualTestLevel?: number;
  /** Condition number of the normal matrix above which a fix is `ill-conditioned`; default 1e6 (about a source 250 apertures away in 2-D; the ellipse then spans the range). */
  conditionNumberLimit?: number;
}

export interface ErrorEllipse {
  semiMajorMeters: number;
  semiMinorMeters: number;
  /** Counter-clockwise from +x (east), in [0, 180). */
  majorAxisDegreesFromEast: number;
  confidence: number;
}

export interface ErrorEllipsoid {
  /** Largest first. */
  semiAxesMeters: [number, number, number];
  /** Unit vectors (east, north, up) of the axes, in the order of semiAxesMeters. */
  axes: [number, number, number][];
  confidence: number;
}

export interface PairResidual {
  indexA: number;
  indexB: number;
  /** Measured minus modelled delay at the fix. */
  residualSeconds: number;
  used: boolean;
  reason?: string;
}

export interface UncertaintyBudget {
  timingMeters2: number[][];
  speedMeters2: number[][];
  surveyMeters2: number[][];
  /** 2-D only (zero in 3-D): the assumed source height's sigma. */
  sourceHeightMeters2: number[][];
}

export interface Position {
  eastMeters: number;
  northMeters: number;
  upMeters: number;
}

export interface Fix {
  eastMeters: number;
  northMeters: number;
  upMeters: number;
  /** Total of the budget: 2x2 (east, north) in 2-D, 3x3 (east, north, up) in 3-D. */
  covarianceMeters2: number[][];
  /** Horizontal (east/north) ellipse at `confidence`. */
  ellipse: ErrorEllipse;
  ellipsoid?: ErrorEllipsoid;
  residuals: PairResidual[];
  residualRmsSeconds: number;
  chiSquare: { statistic: number; degreesOfFreedom: number; pValue: number; consistent: boolean };
  /** Position error per metre of range error: sqrt(trace(timing covariance)) / (c * timingSigmaSeconds). */
  gdop: number;
  /** Timing-only bound (J^T W J)^-1 at the estimate. */
  crlbCovarianceMeters2: number[][];
  sigmaSource: 'stated' | 'residuals' | 'default';
  /** Per delay (independent-pairs) or per microphone arrival (arrival-times). */
  timingSigmaSeconds: number;
  pairsUsed: number;
  droppedPairs: PairResidual[];
  /** Arrival-time model: microphones whose arrival time was dropped as an outlier. */
  droppedArrivals?: number[];
  budget: UncertaintyBudget;
  monteCarloCovarianceMeters2?: number[][];
  emissionTimeSeconds?: number;
  /** Condition number of the normal matrix J^T W J. */
  conditionNumber: number;
  /** Mirror or second solution when ambiguous. */
  alternative?: Position;
}

export interface SolveResult {
  status: FixStatus;
  fix?: Fix;
  warnings: string[];
}
