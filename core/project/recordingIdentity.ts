// Whether two recording identities name the same recording: by content hash and size when both have a hash (a renamed
// file still matches), else by name and size (and the BWF start time when both carry one). Sizes in bytes.
import type { RecordingIdentity } from './document';

export function sameRecording(a: RecordingIdentity, b: RecordingIdentity): boolean {
  if (a.sizeBytes !== b.sizeBytes) return false;
  if (a.contentHash !== undefined && b.contentHash !== undefined) return a.contentHash === b.contentHash;
  if (a.startTimeIso !== undefined && b.startTimeIso !== undefined && a.startTimeIso !== b.startTimeIso) return false;
  return a.name === b.name;
}

/** The identity part of a recording reference (what each logged fix keeps). */
export function recordingIdentityOf(reference: RecordingIdentity): RecordingIdentity {
  const identity: RecordingIdentity = { name: reference.name, sizeBytes: reference.sizeBytes };
  if (reference.startTimeIso !== undefined) identity.startTimeIso = reference.startTimeIso;
  if (reference.contentHash !== undefined) identity.contentHash = reference.contentHash;
  return identity;
}
