// The slice of one sheet of a TDOA hyperboloid by a horizontal plane: a conic in vertex form and its parameter.
// Units: metres. |p−A| − |p−B| = d (d ≥ 0) in focus-directrix form (B−A)·(p−B) + (D²−d²)/2 = d·|p−B|,
// a concave function of p whose zero set in the plane is a hyperbola branch, ellipse, parabola or line (analytic geometry).

/** A microphone position in local east/north/up metres. */
export interface SlicePosition {
  readonly eastMeters: number;
  readonly northMeters: number;
  readonly upMeters: number;
}

/**
 * The slice in a frame centred on the horizontal foot of focus B with unit axis g along the horizontal part of B − A:
 * u = (q − b)·g, v = (q − b)·g⊥ with g⊥ = (−g_north, g_east). In it, ψ(q) = h·u + κ − d·√(u² + v² + z²).
 */
export interface SliceFrame {
  readonly originEastMeters: number;
  readonly originNorthMeters: number;
  readonly axisEast: number;
  readonly axisNorth: number;
  /** East and north parts of B − A. */
  readonly spanEastMeters: number;
  readonly spanNorthMeters: number;
  /** Horizontal spacing h = |(B − A) horizontal|. */
  readonly horizontalSpacingMeters: number;
  /** Plane height above focus B: z. */
  readonly heightAboveFocusMeters: number;
  /** Range difference d ≥ 0 (the pair is swapped when c·τ < 0 so that the source is nearer B). */
  readonly rangeDifferenceMeters: number;
  /** κ = (D² − d²)/2 + (B_up − A_up)·z, square metres. */
  readonly kappaSquareMeters: number;
}

export type SliceConicKind = 'hyperbola' | 'ellipse' | 'parabola' | 'line' | 'point';

/**
 * The conic in vertex form, parameter t:
 * hyperbola u = u_v + 2α·sinh²(t/2), v = β·sinh t;  ellipse u = u_v + 2α·sin²(t/2), v = β·sin t, t in (−π, π];
 * parabola u = u_v + k·t², v = t;  line u = u_v, v = t;  point u = u_v, v = 0.
 */
export interface SliceConic {
  readonly kind: SliceConicKind;
  readonly vertexUMeters: number;
  readonly alphaMeters: number;
  readonly betaMeters: number;
  /** Parabola only: k = d/(2κ), per metre. */
  readonly parabolaCurvaturePerMeter: number;
}

/** Builds the frame for the pair (a, b) with range difference c·τ (any sign) and the plane at `planeUpMeters`. */
export function sliceFrame(micA: SlicePosition, micB: SlicePosition, rangeDifferenceMeters: number, planeUpMeters: number): SliceFrame {
  const swap = rangeDifferenceMeters < 0;
  const a = swap ? micB : micA;
  const b = swap ? micA : micB;
  const d = Math.abs(rangeDifferenceMeters);
  const spanEast = b.eastMeters - a.eastMeters;
  const spanNorth = b.northMeters - a.northMeters;
  const spanUp = b.upMeters - a.upMeters;
  const h = Math.hypot(spanEast, spanNorth);
  const spacing = Math.hypot(spanEast, spanNorth, spanUp);
  const z = planeUpMeters - b.upMeters;
  return {
    originEastMeters: b.eastMeters,
    originNorthMeters: b.northMeters,
    axisEast: h > 0 ? spanEast / h : 1,
    axisNorth: h > 0 ? spanNorth / h : 0,
    spanEastMeters: spanEast,
    spanNorthMeters: spanNorth,
    horizontalSpacingMeters: h,
    heightAboveFocusMeters: z,
    rangeDifferenceMeters: d,
    kappaSquareMeters: ((spacing - d) * (spacing + d)) / 2 + spanUp * z,
  };
}

/** ψ at a plane point: positive on the side of the curve nearer focus B, zero on it; ψ = f·(|p−A| + |p−B| + d)/2. */
export function slicePsi(frame: SliceFrame, eastMeters: number, northMeters: number): number {
  const x = eastMeters - frame.originEastMeters;
  const y = northMeters - frame.originNorthMeters;
  const z = frame.heightAboveFocusMeters;
  return frame.spanEastMeters * x + frame.spanNorthMeters * y + frame.kappaSquareMeters - frame.rangeDifferenceMeters * Math.sqrt(x * x + y * y + z * z);
}

