import { describe, expect, it } from 'vitest';
import type { FixLogEntry, RecordingIdentity } from '../../../core/project';
import { duplicateLocateQuestion, loggedFixesInSpan } from '../../../renderer/workspace/duplicateLocate';

const demo: RecordingIdentity = { name: 'demo-recording.wav', sizeBytes: 1000 };
const other: RecordingIdentity = { name: 'site.wav', sizeBytes: 2000 };

function entry(id: string, eventIndex: number, firstArrivalSeconds: number, recording: RecordingIdentity): FixLogEntry {
  return { id, eventIndex, firstArrivalSeconds, recording, verdict: { grade: 'firm', reason: 'All microphones agree.' }, eastMeters: 8, northMeters: 6, upMeters: 0.3, status: 'ok', pairsUsed: 5, label: '', note: '', accepted: true } as unknown as FixLogEntry;
}

// Expected values: the rule (same recording, first arrival inside the span) and the words are this project's (issue 10, defect 6).
describe('loggedFixesInSpan()', () => {
  const fixes = [entry('e3', 2, 6.276, demo), entry('e4', 3, 8.1, demo), entry('x3', 2, 6.3, other)];

  it('loggedFixesInSpan() finds the logged fixes of the same recording whose first arrival is in the span', () => {
    expect(loggedFixesInSpan(fixes, demo, { startSeconds: 6.2, endSeconds: 6.5 }).map((f) => f.id)).toEqual(['e3']);
    expect(loggedFixesInSpan(fixes, demo, { startSeconds: 9, endSeconds: 10 })).toEqual([]);
    expect(loggedFixesInSpan(fixes, undefined, { startSeconds: 0, endSeconds: 60 })).toEqual([]);
  });

  it('duplicateLocateQuestion() names the event and offers replace, keep both and cancel', () => {
    const question = duplicateLocateQuestion([fixes[0]!], { startSeconds: 6.2, endSeconds: 6.5 });
    expect(question.text).toBe('The selection 6.20–6.50 s holds event 3 (firm, 8.00 m E 6.00 m N), already in the fix log. Replace its fix with the new one, or keep both?');
    expect(question.choices.map((c) => c.id)).toEqual(['replace', 'keep-both', 'cancel']);
    expect(question.cancelId).toBe('cancel');
  });
});
