// A deployment's content hash and the deployment channel of each array microphone (by label), for the app.
// FNV-1a 64 (core/audio) over the table's text and each file's own content hash (UTF-16 code units); 16 lower-case hex digits.
import { fnv1a64Hex } from '../audio';
import type { ArrayGeometry } from '../project';
import type { DeploymentLayout } from './deploymentLayout';
import { microphonesByLabel } from './syncDeployment';

/** The content hash of a deployment: its table's text, then each file's fingerprint in the table's order of files. */
export function deploymentContentHash(tableText: string, fileFingerprints: readonly string[]): string {
  const text = [tableText, ...fileFingerprints].join('\n');
  // UTF-16 code units, low byte first (no text encoder in core; any fixed encoding identifies the text)
  const bytes = new Uint8Array(2 * text.length);
  for (let i = 0; i < text.length; i++) { const unit = text.charCodeAt(i); bytes[2 * i] = unit & 0xff; bytes[2 * i + 1] = unit >>> 8; }
  return fnv1a64Hex(bytes);
}

/**
 * The deployment channel (0-based, in the layout's order of microphones) of each microphone of the array, matched by label:
 * a LocateContext's channelIndexOfMicrophone. Every array microphone must be on a recorder.
 */
export function deploymentChannelIndices(layout: DeploymentLayout, geometry: ArrayGeometry): number[] {
  microphonesByLabel(geometry, { layout });
  const labels = layout.microphones.map((m) => m.label);
  return geometry.microphones.map((m) => labels.indexOf(m.label));
}
