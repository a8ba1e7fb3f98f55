// Public face of renderer/microphones: the microphone table panel and its pure parts (rows, checks, array table text).
// Units: local east/north/up metres about a WGS84 origin; latitude and longitude in degrees.
export { MicrophonesPanel, type ArrayImportText, type MicrophonesPanelProps } from './MicrophonesPanel';
export { blankRow, fieldsOf, formatDegrees, formatMetres, isBlankRow, rowsFromMicrophones, setRowPosition, POSITION_FIELDS, type MicrophoneField, type MicrophoneRowText, type PositionMode } from './arrayRows';
export { lineFit, parseNumberText, validateArray, COLLINEAR_FRACTION, SAME_POSITION_METERS, type ArrayFrame, type ArrayMessage, type ArrayValidation, type MessageSeverity, type RowCheck } from './validateArray';
export { arrayCsvText, importArrayText, GEODETIC_ARRAY_COLUMNS, LOCAL_ARRAY_COLUMNS, type ArrayImport } from './arrayCsvText';
export { originTextFrom, parseOriginText, BLANK_ORIGIN_TEXT, type OriginField, type OriginParse, type OriginText } from './originText';
