// Planning map of an array before deployment: per grid point, the expected 1-sigma horizontal error (m),
// sqrt of the horizontal block's trace of the CRLB, and the GDOP (unitless), into caller-owned Float64Arrays.
// Closed-form 2x2/3x3 inverses of the Fisher information; no allocation per grid point.
import { WhenceError } from '../errors';
import type { Microphone, TimingModel } from './types';

export interface PrecisionMapGrid {
  /** Coordinates of grid point (column 0, row 0), metres. */
  eastStartMeters: number;
  northStartMeters: number;
  /** Spacing between grid points, metres (may be negative, e.g. north decreasing down an image). */
  eastStepMeters: number;
  northStepMeters: number;
  columns: number;
  rows: number;
  /** Height of the map plane (2-D: the source height); default the microphones' mean height. */
  upMeters?: number;
}

export interface PrecisionMapOptions {
  speedMetersPerSecond: number;
  /** Per delay (`independent-pairs`, every pair measured) or per microphone arrival (`arrival-times`), seconds. */
  timingSigmaSeconds: number;
  dimensions: 2 | 3;
  /** Default `independent-pairs`, as in solveFix. */
  timingModel?: TimingModel;
}

export interface PrecisionMapOutput {
  /** Length >= rows * columns; index row * columns + column. Infinity where no fix is possible. */
  horizontalErrorMeters: Float64Array;
  gdop: Float64Array;
}

function fail(message: string): never {
  throw new WhenceError('locate-invalid-input', message);
}

/** Fills `output` for every grid point; throws `locate-invalid-input` for unusable arguments. */
export function precisionMap(microphones: readonly Microphone[], grid: PrecisionMapGrid, options: PrecisionMapOptions, output: PrecisionMapOutput): void {
  const count = microphones.length;
  if (count < 2) fail('precisionMap: give at least two microphones.');
  const east = new Float64Array(count);
  const north = new Float64Array(count);
  const up = new Float64Array(count);
  let meanUp = 0;
  microphones.forEach((mic, i) => {
    for (const key of ['eastMeters', 'northMeters', 'upMeters'] as const) {
      if (!Number.isFinite(mic[key])) fail(`precisionMap: microphones[${i}].${key} is ${mic[key]}; give a finite coordinate in metres.`);
    }
    east[i] = mic.eastMeters;
    north[i] = mic.northMeters;
    up[i] = mic.upMeters;
    meanUp += mic.upMeters / count;
  });
  const { columns, rows } = grid;
  if (!Number.isInteger(columns) || !Number.isInteger(rows) || columns < 1 || rows < 1) fail(`precisionMap: columns and rows must be whole numbers of at least 1, got ${columns} x ${rows}.`);
  for (const key of ['eastStartMeters', 'northStartMeters', 'eastStepMeters', 'northStepMeters'] as const) {
    if (!Number.isFinite(grid[key])) fail(`precisionMap: grid.${key} is ${grid[key]}; give a finite number of metres.`);
  }
  if (grid.upMeters !== undefined && !Number.isFinite(grid.upMeters)) fail(`precisionMap: grid.upMeters is ${grid.upMeters}; give a finite height in metres.`);
  if (!(options.speedMetersPerSecond > 0) || !Number.isFinite(options.speedMetersPerSecond)) fail(`precisionMap: speedMetersPerSecond is ${options.speedMetersPerSecond}; give a positive speed in m/s.`);
  if (!(options.timingSigmaSeconds > 0) || !Number.isFinite(options.timingSigmaSeconds)) fail(`precisionMap: timingSigmaSeconds is ${options.timingSigmaSeconds}; give a positive sigma in seconds.`);
  if (options.dimensions !== 2 && options.dimensions !== 3) fail(`precisionMap: dimensions is ${options.dimensions}; choose 2 or 3.`);
  const cells = columns * rows;
  if (output.horizontalErrorMeters.length < cells || output.gdop.length < cells) {
    fail(`precisionMap: the output arrays need at least ${cells} elements (${columns} x ${rows}); allocate them with that length.`);
  }
  const threeD = options.dimensions === 3;
  // Every pair with independent errors: sum over pairs of (g_a - g_b)(g_a - g_b)^T = N sum_i (g_i - mean)(g_i - mean)^T.
  const pairFactor = (options.timingModel ?? 'independent-pairs') === 'independent-pairs' ? count : 1;
  const rangeSigma = options.speedMetersPerSecond * options.timingSigmaSeconds;
  const planeUp = grid.upMeters ?? meanUp;
  const { horizontalErrorMeters, gdop } = output;
  for (let row = 0; row < rows; row++) {
    const pn = grid.northStartMeters + row * grid.northStepMeters;
    for (let column = 0; column < columns; column++) {
      const pe = grid.eastStartMeters + column * grid.eastStepMeters;
      let se = 0, sn = 0, su = 0;
      let see = 0, sen = 0, seu = 0, snn = 0, snu = 0, suu = 0;
      for (let i = 0; i < count; i++) {
        const de = pe - east[i];
        const dn = pn - north[i];
        const du = planeUp - up[i];
        const d = Math.sqrt(de * de + dn * dn + du * du);
        if (d === 0) continue;
        const ue = de / d, un = dn / d, uu = du / d;
        se += ue; sn += un; su += uu;
        see += ue * ue; sen += ue * un; seu += ue * uu; snn += un * un; snu += un * uu; suu += uu * uu;
      }
      // Centred scatter of the unit vectors, times the pair factor: the unit-noise Fisher information.
      const f00 = pairFactor * (see - (se * se) / count);
      const f01 = pairFactor * (sen - (se * sn) / count);
      const f11 = pairFactor * (snn - (sn * sn) / count);
      let horizontal: number;
      let total: number;
      if (!threeD) {
        const det = f00 * f11 - f01 * f01;
        const trace = f00 + f11;
        if (!(det > 1e-14 * trace * trace)) {
          horizontalErrorMeters[row * columns + column] = Infinity;
          gdop[row * columns + column] = Infinity;
          continue;
        }
        horizontal = trace / det;
        total = horizontal;
      } else {
        const f02 = pairFactor * (seu - (se * su) / count);
        const f12 = pairFactor * (snu - (sn * su) / count);
        const f22 = pairFactor * (suu - (su * su) / count);
        const c00 = f11 * f22 - f12 * f12;
        const c11 = f00 * f22 - f02 * f02;
        const c22 = f00 * f11 - f01 * f01;
        const det = f00 * c00 + f01 * (f12 * f02 - f01 * f22) + f02 * (f01 * f12 - f11 * f02);
        const trace = f00 + f11 + f22;
        if (!(det > 1e-14 * trace * trace * trace)) {
          horizontalErrorMeters[row * columns + column] = Infinity;
          gdop[row * columns + column] = Infinity;
          continue;
        }
        horizontal = (c00 + c11) / det;
        total = horizontal + c22 / det;
      }
      horizontalErrorMeters[row * columns + column] = rangeSigma * Math.sqrt(horizontal);
      gdop[row * columns + column] = Math.sqrt(total);
    }
  }
}
