import { describe, expect, it } from 'vitest';
import { gaussianTable, GAUSSIAN_TABLE_SIZE } from '../../../core/simulate/gaussianTable';

describe('gaussianTable()', () => {
  const table = gaussianTable();

  it('gaussianTable() holds 65536 normal quantiles with zero mean and unit variance', () => {
    expect(table.length).toBe(GAUSSIAN_TABLE_SIZE);
    let sum = 0;
    let squares = 0;
    for (const x of table) {
      sum += x;
      squares += x * x;
    }
    expect(Math.abs(sum / table.length)).toBeLessThan(1e-9);
    expect(squares / table.length).toBeCloseTo(1, 6);
  });

  it('gaussianTable() is sorted and symmetric, its extremes at the 0.5/65536 quantile', () => {
    expect(table.every((x, i) => i === 0 || x > table[i - 1])).toBe(true);
    expect(table.every((x, i) => x === -table[table.length - 1 - i])).toBe(true);
    // norm.ppf(1 - 0.5/65536) = 4.324919, scaled to unit variance 4.324963 (test/reference/simulate_reference.py, computed)
    expect(table[table.length - 1]).toBeCloseTo(4.324963, 4);
  });

  it('gaussianTable() puts 95 % of its entries within +-1.959964', () => {
    // Φ^-1(0.975) = 1.959964 (statistical tables; scipy norm.ppf, computed in test/reference/simulate_reference.py)
    const inside = table.filter((x) => Math.abs(x) < 1.959964).length;
    expect(Math.abs(inside / table.length - 0.95)).toBeLessThan(3 / table.length);
  });
});