/**
 * The conic of the slice, or null when the sheet does not meet the plane. Needs d < D and not (h = 0 and d = 0).
 * All quantities are formed from h, d, κ and z without dividing by d, so the forms stay accurate as d → 0 and near h = d.
 */
export function sliceConic(frame: SliceFrame): SliceConic | null {
  const h = frame.horizontalSpacingMeters;
  const d = frame.rangeDifferenceMeters;
  const kappa = frame.kappaSquareMeters;
  const z = frame.heightAboveFocusMeters;
  const dz = d * z;
  if (d === 0) {
    return { kind: 'line', vertexUMeters: -kappa / h, alphaMeters: 0, betaMeters: 1, parabolaCurvaturePerMeter: 0 };
  }
  if (h > d) {
    const eps = (h - d) * (h + d);
    const r = (kappa * kappa) / eps + z * z;
    const beta = Math.sqrt(r);
    const alpha = d * Math.sqrt(r / eps);
    const centreU = (-h * kappa) / eps;
    // u_v = centre + α, written without cancellation when the centre lies on the negative side.
    const denominator = alpha - centreU;
    const vertexU = kappa < 0 ? centreU + alpha : denominator > 0 ? ((dz * dz - kappa * kappa) / eps) / denominator : 0;
    return { kind: 'hyperbola', vertexUMeters: vertexU, alphaMeters: alpha, betaMeters: beta, parabolaCurvaturePerMeter: 0 };
  }
  if (kappa <= 0) return null;
  if (h === d) {
    const vertexU = (dz * dz - kappa * kappa) / (2 * d * kappa);
    return { kind: 'parabola', vertexUMeters: vertexU, alphaMeters: 0, betaMeters: 0, parabolaCurvaturePerMeter: d / (2 * kappa) };
  }
  const eps = (d - h) * (d + h);
  const r = (kappa * kappa) / eps - z * z;
  const centreU = (h * kappa) / eps;
  if (r < 0) return null;
  if (r === 0) return { kind: 'point', vertexUMeters: centreU, alphaMeters: 0, betaMeters: 0, parabolaCurvaturePerMeter: 0 };
  const alpha = d * Math.sqrt(r / eps);
  const vertexU = ((dz * dz - kappa * kappa) / eps) / (centreU + alpha);
  return { kind: 'ellipse', vertexUMeters: vertexU, alphaMeters: alpha, betaMeters: Math.sqrt(r), parabolaCurvaturePerMeter: 0 };
}

/** Writes the point at parameter t as [east, north] metres into `out`. */
export function slicePointAt(frame: SliceFrame, conic: SliceConic, t: number, out: Float64Array): void {
  let u: number;
  let v: number;
  switch (conic.kind) {
    case 'hyperbola': {
      const s = Math.sinh(t / 2);
      u = conic.vertexUMeters + 2 * conic.alphaMeters * s * s;
      v = conic.betaMeters * Math.sinh(t);
      break;
    }
    case 'ellipse': {
      const s = Math.sin(t / 2);
      u = conic.vertexUMeters + 2 * conic.alphaMeters * s * s;
      v = conic.betaMeters * Math.sin(t);
      break;
    }
    case 'parabola':
      u = conic.vertexUMeters + conic.parabolaCurvaturePerMeter * t * t;
      v = t;
      break;
    case 'line':
      u = conic.vertexUMeters;
      v = t;
      break;
    default:
      u = conic.vertexUMeters;
      v = 0;
  }
  out[0] = frame.originEastMeters + u * frame.axisEast - v * frame.axisNorth;
  out[1] = frame.originNorthMeters + u * frame.axisNorth + v * frame.axisEast;
}

/** The parameter t of a point on (or very near) the curve; for an ellipse it lies in (−π, π]. */
export function sliceParameterOf(frame: SliceFrame, conic: SliceConic, eastMeters: number, northMeters: number): number {
  const x = eastMeters - frame.originEastMeters;
  const y = northMeters - frame.originNorthMeters;
  const u = x * frame.axisEast + y * frame.axisNorth;
  const v = -x * frame.axisNorth + y * frame.axisEast;
  switch (conic.kind) {
    case 'hyperbola':
      return Math.asinh(v / conic.betaMeters);
    case 'ellipse':
      return Math.atan2(v / conic.betaMeters, 1 - (u - conic.vertexUMeters) / conic.alphaMeters);
    case 'parabola':
    case 'line':
      return v;
    default:
      return 0;
  }
}
