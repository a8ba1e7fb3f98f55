import { describe, expect, it } from 'vitest';
import type { PairCorrelationPlot } from '../../../core/overview';
import { pairPlotShape } from '../../../renderer/correlations/pairPlotShape';
import { lagAxisTicks } from '../../../renderer/correlations/lagAxis';
import { formatShortDuration, formatSnrDb } from '../../../renderer/correlations/plotFormat';

const box = { widthPixels: 220, heightPixels: 100, left: 10, right: 10, top: 5, bottom: 15 };

function plot(values: number[], overrides: Partial<PairCorrelationPlot> = {}): PairCorrelationPlot {
  const maxLagFrames = (values.length - 1) / 2;
  return {
    indexA: 0, indexB: 1, labelA: 'M1', labelB: 'M2', sampleRateHz: 1000, values: Float64Array.from(values), maxLagFrames,
    delaySeconds: 0, sigmaSeconds: 0.0005, peakToSecondRatio: 3.4, snrDb: 12.2, used: true, spacingLimitSeconds: 0.002, ...overrides,
  };
}

describe('pairPlotShape()', () => {
  it('puts lag 0 in the middle, the peak at the delay and the d/c band symmetric about 0', () => {
    // lags -5..5 at 1 kHz over 200 inner pixels: 20 px per ms, lag 0 at x = 110
    const values = [0, 0, 0, 0.1, 0.3, 0.2, 0.9, 0.4, 0, 0, 0];
    const shape = pairPlotShape(plot(values, { delaySeconds: 0.0011 }), box);
    expect(shape.xTicks.find((t) => t.label === '0')!.position).toBeCloseTo(110, 9);
    expect(shape.peak.x).toBeCloseTo(110 + 1.1 * 20, 9);
    expect(shape.spacingBand!.x0).toBeCloseTo(110 - 2 * 20, 9);
    expect(shape.spacingBand!.x1).toBeCloseTo(110 + 2 * 20, 9);
    // ±σ = ±0.5 ms = ±10 px
    expect(shape.sigmaBar.x1 - shape.sigmaBar.x0).toBeCloseTo(20, 9);
    // y: top of the range is 1.25 × the largest value; the peak value at lag 1.1 interpolates 0.9 → 0.4
    const top = 0.9 * 1.25;
    const bottom = -0.1 * top;
    const expectedY = 5 + ((top - (0.9 * 0.9 + 0.4 * 0.1)) / (top - bottom)) * 80;
    expect(shape.peak.y).toBeCloseTo(expectedY, 9);
    expect(shape.beyondSpacing).toBe(false);
    expect(shape.xUnit).toBe('ms');
    expect(shape.title).toBe('M1 – M2');
    expect(shape.delayText).toBe('Δt +1.100 ms ± 500 µs');
    expect(shape.qualityText).toBe('peak/2nd 3.4 · SNR 12 dB');
  });

  it('decimates long correlations to the pixel width, keeping the peak height', () => {
    const n = 20_001;
    const values = Array.from({ length: n }, (_, i) => (i === 12_345 ? 1 : 0.01 * Math.sin(i)));
    const shape = pairPlotShape(plot(values, { sampleRateHz: 48_000 }), box);
    const points = shape.curvePath.split(/[ML]/).filter((s) => s.trim() !== '');
    expect(points.length).toBe(2 * 200);
    const ys = points.map((p) => Number(p.trim().split(' ')[1]));
    const top = 1.25;
    const bottom = Math.min(-0.01 * 1.1, -0.1 * top);
    // the single-lag spike still reaches y(1)
    expect(Math.min(...ys)).toBeCloseTo(5 + ((top - 1) / (top - bottom)) * 80, 1);
  });

  it('flags a delay beyond the spacing limit', () => {
    const shape = pairPlotShape(plot([0, 0, 0, 0, 0, 0.2, 0, 0, 0, 0.9, 0.1], { delaySeconds: 0.004, spacingLimitSeconds: 0.003 }), box);
    expect(shape.beyondSpacing).toBe(true);
  });
});

describe('lagAxisTicks() and formatShortDuration()', () => {
  it('labels in µs below a millisecond and in ms above, at 1-2-5 steps', () => {
    const x = (s: number) => s;
    const micro = lagAxisTicks(-0.0004, 0.0004, 220, x);
    expect(micro.unit).toBe('µs');
    // raw step 0.8 ms / 4 = 200 µs (1-2-5, common practice)
    expect(micro.ticks.map((t) => t.label)).toEqual(['−400', '−200', '0', '200', '400']);
    const milli = lagAxisTicks(-0.012, 0.012, 220, x);
    expect(milli.unit).toBe('ms');
    expect(milli.ticks.map((t) => t.label)).toEqual(['−10', '0', '10']);
    // labels that would cross the plot's edges are left out
    const edged = lagAxisTicks(-0.0004, 0.0004, 220, (s) => 110 + s * 250_000, { leftPixels: 0, rightPixels: 220 });
    expect(edged.ticks.map((t) => t.label)).toEqual(['−200', '0', '200']);
    expect(formatShortDuration(4.2e-6)).toBe('4.2 µs');
    expect(formatShortDuration(-0.00073125, true)).toBe('−731 µs');
    expect(formatShortDuration(0.00125, true)).toBe('+1.250 ms');
    expect(formatShortDuration(1.34e-7)).toBe('0.13 µs');
    expect(formatSnrDb(-7.4)).toBe('−7 dB');
    expect(formatSnrDb(-60)).toBe('≤ −60 dB');
  });
});
