// The user's documents: the microphone array and tables of measured delays.
export { MAX_MICROPHONES, type ArrayGeometry, type ArrayMicrophone } from './arrayGeometry';
export { arrayExtentProblems, MAX_ORIGIN_DISTANCE_METERS, ORIGIN_HEIGHT_RANGE_METERS } from './arrayExtent';
export { centroidOrigin, DEFAULT_SURVEY_SIGMA_METERS, parseArrayCsv } from './arrayCsv';
export { parseDelaysCsv, type DelayEvent, type DelayRow } from './delaysCsv';
export {
  emptyProjectDocument,
  firstIssueText,
  formatFieldPath,
  parseProjectDocument,
  projectDocumentSchema,
  readProjectText,
  serializeProjectDocument,
  UNKNOWN_TEMPERATURE_SIGMA_KELVIN,
  validateProjectDocument,
  type FixLogEntry,
  type FixQuality,
  type MapView,
  type ProjectArray,
  type ProjectDocument,
  type ProjectMedium,
  type ProjectSettings,
  type ReadProjectResult,
  type RecordingIdentity,
  type RecordingReference,
} from './document';
export {
  checkMigrationRegistry,
  CURRENT_PROJECT_SCHEMA_VERSION,
  migrateProjectData,
  PROJECT_MIGRATION_REGISTRY,
  PROJECT_MIGRATIONS,
  readSchemaVersion,
  UNKNOWN_RECORDING_NAME,
  type MigrationRegistry,
  type MigrationResult,
  type ProjectData,
  type ProjectMigration,
} from './migrations';
export { sameRecording } from './recordingIdentity';
export { SITE_PICTURE_LIMITS, sitePictureSchema, type SitePicture } from './sitePicture';
export { FIX_STATUSES, PROJECT_LIMITS, projectDocumentSchemaV2, projectDocumentSchemaV3 } from './schema';
