// The user's documents: the microphone array and tables of measured delays.
export type { ArrayGeometry, ArrayMicrophone } from './arrayGeometry';
export { centroidOrigin, DEFAULT_SURVEY_SIGMA_METERS, parseArrayCsv } from './arrayCsv';
export { parseDelaysCsv, type DelayEvent, type DelayRow } from './delaysCsv';
