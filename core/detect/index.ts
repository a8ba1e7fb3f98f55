// Public face of core/detect: one streaming pass over a recording finds events that several channels hear within the
// array's largest delay, each with a window for correlation; manual windows; the correlation band of an event.
// Times in seconds from the start of the recording, frequencies in Hz, levels in dB.
export { createDetector } from './detector';
export { useBandEnergyKernels, type BandEnergyGroup, type BandEnergyKernels } from './bandEnergy';
export { manualEvent } from './manualEvent';
export { chooseBand, type ChooseBandOptions, type ChosenBand } from './chooseBand';
export { defaultDetectionBand } from './config';
export type { DetectedEvent, DetectionBand, DetectorConfig, EventFlag, StreamingDetector } from './types';
