// Exports of located fixes: flat records and their CSV, JSON and GeoJSON text.
export { FIX_COLUMNS_2D, FIX_COLUMNS_3D, fixRecord, roundDecimals, roundSignificant, type FixRecord, type FixRecordValue } from './fixRecord';
export { ellipseRing, ellipseRingProblem, fixesToCsv, fixesToGeoJson, fixesToJson, type EllipseOutline, type GeoJsonExtras } from './writers';
export { locatedEventRecord, surveyLogColumns, surveyLogCsv, surveyLogJson, surveyLogMetadata, surveyLogRunNotes, type SurveyLogContext } from './surveyLog';
export { CLOCKS_NOT_FITTED_NOTE, deploymentHeadNotes } from './deploymentHeadNotes';
