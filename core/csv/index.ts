// Comma-separated tables: reading with line numbers and clear errors, writing with safe quoting.
export { CsvError, type CsvLocation } from './csvError';
export { readCsv, type CsvRow, type CsvTable } from './readCsv';
export { cellNumber, cellText, hasColumn, requireColumns } from './columns';
export { formatCsv, formatCsvCell, formatCsvCommentLine, isNumericText, type CsvCommentLine, type CsvValue } from './writeCsv';
