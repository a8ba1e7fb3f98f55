// Which located events are already in the fix log: an entry is an event's when it names the same recording (core/project
// sameRecording) and the same event, at the same first arrival (within ARRIVAL_MATCH_SECONDS). Never by event number alone.
import type { WavInfo } from '../../core/audio';
import type { LocatedEvent } from '../../core/pipeline';
import { sameRecording, type FixLogEntry, type RecordingIdentity } from '../../core/project';

/** Two first arrivals of one event agree to the sample; a millisecond allows for rounding in the project file. */
export const ARRIVAL_MATCH_SECONDS = 1e-3;

/** The identity of the open recording, as each entry logged from it keeps it. */
export function openRecordingIdentity(recording: { name: string; sizeBytes: number; info: Pick<WavInfo, 'startTime'>; contentHash?: string }): RecordingIdentity {
  const identity: RecordingIdentity = { name: recording.name, sizeBytes: recording.sizeBytes };
  if (recording.info.startTime !== undefined) identity.startTimeIso = recording.info.startTime.isoLocal;
  if (recording.contentHash !== undefined) identity.contentHash = recording.contentHash;
  return identity;
}

/** Whether `entry` was logged from `located` of the recording `identity`. */
export function entryIsOfEvent(entry: FixLogEntry, identity: RecordingIdentity, located: Pick<LocatedEvent, 'event' | 'firstArrivalSeconds'>): boolean {
  return entry.eventIndex === located.event.index && Math.abs(entry.firstArrivalSeconds - located.firstArrivalSeconds) <= ARRIVAL_MATCH_SECONDS && sameRecording(entry.recording, identity);
}

/** Event numbers (LocatedEvent.event.index) of the open recording's events that are in the log; empty without a recording. */
export function loggedEventIndices(fixes: readonly FixLogEntry[], identity: RecordingIdentity | undefined, events: ReadonlyArray<Pick<LocatedEvent, 'event' | 'firstArrivalSeconds'>>): Set<number> {
  const logged = new Set<number>();
  if (identity === undefined) return logged;
  const ours = fixes.filter((entry) => sameRecording(entry.recording, identity));
  for (const located of events) {
    if (ours.some((entry) => entryIsOfEvent(entry, identity, located))) logged.add(located.event.index);
  }
  return logged;
}

/** The log's entries by id, each with the located event it was logged from when that event is at hand (same recording and event). */
export function locatedByEntryId(fixes: readonly FixLogEntry[], identity: RecordingIdentity | undefined, events: readonly LocatedEvent[]): Map<string, LocatedEvent> {
  const located = new Map<string, LocatedEvent>();
  if (identity === undefined) return located;
  for (const entry of fixes) {
    const match = events.find((event) => entryIsOfEvent(entry, identity, event));
    if (match !== undefined) located.set(entry.id, match);
  }
  return located;
}
