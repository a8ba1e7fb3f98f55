import { describe, expect, it } from 'vitest';
import { WhenceError } from '../../../core/errors';
import { crlbCovariance, gdop, precisionMap } from '../../../core/locate';
import { makeRng, microphonesAt, randomArray } from '../../helpers/geometry';

describe('precisionMap()', () => {
  // Expected values: crlbCovariance() and gdop() at the same points (self-consistency); no fix on the line of a collinear array is geometry, common practice.
  const mics = microphonesAt(randomArray(makeRng(2024), 8, 3, 60, 10));
  const grid = { eastStartMeters: -150, northStartMeters: 120, eastStepMeters: 7.5, northStepMeters: -6, columns: 40, rows: 30 };

  for (const dims of [2, 3] as const) {
    for (const timingModel of ['independent-pairs', 'arrival-times'] as const) {
      it(`writes sqrt(horizontal CRLB trace) and GDOP at every grid point (${dims}-D, ${timingModel})`, () => {
        const cells = grid.columns * grid.rows;
        const output = { horizontalErrorMeters: new Float64Array(cells), gdop: new Float64Array(cells) };
        const options = { speedMetersPerSecond: 343, timingSigmaSeconds: 4e-5, dimensions: dims, timingModel };
        precisionMap(mics, { ...grid, upMeters: 3 }, options, output);
        const rng = makeRng(dims * 10 + timingModel.length);
        for (let sample = 0; sample < 25; sample++) {
          const row = Math.floor(rng.uniform() * grid.rows);
          const column = Math.floor(rng.uniform() * grid.columns);
          const source = { eastMeters: grid.eastStartMeters + column * grid.eastStepMeters, northMeters: grid.northStartMeters + row * grid.northStepMeters, upMeters: 3 };
          const cov = crlbCovariance(mics, source, options);
          const index = row * grid.columns + column;
          // Definition of the map (the issue): sqrt of the CRLB trace over the horizontal block; GDOP as gdop().
          // (relative 1e-7: the map sums in one pass, the reference centres first)
          const expectedError = Math.sqrt(cov[0][0] + cov[1][1]);
          const expectedGdop = gdop(mics, source, { dimensions: dims, timingModel });
          expect(Math.abs(output.horizontalErrorMeters[index] - expectedError)).toBeLessThan(1e-7 * expectedError);
          expect(Math.abs(output.gdop[index] - expectedGdop)).toBeLessThan(1e-7 * expectedGdop);
        }
      });
    }
  }

  it('writes Infinity where no fix is possible (on the line of a collinear array) and defaults the plane to the mean height', () => {
    const line = microphonesAt([[0, 0, 2], [10, 0, 2], [25, 0, 2]]);
    const output = { horizontalErrorMeters: new Float64Array(3), gdop: new Float64Array(3) };
    precisionMap(line, { eastStartMeters: 40, northStartMeters: 0, eastStepMeters: 1, northStepMeters: 1, columns: 1, rows: 3 }, { speedMetersPerSecond: 343, timingSigmaSeconds: 1e-4, dimensions: 2 }, output);
    expect(output.horizontalErrorMeters[0]).toBe(Infinity);
    expect(output.gdop[0]).toBe(Infinity);
    expect(Number.isFinite(output.horizontalErrorMeters[1])).toBe(true);
  });

  it('refuses output arrays that are too short and non-finite grids with a WhenceError', () => {
    const small = { horizontalErrorMeters: new Float64Array(10), gdop: new Float64Array(10) };
    expect(() => precisionMap(mics, grid, { speedMetersPerSecond: 343, timingSigmaSeconds: 1e-4, dimensions: 2 }, small)).toThrow(WhenceError);
    const big = { horizontalErrorMeters: new Float64Array(1200), gdop: new Float64Array(1200) };
    expect(() => precisionMap(mics, { ...grid, eastStepMeters: Number.NaN }, { speedMetersPerSecond: 343, timingSigmaSeconds: 1e-4, dimensions: 2 }, big)).toThrow(/eastStepMeters/);
    expect(() => precisionMap(mics, grid, { speedMetersPerSecond: 343, timingSigmaSeconds: 0, dimensions: 2 }, big)).toThrow(/timingSigmaSeconds/);
  });
});
