// The name an export is offered under: the project's name, what it is and the local date, e.g.
// "Quillmere-Pond-dawn-survey-log-2026-12-03.csv". Characters that file systems refuse become "-". Pure.

/** Longest project part of a file name, in characters. */
const MAX_PROJECT_CHARACTERS = 60;

/** The project name made safe for a file name on Windows, macOS and Linux; "whence" when nothing usable is left. */
export function fileNamePart(projectName: string): string {
  const safe = projectName
    .normalize('NFC')
    // eslint-disable-next-line no-control-regex
    .replace(/[\u0000-\u001f\u007f<>:"/\\|?*]+/g, '-')
    .replace(/\s+/g, '-')
    .replace(/-{2,}/g, '-')
    .replace(/^[-.]+|[-.]+$/g, '');
  const cut = Array.from(safe).slice(0, MAX_PROJECT_CHARACTERS).join('').replace(/[-.]+$/g, '');
  return cut === '' ? 'whence' : cut;
}

/** The local calendar date as YYYY-MM-DD. */
export function localDateText(date: Date): string {
  const two = (n: number) => String(n).padStart(2, '0');
  return `${date.getFullYear()}-${two(date.getMonth() + 1)}-${two(date.getDate())}`;
}

/** `what` says which export ("log", "array"); `extension` without its dot. */
export function exportFileName(projectName: string, what: string, extension: string, date: Date): string {
  return `${fileNamePart(projectName)}-${what}-${localDateText(date)}.${extension}`;
}
