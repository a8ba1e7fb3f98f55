// Public face of renderer/recording: the recording view and the pure pieces it is drawn from.
export { RecordingView, type RecordingViewProps } from './RecordingView';
export { useWidthCss } from './useWidthCss';
export type { RecordingEvent, EventMark } from './eventMarks';
export { eventMarks, eventAt, eventTone } from './eventMarks';
export { timeScale, zoomSpan, panSpan, clampSpan, spanAround, type TimeScale, type ViewSpan } from './timeScale';
export { timeTicks, formatOffset, formatWallClock, formatSpan, timeLabelStyle, type TimeTick, type TimeLabelStyle } from './timeTicks';
export { frequencyTicks, type FrequencyTick } from './frequencyTicks';
export { niceStep125, niceTimeStep, ticksWithin } from './niceSteps';
export { spectrogramPixels, defaultLevelRange, colourTable, spectrogramColourStops, type LevelRange, type SpectrogramPixels } from './spectrogramImage';
export type { EnvelopePyramid, Spectrogram } from '../../core/overview';
