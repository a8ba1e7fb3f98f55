// Whether two recording identities name the same recording: by content hash and size when both have a hash (a renamed
// file still matches), else by name and size (and the BWF start time when both carry one). Sizes in bytes.
import type { RecordingIdentity } from './document';

export function sameRecording(a: RecordingIdentity, b: RecordingIdentity): boolean {
  if (a.sizeBytes !== b.sizeBytes) return false;
  if (a.contentHash !== undefined && b.contentHash !== undefined) return a.contentHash === b.contentHash;
  if (a.startTimeIso !== undefined && b.startTimeIso !== undefined && a.startTimeIso !== b.startTimeIso) return false;
  return a.name === b.name;
}
