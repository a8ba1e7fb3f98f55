// `whence merge LOG...`: joins the survey logs of spans of one deployment (each from `whence locate --from/--to`, run
// anywhere) into one log, refusing logs that do not belong together (another array, clock fit, medium or settings).
import { mergeSurveyLogs, parseSurveyLog } from '../../../core/deployment';
import { writeFileAtomic } from '../../files';
import type { CliIo } from '../io';
import { optionalString, parseCommandArgs, UsageError } from '../parse';
import { readTextFile } from '../readInput';

export const mergeHelp = `whence merge LOG LOG... [--out FILE]

  Joins survey logs of spans of one recording or deployment (CSV or JSON, as
  'whence locate' wrote them) into one log in time order, events renumbered; an event
  found by two overlapping spans is kept once. Logs of another array, clock fit,
  medium or settings are refused.

  --out FILE            write the merged log to FILE (atomically) instead of standard output
`;

export async function runMerge(argv: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseCommandArgs('merge', argv, { out: { type: 'string' } });
  if (positionals.length < 2) throw new UsageError(`whence merge needs two or more survey logs; got ${positionals.length}. Example: whence merge span1.csv span2.csv --out season.csv`);
  const spans = [];
  for (const path of positionals) spans.push(parseSurveyLog(await readTextFile(path, 'survey log'), path));
  const merged = mergeSurveyLogs(spans);
  const outPath = optionalString(values, 'out');
  if (outPath !== undefined) await writeFileAtomic(outPath, merged.text);
  else io.writeStdout(merged.text);
  io.writeStderr(`merged ${spans.length} logs: ${merged.eventCount} events${merged.duplicatesDropped > 0 ? ` (${merged.duplicatesDropped} found twice where spans overlap, kept once)` : ''}${outPath !== undefined ? `; wrote ${outPath}` : ''}.\n`);
  return 0;
}
