// The native open and save dialogs behind a small adapter (Electron's dialog in main.ts, a fake in tests),
// and the file filters Whence offers in them.
import { USER_FILE_EXTENSIONS } from './pathPolicy';

export interface FileFilter {
  name: string;
  /** Without the dot, as Electron's dialogs take them. */
  extensions: string[];
}

export interface DialogAdapter {
  /** The chosen file's path, or null when the user cancelled. */
  chooseFileToOpen(options: { title: string; filters: FileFilter[] }): Promise<string | null>;
  /** The chosen path (the dialog asked about overwriting), or null when the user cancelled. */
  chooseFileToSave(options: { title: string; defaultPath: string; filters: FileFilter[] }): Promise<string | null>;
}

const withoutDot = (extensions: readonly string[]): string[] => extensions.filter((extension) => !extension.slice(1).includes('.')).map((extension) => extension.slice(1));
const ALL_FILES: FileFilter = { name: 'All files', extensions: ['*'] };

export const RECORDING_FILTERS: FileFilter[] = [{ name: 'Recordings (WAV, RF64, BWF)', extensions: withoutDot(USER_FILE_EXTENSIONS.recording) }, ALL_FILES];
export const ARRAY_FILTERS: FileFilter[] = [{ name: 'Array tables (CSV)', extensions: withoutDot(USER_FILE_EXTENSIONS.array) }, ALL_FILES];
export const PROJECT_FILTERS: FileFilter[] = [{ name: 'Whence projects', extensions: ['whence'] }];
export const EXPORT_FILTERS: Readonly<Record<'csv' | 'json' | 'geojson', FileFilter[]>> = Object.freeze({
  csv: [{ name: 'CSV table', extensions: ['csv'] }],
  json: [{ name: 'JSON', extensions: ['json'] }],
  geojson: [{ name: 'GeoJSON', extensions: ['geojson'] }],
});

/** A file name safe on every desktop system, made from a user's text (a project name, a suggested export name). */
export function safeFileName(text: string, fallback: string): string {
  const printable = [...text].map((character) => (character.charCodeAt(0) < 32 || '\\/:*?"<>|'.includes(character) ? '-' : character)).join('');
  const cleaned = printable.replace(/^[.\s]+|[.\s]+$/g, '').slice(0, 120);
  return cleaned === '' ? fallback : cleaned;
}
