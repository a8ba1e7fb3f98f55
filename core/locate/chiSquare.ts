// Chi-square distribution: CDF, upper tail (p-value) and quantile (unitless), and the F upper tail for outlier tests.
// Quantile: Wilson & Hilferty (1931) start, then safeguarded Newton on the regularised incomplete gamma function.
import { WhenceError } from '../errors';
import { regularizedBeta, regularizedGammaP, regularizedGammaQ, logGamma } from './specialFunctions';

/** P(X <= x) for X ~ chi-square with `degreesOfFreedom`. */
export function chiSquareCdf(x: number, degreesOfFreedom: number): number {
  return regularizedGammaP(degreesOfFreedom / 2, x / 2);
}

/** P(X > x) for X ~ chi-square with `degreesOfFreedom` (the p-value of a statistic x); 1 when dof is 0. */
export function chiSquareUpperTail(x: number, degreesOfFreedom: number): number {
  if (degreesOfFreedom <= 0) return 1;
  return regularizedGammaQ(degreesOfFreedom / 2, x / 2);
}

/** P(F > f) for F ~ F(d1, d2). */
export function fDistributionUpperTail(f: number, d1: number, d2: number): number {
  if (!(f > 0)) return 1;
  return regularizedBeta(d2 / (d2 + d1 * f), d2 / 2, d1 / 2);
}

/** Standard normal quantile, Acklam's rational approximation (relative error below 1.2e-9): a start value only. */
function normalQuantileApprox(p: number): number {
  const a = [-3.969683028665376e1, 2.209460984245205e2, -2.759285104469687e2, 1.38357751867269e2, -3.066479806614716e1, 2.506628277459239];
  const b = [-5.447609879822406e1, 1.615858368580409e2, -1.556989798598866e2, 6.680131188771972e1, -1.328068155288572e1];
  const c = [-7.784894002430293e-3, -3.223964580411365e-1, -2.400758277161838, -2.549732539343734, 4.374664141464968, 2.938163982698783];
  const d = [7.784695709041462e-3, 3.224671290700398e-1, 2.445134137142996, 3.754408661907416];
  const low = 0.02425;
  if (p < low) {
    const q = Math.sqrt(-2 * Math.log(p));
    return (((((c[0] * q + c[1]) * q + c[2]) * q + c[3]) * q + c[4]) * q + c[5]) / ((((d[0] * q + d[1]) * q + d[2]) * q + d[3]) * q + 1);
  }
  if (p > 1 - low) return -normalQuantileApprox(1 - p);
  const q = p - 0.5;
  const r = q * q;
  return ((((((a[0] * r + a[1]) * r + a[2]) * r + a[3]) * r + a[4]) * r + a[5]) * q) / (((((b[0] * r + b[1]) * r + b[2]) * r + b[3]) * r + b[4]) * r + 1);
}

/**
 * x such that P(X <= x) = probability for X ~ chi-square with `degreesOfFreedom` (> 0, need not be an integer).
 * Throws `locate-invalid-probability` unless 0 <= probability < 1 (1 would be infinite).
 */
export function chiSquareQuantile(probability: number, degreesOfFreedom: number): number {
  if (!(probability >= 0 && probability < 1)) {
    throw new WhenceError('locate-invalid-probability', `chiSquareQuantile: probability must be in [0, 1), got ${probability}. Pass e.g. 0.95 for 95 %.`);
  }
  if (!(degreesOfFreedom > 0) || !Number.isFinite(degreesOfFreedom)) {
    throw new WhenceError('locate-invalid-probability', `chiSquareQuantile: degrees of freedom must be a positive number, got ${degreesOfFreedom}.`);
  }
  if (probability === 0) return 0;
  const k = degreesOfFreedom;
  const a = k / 2;
  const upper = 1 - probability;
  const useUpper = probability > 0.5;
  // Wilson-Hilferty start.
  const z = normalQuantileApprox(probability);
  const h = 2 / (9 * k);
  let x = k * Math.pow(Math.max(1 - h + z * Math.sqrt(h), 0.01), 3);
  if (!(x > 0) || !Number.isFinite(x)) x = k;
  // Bracket [low, high] around the root, then Newton steps that fall back to bisection outside the bracket.
  let low = 0;
  let high = Math.max(x, 1);
  while (regularizedGammaP(a, high / 2) < probability) high *= 2;
  const logNormaliser = a * Math.log(2) + logGamma(a);
  for (let iteration = 0; iteration < 200; iteration++) {
    const error = useUpper ? upper - regularizedGammaQ(a, x / 2) : regularizedGammaP(a, x / 2) - probability;
    if (error === 0) return x;
    if (error < 0) low = x;
    else high = x;
    const density = Math.exp((a - 1) * Math.log(x) - x / 2 - logNormaliser);
    let next = x - error / density;
    if (!(next > low && next < high) || !Number.isFinite(next)) next = 0.5 * (low + high);
    if (Math.abs(next - x) <= 1e-15 * x || high - low <= 1e-15 * high) return next;
    x = next;
  }
  return x;
}
