// Public face of core/overview: streaming computations for display (envelope pyramid, spectrogram, correlation plots).
// Frames and seconds in, plain data out (transferable from a worker); pixels stay in renderer/.
export {
  createEnvelopeBuilder,
  chooseEnvelopeBucketFrames,
  envelopeLevelCounts,
  envelopeSizeBytes,
  pyramidSizeBytes,
  defaultEnvelopeBudgetBytes,
  smallestEnvelopeBucketFrames,
  type EnvelopeBuilder,
  type EnvelopeLevel,
  type EnvelopeOptions,
  type EnvelopePyramid,
} from './envelope';
export { envelopeColumns, envelopeLevelFor, envelopePeak } from './envelopeColumns';
export { envelopeFromFrames, envelopeFromSource, type EnvelopePassOptions } from './envelopeFromSource';
export { sourceFrames, type OverviewFrames } from './overviewFrames';
export { envelopePreviewFromFrames, envelopePreviewFromSource, envelopePreviewWorthwhile, type EnvelopePreviewOptions } from './envelopePreview';
export { detailEnvelope, type DetailEnvelope } from './detailEnvelope';
export {
  planSpectrogram,
  columnFrameRange,
  createSpectrogramBuilder,
  computeSpectrogram,
  spectrogramLevelAt,
  spectrogramFloorDb,
  type Spectrogram,
  type SpectrogramBuilder,
  type SpectrogramPlan,
  type SpectrogramRequest,
} from './spectrogram';
export { spectrogramFromFrames, spectrogramFromSource, type SpectrogramPassOptions } from './spectrogramFromSource';
export {
  correlationPlots,
  expectedDelaySigmaSeconds,
  plotRangeFactor,
  type ChannelAutocorrelationPlot,
  type CorrelationPlotOptions,
  type CorrelationPlots,
  type MicrophonePosition,
  type PairCorrelationPlot,
} from './correlationPlots';
export { alignCorrelationPlots } from './alignCorrelationPlots';
