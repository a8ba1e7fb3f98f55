// Public face of renderer/correlations: the correlations view and its view-models.
export { CorrelationsView, type CorrelationsViewProps, type PairCorrelationPlot, type ChannelAutocorrelationPlot } from './CorrelationsView';
export { pairPlotShape, type PairPlotShape, type PlotBox } from './pairPlotShape';
export { autocorrelationShape, type AutocorrelationShape } from './autocorrelationShape';
export { lagAxisTicks, type AxisTick } from './lagAxis';
export { formatShortDuration, weightingName, formatRatio } from './plotFormat';
