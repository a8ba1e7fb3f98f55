// Reads a shared-sound table: sounds every recorder heard, at unknown places, `time[,label]`; time (rough) as a local
// ISO 8601 time or seconds from the deployment's earliest start.
import type { LocalInstant } from './localTime';
import { readRoughSoundRows } from './roughSoundRows';

export interface SharedSound {
  label: string;
  lineNumber: number;
  /** Rough time of the sound, seconds from the deployment's origin. */
  roughSeconds: number;
}

export function parseSharedSoundsCsv(text: string, fileName: string, origin: LocalInstant): SharedSound[] {
  const { rows } = readRoughSoundRows(text, fileName, origin, {
    requiredColumns: ['time'], requiredWhy: 'each shared sound needs its rough time',
    soundWords: 'shared sound', noRows: 'Add one row per sound that every recorder heard.', labelPrefix: 'S',
  });
  return rows.map(({ row, label, roughSeconds }) => ({ label, lineNumber: row.lineNumber, roughSeconds }));
}
