// What the workspace needs from where it runs (the desktop shell or a plain browser): files in and out,
// the demo, recovery copies and menu commands. Two implementations: desktopHost.ts and webHost.ts.
import type { ExportKind, MenuCommand } from '../../core/contract';
import type { ProjectDocument } from '../../core/project';
import type { ByteReader } from '../worker/bridge';
import type { WorkerSource } from '../worker/protocol';

export interface OpenedRecording {
  name: string;
  sizeBytes: number;
  path?: string;
  /** How the pipeline worker reaches the bytes. */
  workerSource: WorkerSource;
  /** For a proxied source: where the worker's reads go. */
  byteReader?: ByteReader;
  close(): Promise<void>;
}

export interface TextInput { name: string; text: string; path?: string }

export interface Host {
  readonly kind: 'desktop' | 'web';
  readonly description: string;
  openRecording(): Promise<OpenedRecording | null>;
  openRecordingFile(file: File): Promise<OpenedRecording>;
  openArrayFile(): Promise<TextInput | null>;
  readTextFile(file: File): Promise<TextInput>;
  openProject(): Promise<{ document: ProjectDocument; path?: string; note?: string } | null>;
  /** Saves; null when the user cancelled. Throws an Error whose message says why a save failed. */
  saveProject(document: ProjectDocument, path: string | undefined, saveAs: boolean): Promise<{ path?: string; message: string } | null>;
  exportText(suggestedName: string, text: string, kind: ExportKind): Promise<string | null>;
  openDemo(): Promise<{ recording: OpenedRecording; array: TextInput; project: TextInput }>;
  writeRecoveryCopy(document: ProjectDocument, path?: string): Promise<void>;
  takeRecoveryCopy(): Promise<{ document: ProjectDocument; savedAtIso: string; path?: string } | null>;
  discardRecoveryCopy(): Promise<void>;
  onMenuCommand(listener: (command: MenuCommand) => void): () => void;
}
