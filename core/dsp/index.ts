// Public face of core/dsp: FFT plans, filters, spectra, generalized cross-correlation, peak interpolation, autocorrelation.
// Times in seconds, frequencies in Hz, lags in samples where named so; delays are arrival at A minus arrival at B.
export { getFftPlan, nextPowerOfTwo, isPowerOfTwo, useRealFftKernels, realFftBackendName, type FftPlan, type RealFftKernel, type RealFftKernels } from './fft';
export { pffftKernels, type PffftModule, type PffftKernelOptions } from './pffftKernels';
export { hannWindow } from './window';
export {
  designBiquad,
  designFirstOrder,
  butterworthQs,
  butterworthSections,
  bandPassSections,
  type BiquadCoefficients,
  type BiquadKind,
} from './biquadDesign';
export { createBiquadCascade, biquadResponse, type BiquadCascade } from './biquadCascade';
export { powerSpectrum, type PowerSpectrum } from './powerSpectrum';
export {
  createWelchEstimator,
  welchSpectra,
  magnitudeSquaredCoherence,
  type WelchEstimator,
  type WelchSpectra,
} from './welch';
export { coarserSpectrum } from './coarserSpectrum';
export { bandWeights, checkBand, bandEdgeTaperFraction, type BandWeights, type FrequencyBand } from './band';
export {
  gccWeightings,
  defaultPhatBeta,
  mlCoherenceCeiling,
  smoothWeights,
  weightCrossSpectrum,
  type GccWeighting,
} from './weighting';
export {
  parabolicPeak,
  gaussianPeak,
  bandLimitedCorrelationAt,
  refineBandLimitedPeak,
  type PeakFit,
  type PeakInterpolation,
} from './peakInterpolation';
export { peakToSecondRatio, measurePeak, snrDbFromCorrelation, peakToSecondRatioCeiling, type PeakMeasures } from './gccQuality';
export {
  createGccEngine,
  defaultPeakInterpolation,
  defaultWelchSegmentPoints,
  type GccEngine,
  type GccOptions,
  type PairDelay,
  type PeakSearch,
} from './gccEngine';
export { gccPairDelay } from './gcc';
export { autocorrelation, autocorrelationWidth, type AutocorrelationWidth } from './autocorrelation';
export { circularCrossCorrelation } from './circularCorrelation';
