import { describe, expect, it } from 'vitest';
import type { ChannelAutocorrelationPlot } from '../../../core/overview';
import { autocorrelationShape } from '../../../renderer/correlations/autocorrelationShape';

const box = { widthPixels: 220, heightPixels: 100, left: 10, right: 10, top: 5, bottom: 15 };

describe('autocorrelationShape()', () => {
  it('marks half the half-maximum width (positive lags only) and states the expected precision', () => {
    // lags 0..40 at 48 kHz over 200 px: 5 px per lag; half-max width 4 lags = 83.3 µs -> marker at lag 2, x = 10 + 10
    const values = Float64Array.from({ length: 41 }, (_, k) => Math.max(0, 1 - k / 4) ** 1);
    const plot: ChannelAutocorrelationPlot = {
      label: 'M3', sampleRateHz: 48_000, values, halfMaxWidthSeconds: 4 / 48_000, firstZeroSeconds: 4 / 48_000, timingPrecisionSeconds: 0.134e-6,
      lobeScaleSeconds: 26.048e-6, snrDb: 12.3,
    };
    const shape = autocorrelationShape(plot, box);
    expect(shape.halfWidthX).toBeCloseTo(20, 9);
    expect(shape.firstZeroX).toBeCloseTo(30, 9);
    // y maps 1.05 to the top and -1.05 to the bottom: 0.5 sits at 5 + (0.55 / 2.1)·80
    expect(shape.halfY).toBeCloseTo(5 + (0.55 / 2.1) * 80, 9);
    expect(shape.widthText).toBe('half-max width 83 µs');
    expect(shape.precisionText).toBe('expected timing precision ≈ 0.13 µs');
    expect(shape.basisText).toBe('at 12 dB SNR · lobe 1/(2πf_rms) 26 µs');
    expect(shape.xUnit).toBe('µs');
  });

  it('says so when a channel is silent in the band', () => {
    const plot: ChannelAutocorrelationPlot = { label: 'dead', sampleRateHz: 48_000, values: new Float64Array(17), halfMaxWidthSeconds: null, firstZeroSeconds: null, timingPrecisionSeconds: null };
    const shape = autocorrelationShape(plot, box);
    expect(shape.halfWidthX).toBeUndefined();
    expect(shape.precisionText).toBe('silent in the band: no timing');
    // a hopeless channel says so rather than printing hundreds of milliseconds
    const noisy = autocorrelationShape({ ...plot, halfMaxWidthSeconds: 5e-5, lobeScaleSeconds: 2.7e-5, snrDb: -60, timingPrecisionSeconds: 0.23 }, box);
    expect(noisy.precisionText).toBe('expected timing precision: worse than 1 ms');
    expect(noisy.basisText).toBe('at ≤ −60 dB SNR · lobe 1/(2πf_rms) 27 µs');
  });
});
