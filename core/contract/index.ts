// Types shared by main/ and renderer/: what the desktop shell's preload exposes to the page (types and constants only).
// One method per IPC message, never a generic send; main checks every message's sender and validates its arguments.
import type { ProjectDocument } from '../project';

export const HOST_GLOBAL_NAME = 'whenceHost';

/** A recording the main process opened and keeps open for random-access reads; close it when done. */
export interface RecordingHandle {
  handleId: string;
  /** File name without the folder. */
  name: string;
  path: string;
  sizeBytes: number;
}

/** A text file read by the main process (an array table). */
export interface TextFile {
  name: string;
  path: string;
  text: string;
}

export interface OpenedProject {
  path: string;
  document: ProjectDocument;
  /** The schema version the file was written with; below the current one when it was migrated on load. */
  fromSchemaVersion: number;
  /** What each applied migration changed, oldest first (empty when the file was current). */
  migrationSteps: string[];
}

export interface SaveProjectRequest {
  document: ProjectDocument;
  /** Where the project was opened from or last saved to; without it (or with saveAs) a save dialog asks. */
  path?: string;
  saveAs?: boolean;
}

/** Saved (where, and the backup of the previous file if there was one), or failed with a message saying why; null: cancelled. */
export type SaveResult = { path: string; backupPath?: string } | { error: string };

export type ExportKind = 'csv' | 'json' | 'geojson';

export interface ExportTextRequest {
  /** File name offered in the save dialog, e.g. "fixes.csv". */
  suggestedName: string;
  text: string;
  kind: ExportKind;
}

export interface RecentProject {
  path: string;
  name: string;
  openedAtIso: string;
}

/** Unsaved work kept by the main process (written by writeRecoveryCopy), offered back after a crash. */
export interface RecoveryCopy {
  document: ProjectDocument;
  savedAtIso: string;
  /** Where the project was saved before, when it had been. */
  projectPath?: string;
}

/** Names of the demo files `npm run demo` writes (assets/demo/out), which the desktop host and the web mode open. */
export const DEMO_FILE_NAMES = Object.freeze({ recording: 'demo-recording.wav', array: 'demo-array.csv', project: 'demo-project.whence' });

export interface DemoFiles {
  recording: RecordingHandle;
  array: TextFile;
  /** The demo project (medium, settings and array of the invented scenario), as the text of a project file. */
  project: TextFile;
}

/** A File from a drop or a file input; only the preload can turn it into a path. */
export interface DroppedFile {
  readonly name: string;
  readonly size: number;
}

export const MENU_COMMANDS = [
  'new-project',
  'open-recording',
  'open-deployment',
  'open-array',
  'open-project',
  'save-project',
  'save-project-as',
  'export-log',
  'open-demo',
  'show-about',
  'show-cautions',
] as const;

export type MenuCommandName = (typeof MENU_COMMANDS)[number];

/** What the application menu asks the page to do (the page owns unsaved-work prompts, so it acts on these). */
export type MenuCommand = { command: MenuCommandName } | { command: 'open-recent-project'; path: string };

/** Longest read of recording bytes in one message. */
export const MAX_RECORDING_READ_BYTES = 256 * 1024 * 1024;
/** Longest text accepted for one export. */
export const MAX_EXPORT_TEXT_CHARS = 256 * 1024 * 1024;

export const PROJECT_FILE_EXTENSION = '.whence';
export const PROJECT_BACKUP_SUFFIX = '.bak';

/**
 * The object the preload script places on `window.whenceHost`; absent when the page runs in a plain browser.
 * Promises reject with an Error whose message says what went wrong and what to do; null means the user cancelled.
 */
export interface HostApi {
  readonly kind: 'electron';
  readonly appVersion: string;
  /** 'darwin', 'win32' or 'linux': for shortcut labels (Cmd or Ctrl). */
  readonly platform: string;

  openRecordingDialog(): Promise<RecordingHandle | null>;
  /** For drops (after getPathForFile) and for a project's recording reference. */
  openRecordingPath(path: string): Promise<RecordingHandle>;
  /** At most MAX_RECORDING_READ_BYTES; shorter at the end of the file. */
  readRecordingBytes(handleId: string, offsetBytes: number, lengthBytes: number): Promise<Uint8Array>;
  closeRecording(handleId: string): Promise<void>;

  openArrayDialog(): Promise<TextFile | null>;
  openArrayPath(path: string): Promise<TextFile>;

  openProjectDialog(): Promise<OpenedProject | null>;
  openProjectPath(path: string): Promise<OpenedProject>;
  /** Atomic; the previous file is kept as NAME.whence.bak. A failure leaves the old file intact and says why. */
  saveProject(request: SaveProjectRequest): Promise<SaveResult | null>;
  exportText(request: ExportTextRequest): Promise<SaveResult | null>;
  listRecentProjects(): Promise<RecentProject[]>;

  /** Call after each change (debounced); kept until the work is saved or discarded. */
  writeRecoveryCopy(document: ProjectDocument, projectPath?: string): Promise<void>;
  /** On start: the unsaved work of a session that ended without saving (left in place until discarded or replaced after the user chose); null when there is none. */
  takeRecoveryCopy(): Promise<RecoveryCopy | null>;
  /** When the user chooses to throw the unsaved work away. */
  discardRecoveryCopy(): Promise<void>;

  /** The bundled demo (assets/demo/out): its recording, opened, and its array table. */
  openDemo(): Promise<DemoFiles>;

  /** The path of a dropped file, or null when the File is not backed by a file on disk. */
  getPathForFile(file: DroppedFile): string | null;
  /** Menu commands for the page; returns the function that unsubscribes. */
  onMenuCommand(listener: (command: MenuCommand) => void): () => void;
}

/** The methods that are one IPC request each (the others are answered in the preload). */
export type HostRequestMethod = Exclude<keyof HostApi, 'kind' | 'appVersion' | 'platform' | 'getPathForFile' | 'onMenuCommand'>;

export const IPC_CHANNELS = Object.freeze({
  openRecordingDialog: 'whence:open-recording-dialog',
  openRecordingPath: 'whence:open-recording-path',
  readRecordingBytes: 'whence:read-recording-bytes',
  closeRecording: 'whence:close-recording',
  openArrayDialog: 'whence:open-array-dialog',
  openArrayPath: 'whence:open-array-path',
  openProjectDialog: 'whence:open-project-dialog',
  openProjectPath: 'whence:open-project-path',
  saveProject: 'whence:save-project',
  exportText: 'whence:export-text',
  listRecentProjects: 'whence:list-recent-projects',
  writeRecoveryCopy: 'whence:write-recovery-copy',
  takeRecoveryCopy: 'whence:take-recovery-copy',
  discardRecoveryCopy: 'whence:discard-recovery-copy',
  openDemo: 'whence:open-demo',
} as const satisfies Record<HostRequestMethod, string>);

/** Messages from main to the page. */
export const IPC_EVENTS = Object.freeze({ menuCommand: 'whence:menu-command' } as const);
