// Locating a selection whose sound is already in the fix log: which logged fixes the span holds (same recording, first
// arrival inside the span), and the question that lets the user replace them or keep both. Seconds, metres. Pure.
import { sameRecording, type FixLogEntry, type RecordingIdentity } from '../../core/project';
import type { Question } from '../state/questions';

/** The logged fixes of the recording `identity` whose first arrival lies inside the span. */
export function loggedFixesInSpan(fixes: readonly FixLogEntry[], identity: RecordingIdentity | undefined, span: { startSeconds: number; endSeconds: number }): FixLogEntry[] {
  if (identity === undefined) return [];
  return fixes.filter((entry) => sameRecording(entry.recording, identity) && entry.firstArrivalSeconds >= span.startSeconds && entry.firstArrivalSeconds <= span.endSeconds);
}

function describeEntry(entry: FixLogEntry): string {
  const where = entry.eastMeters !== undefined && entry.northMeters !== undefined ? `, ${entry.eastMeters.toFixed(2)} m E ${entry.northMeters.toFixed(2)} m N` : '';
  return `event ${entry.eventIndex + 1} (${entry.verdict.grade}${where})`;
}

/** Asked before a located selection is logged beside fixes already logged from the same span. */
export function duplicateLocateQuestion(duplicates: readonly FixLogEntry[], span: { startSeconds: number; endSeconds: number }): Question {
  const which = duplicates.map(describeEntry).join(', ');
  const one = duplicates.length === 1;
  return {
    title: one ? 'This event is already logged' : 'These events are already logged',
    text: `The selection ${span.startSeconds.toFixed(2)}–${span.endSeconds.toFixed(2)} s holds ${which}, already in the fix log. Replace ${one ? 'its fix' : 'their fixes'} with the new one, or keep both?`,
    choices: [
      { id: 'replace', label: one ? 'Replace the logged fix' : 'Replace the logged fixes', primary: true },
      { id: 'keep-both', label: 'Keep both' },
      { id: 'cancel', label: 'Cancel' },
    ],
    cancelId: 'cancel',
  };
}
