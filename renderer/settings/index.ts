// Public face of renderer/settings: the settings panel, the speed-of-sound description and the form's pure parts.
// Units: m/s, °C, K, %, kPa, ppm, ppt, m, Hz, dB (as in core/project's schema).
export { SettingsPanel, type SettingsPanelProps } from './SettingsPanel';
export { describeSpeed, GIVEN_SPEED_RANGE_METERS_PER_SECOND, type MediumField, type SpeedDescription } from './describeSpeed';
export {
  formFromValue,
  plainMediumMessage,
  readConfidence,
  readNumber,
  readSettingsForm,
  CONFIDENCE_PRESETS,
  DEFAULT_THRESHOLD_DB,
  THRESHOLD_RANGE_DB,
  type MediumKind,
  type SettingsForm,
  type SettingsReading,
  type SettingsTextField,
  type SettingsValue,
} from './settingsForm';
export { weightingChoice, WEIGHTING_CHOICES, type WeightingChoice } from './weightingHints';
