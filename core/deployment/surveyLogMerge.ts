// Joins survey logs of spans of one deployment (or recording) into one: the same recording, array, medium, clock fit and
// settings, or a refusal that names the difference; events in time order, duplicates where spans overlap dropped.
import { formatCsv, readCsv, type CsvValue } from '../csv';
import { WhenceError } from '../errors';
import { printableText } from '../text';

export interface SurveyLogSpan {
  name: string;
  format: 'csv' | 'json';
  /** Head lines (CSV '#' lines without the '# '), or the JSON log object. */
  head: string[];
  meta?: Record<string, unknown>;
  columns: string[];
  fixes: Array<Record<string, unknown>>;
}

/** Two events of overlapping spans within this of each other (first arrival) are one event. */
const SAME_EVENT_SECONDS = 0.01;

/** A cell as written before formatCsv guarded it against spreadsheet formulas (a leading apostrophe). */
function unguarded(text: string): string {
  return text.replace(/^'(?=[=+\-@\t\r])/, '');
}

/** A CSV head's settings line without the span's own from_s and to_s. */
function withoutSpanSettings(line: string): string {
  return line.replace(/,?\s*(from_s|to_s)=[^,]*/g, '');
}

function headLine(line: string): string {
  if (line.startsWith('#,')) return unguarded(readCsv(`x\n${line.slice(2)}`, 'head').rows[0]?.cells.join(',') ?? '');
  return line.replace(/^#\s?/, '');
}

export function parseSurveyLog(text: string, name: string): SurveyLogSpan {
  const trimmed = text.trimStart();
  if (trimmed.startsWith('{')) {
    let parsed: { log?: Record<string, unknown>; fixes?: Array<Record<string, unknown>> };
    try { parsed = JSON.parse(trimmed) as typeof parsed; } catch { throw new WhenceError('bad-survey-log', `${printableText(name, 120)} is not valid JSON; give the survey logs 'whence locate' wrote.`); }
    if (parsed.log === undefined || !Array.isArray(parsed.fixes)) throw new WhenceError('bad-survey-log', `${printableText(name, 120)} is JSON but not a Whence survey log (no "log" and "fixes"); give the logs 'whence locate --json' or '--out FILE.json' wrote.`);
    const columns = [...new Set(parsed.fixes.flatMap((fix) => Object.keys(fix)))];
    return { name, format: 'json', head: (parsed.log.notes as string[] | undefined) ?? [], meta: parsed.log, columns, fixes: parsed.fixes };
  }
  const lines = text.split(/\r?\n/);
  const head = lines.filter((line) => line.startsWith('#')).map(headLine);
  if (!/survey log$/.test(head[0] ?? '')) throw new WhenceError('bad-survey-log', `${printableText(name, 120)} does not start with a Whence survey log head ('# Whence ... survey log'); give the CSV logs 'whence locate' wrote, unedited.`);
  const table = readCsv(text, name);
  const fixes = table.rows.map((row) => Object.fromEntries(table.header.map((column, index) => [column, row.cells[index] ?? ''])));
  return { name, format: 'csv', head, columns: table.header, fixes };
}

/** What must agree between spans: everything in the head but the span's own scan, timing note and from/to settings. */
function identity(span: SurveyLogSpan): Array<[string, string]> {
  const spanOnly = (line: string) => /^note: (scanned |timing noise|No events)/.test(line) || /^note: .*(event\(s\)|events were found)/.test(line);
  if (span.format === 'json') {
    const { notes, settings, ...rest } = span.meta!;
    const kept = { ...(settings as Record<string, unknown>) };
    delete kept.from_s; delete kept.to_s;
    return [...Object.entries(rest).map(([key, value]): [string, string] => [key, JSON.stringify(value)]), ['settings', JSON.stringify(kept)], ...(notes as string[]).filter((note) => !spanOnly(`note: ${note}`)).map((note): [string, string] => ['note', note])];
  }
  return span.head.slice(1).filter((line) => !spanOnly(line)).map((line): [string, string] => {
    const key = line.split(':')[0]!;
    return [key, key === 'settings' ? withoutSpanSettings(line) : line];
  });
}

function arrivalOf(fix: Record<string, unknown>): number {
  const value = Number(fix.arrival_s ?? fix.time_s);
  return Number.isFinite(value) ? value : Number.POSITIVE_INFINITY;
}

export interface MergedSurveyLog { text: string; eventCount: number; duplicatesDropped: number }

export function mergeSurveyLogs(spans: readonly SurveyLogSpan[]): MergedSurveyLog {
  if (spans.length < 2) throw new WhenceError('usage', 'whence merge needs at least two survey logs (one per span).');
  const first = spans[0]!;
  const firstIdentity = identity(first);
  for (const span of spans.slice(1)) {
    if (span.format !== first.format) throw new WhenceError('logs-do-not-match', `${printableText(span.name, 120)} is ${span.format.toUpperCase()} but ${printableText(first.name, 120)} is ${first.format.toUpperCase()}; merge logs of one format.`);
    const other = identity(span);
    const length = Math.max(firstIdentity.length, other.length);
    for (let i = 0; i < length; i++) {
      const a = firstIdentity[i];
      const b = other[i];
      if (a?.[1] !== b?.[1]) {
        const what = (a ?? b)![0];
        throw new WhenceError('logs-do-not-match', `${printableText(span.name, 120)} does not belong with ${printableText(first.name, 120)}: their ${what} differ ('${printableText(a?.[1] ?? '(none)', 160)}' against '${printableText(b?.[1] ?? '(none)', 160)}'). Merge only spans of one deployment located with the same array, clock fit, medium and settings.`);
      }
    }
    if (span.format === 'csv' && span.columns.join(',') !== first.columns.join(',')) throw new WhenceError('logs-do-not-match', `${printableText(span.name, 120)} has other columns than ${printableText(first.name, 120)} (a different --dims or Whence version?); merge logs made the same way.`);
  }
  const all = spans.flatMap((span, spanIndex) => span.fixes.map((fix) => ({ fix, spanIndex }))).sort((a, b) => arrivalOf(a.fix) - arrivalOf(b.fix));
  const kept: typeof all = [];
  let duplicatesDropped = 0;
  for (const entry of all) {
    const previous = kept[kept.length - 1];
    if (previous !== undefined && previous.spanIndex !== entry.spanIndex && Math.abs(arrivalOf(previous.fix) - arrivalOf(entry.fix)) < SAME_EVENT_SECONDS) { duplicatesDropped++; continue; }
    kept.push(entry);
  }
  const fixes = kept.map(({ fix }, index): Record<string, unknown> => ({ ...fix, event: first.format === 'json' ? index + 1 : String(index + 1) }));
  const spanNotes = spans.map((span) => `span ${printableText(span.name, 120)}: ${span.format === 'json' ? ((span.meta!.notes as string[]).filter((n) => n.startsWith('scanned ')).join('; ')) : span.head.filter((l) => l.startsWith('note: scanned ')).map((l) => l.slice(6)).join('; ')}`);
  const mergedNote = `merged ${spans.length} spans: ${fixes.length} events${duplicatesDropped > 0 ? `, ${duplicatesDropped} duplicate${duplicatesDropped === 1 ? '' : 's'} where spans overlap dropped` : ''}; timing noise was pooled per span`;
  if (first.format === 'json') {
    const notes = [...(first.meta!.notes as string[]).filter((n) => !n.startsWith('scanned ')), mergedNote, ...spanNotes];
    const { from_s: _from, to_s: _to, ...settings } = first.meta!.settings as Record<string, unknown>;
    return { text: JSON.stringify({ log: { ...first.meta, settings, notes }, fixes }, null, 2) + '\n', eventCount: fixes.length, duplicatesDropped };
  }
  const head = first.head.filter((line) => !line.startsWith('note: scanned ')).map((line) => (line.startsWith('settings:') ? withoutSpanSettings(line) : line));
  const rows = fixes.map((fix) => first.columns.map((column) => {
    const value = fix[column];
    return (value === '' ? undefined : typeof value === 'number' ? value : unguarded(String(value ?? ''))) as CsvValue;
  }));
  return { text: formatCsv(first.columns, rows, [...head, `note: ${mergedNote}`, ...spanNotes.map((n) => `note: ${n}`)]), eventCount: fixes.length, duplicatesDropped };
}
