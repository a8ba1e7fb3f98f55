// Reads a calibration table: sounds made on purpose at surveyed points, `time,x_m,y_m,z_m[,emitted_at][,label][,sigma_m]`;
// time (rough) and emitted_at (exact emission) as local ISO 8601 times or seconds from the deployment's earliest start.
import { cellNumber, cellText, CsvError, hasColumn } from '../csv';
import { printableText } from '../text';
import type { LocalInstant } from './localTime';
import { deploymentSeconds, readRoughSoundRows } from './roughSoundRows';

export interface CalibrationSound {
  label: string;
  lineNumber: number;
  /** Rough time of the sound, seconds from the deployment's origin. */
  roughSeconds: number;
  eastMeters: number;
  northMeters: number;
  upMeters: number;
  /** One-sigma of the sound's surveyed position, metres (default 0). */
  sigmaMeters: number;
  /** Exact emission time when known, seconds from the origin. */
  emittedSeconds?: number;
}

export function parseCalibrationCsv(text: string, fileName: string, origin: LocalInstant): CalibrationSound[] {
  const { table, rows } = readRoughSoundRows(text, fileName, origin, {
    requiredColumns: ['time', 'x_m', 'y_m'], requiredWhy: 'each calibration sound needs its rough time and surveyed position',
    soundWords: 'calibration sound', noRows: 'Add one row per calibration sound.', labelPrefix: 'C',
  });
  return rows.map(({ row, label, roughSeconds }) => {
    const where = (columnName: string) => ({ fileName, lineNumber: row.lineNumber, columnName });
    const sigmaMeters = cellNumber(table, row, 'sigma_m', 'metres', true) ?? 0;
    if (!(sigmaMeters >= 0)) throw new CsvError(where('sigma_m'), `a position sigma cannot be negative; got ${sigmaMeters}.`);
    const sound: CalibrationSound = {
      label, lineNumber: row.lineNumber, roughSeconds,
      eastMeters: cellNumber(table, row, 'x_m', 'metres east'), northMeters: cellNumber(table, row, 'y_m', 'metres north'), upMeters: cellNumber(table, row, 'z_m', 'metres up', true) ?? 0,
      sigmaMeters,
    };
    const emittedText = hasColumn(table, 'emitted_at') ? cellText(table, row, 'emitted_at') : '';
    if (emittedText !== '') {
      const emitted = deploymentSeconds(emittedText, origin);
      if (emitted === undefined) throw new CsvError(where('emitted_at'), `'${printableText(emittedText, 60)}' is not a time; give the exact emission time (YYYY-MM-DDTHH:MM:SS.ffffff, on the time base every recorder is fitted to) or leave it empty.`);
      sound.emittedSeconds = emitted;
    }
    return sound;
  });
}
