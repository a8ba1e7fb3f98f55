// The workspace state and its reducer: the project document (what is saved) and the session around it
// (open recording, located events, selection, running work, notices). Pure; tested in test/renderer/state.
import type { WavInfo } from '../../core/audio';
import type { DeploymentLayout } from '../../core/deployment';
import type { EnvelopePyramid } from '../../core/overview';
import { locatedVerdict, type LocatedEvent } from '../../core/pipeline';
import { emptyProjectDocument, sameRecording, type FixLogEntry, type ProjectArray, type ProjectDocument, type ProjectMedium, type ProjectSettings, type SitePicture } from '../../core/project';
import type { SolveResult } from '../../core/locate';
import { fixLogEntryFromLocated, loggedEventIndices, openRecordingIdentity } from '../fixlog';
import { EMPTY_HISTORY, recordEdit, redoEdit, snapshotOf, undoEdit, type EditHistory, type EditSnapshot } from './editHistory';
import { addNotice, type NoticeItem } from '../workspace/noticeList';
import type { ClocksInUse } from '../deployment/clockFitRows';

export type Notice = NoticeItem;
export interface OpenRecording { name: string; sizeBytes: number; info: WavInfo; contentHash?: string; deployment?: DeploymentLayout }
export interface Busy { label: string; progress: number; detail?: string }

export interface WorkspaceState {
  document: ProjectDocument;
  projectPath: string | undefined;
  dirty: boolean;
  /**
   * The open recording; contentHash is core/audio recordingFingerprint's (absent until the worker computed it). A deployment
   * is its virtual recording (name: its table's file name, size: its files' sum) with its layout.
   */
  recording: OpenRecording | undefined;
  /** The clocks the open deployment is read through (files' own for a recording). */
  clocks: ClocksInUse;
  envelope: EnvelopePyramid | undefined;
  envelopeProgress: number | undefined;
  events: LocatedEvent[];
  selectedEventIndex: number | undefined;
  selectedFixId: string | undefined;
  selection: { startSeconds: number; endSeconds: number } | undefined;
  busy: Busy | undefined;
  notices: Notice[];
  nextNoticeId: number;
  /** Undo and redo of array and fix log edits (editHistory.ts). */
  history: EditHistory;
  /** The document is the demo's (opened by Demo and not saved since): a recording of one's own starts afresh from it. */
  fromDemo: boolean;
}

export type WorkspaceAction =
  | { type: 'document/replace'; document: ProjectDocument; path: string | undefined; dirty: boolean; fromDemo?: boolean }
  | { type: 'array/set'; array: ProjectArray }
  | { type: 'medium/set'; medium: ProjectMedium }
  | { type: 'settings/set'; settings: ProjectSettings }
  | { type: 'sitePicture/set'; sitePicture: SitePicture | undefined }
  | { type: 'recording/opened'; name: string; sizeBytes: number; info: WavInfo; contentHash?: string; deployment?: DeploymentLayout }
  /** The open deployment is now read through these clocks; the located events of the old clocks go (they are stale). */
  | { type: 'clocks/set'; clocks: ClocksInUse }
  /** Conditions (medium, settings) back to a new project's; leaving the demo also resets the name and the array. The log stays. */
  | { type: 'conditions/reset'; leaveDemo: boolean }
  | { type: 'edit/undo' }
  | { type: 'edit/redo' }
  | { type: 'envelope/progress'; fraction: number }
  | { type: 'envelope/done'; envelope: EnvelopePyramid }
  | { type: 'events/replace'; events: LocatedEvent[] }
  | { type: 'events/add'; event: LocatedEvent }
  | { type: 'events/resolved'; solves: ReadonlyArray<{ index: number; solve: SolveResult }> }
  | { type: 'event/select'; index: number | undefined }
  | { type: 'selection/set'; selection: { startSeconds: number; endSeconds: number } | undefined }
  | { type: 'fixes/log-events'; indices: number[] }
  | { type: 'fix/update'; id: string; patch: Partial<Pick<FixLogEntry, 'label' | 'note' | 'accepted'>> }
  | { type: 'fixes/set'; fixes: FixLogEntry[] }
  /** Takes the fixes with these ids out of the log (one undoable edit). */
  | { type: 'fixes/remove'; ids: ReadonlySet<string> }
  | { type: 'fix/select'; id: string | undefined }
  | { type: 'busy/set'; busy: Busy | undefined }
  | { type: 'notice/add'; level: Notice['level']; text: string; cause?: string }
  | { type: 'notice/dismiss'; id: number }
  | { type: 'project/saved'; path: string | undefined };

export function initialWorkspace(document: ProjectDocument): WorkspaceState {
  return { document, projectPath: undefined, dirty: false, recording: undefined, clocks: { kind: 'files' }, envelope: undefined, envelopeProgress: undefined, events: [], selectedEventIndex: undefined, selectedFixId: undefined, selection: undefined, busy: undefined, notices: [], nextNoticeId: 1, history: EMPTY_HISTORY, fromDemo: false };
}

/** An edit the user can undo: `before` is the part it replaces. */
function undoableEdit(state: WorkspaceState, document: ProjectDocument, before: EditSnapshot): WorkspaceState {
  return { ...state, document, dirty: true, history: recordEdit(state.history, before) };
}

/** The name a project gets when a recording of one's own is opened after the demo. */
export const NEW_PROJECT_NAME = 'Untitled survey';

function editDocument(state: WorkspaceState, document: ProjectDocument): WorkspaceState {
  return { ...state, document, dirty: true };
}

function fixIdFor(state: WorkspaceState, eventIndex: number): string {
  const taken = new Set(state.document.fixes.map((f) => f.id));
  let id = `e${eventIndex + 1}`;
  for (let n = 2; taken.has(id); n++) id = `e${eventIndex + 1}-${n}`;
  return id;
}

export function workspaceReducer(state: WorkspaceState, action: WorkspaceAction): WorkspaceState {
  switch (action.type) {
    case 'document/replace': {
      // The located events belong to the old document's array: they go; the recording stays open only if the new project names it.
      const reference = action.document.recording;
      const keepRecording = state.recording !== undefined && reference !== undefined && sameRecording(reference, openRecordingIdentity(state.recording));
      const session = keepRecording ? {} : { recording: undefined, clocks: { kind: 'files' } as const, envelope: undefined, envelopeProgress: undefined };
      return { ...state, ...session, document: action.document, projectPath: action.path, dirty: action.dirty, selectedFixId: undefined, events: [], selectedEventIndex: undefined, selection: undefined, history: EMPTY_HISTORY, fromDemo: action.fromDemo ?? false };
    }
    case 'array/set':
      return undoableEdit(state, { ...state.document, array: action.array }, snapshotOf(state.document, 'array', 'array edit'));
    case 'conditions/reset': {
      const fresh = emptyProjectDocument(NEW_PROJECT_NAME);
      const document = { ...state.document, medium: fresh.medium, settings: fresh.settings, ...(action.leaveDemo ? { name: fresh.name, array: fresh.array } : {}) };
      return { ...state, document, dirty: true, fromDemo: action.leaveDemo ? false : state.fromDemo, ...(action.leaveDemo ? { projectPath: undefined, history: EMPTY_HISTORY } : {}) };
    }
    case 'edit/undo':
    case 'edit/redo': {
      const step = action.type === 'edit/undo' ? undoEdit(state.document, state.history) : redoEdit(state.document, state.history);
      return step === undefined ? state : { ...state, document: step.document, history: step.history, dirty: true };
    }
    case 'medium/set':
      return editDocument(state, { ...state.document, medium: action.medium });
    case 'settings/set':
      return editDocument(state, { ...state.document, settings: action.settings });
    case 'sitePicture/set': {
      const { sitePicture: _previous, ...rest } = state.document;
      return editDocument(state, action.sitePicture === undefined ? rest : { ...rest, sitePicture: action.sitePicture });
    }
    case 'recording/opened': {
      const { info } = action;
      const opened: OpenRecording = { name: action.name, sizeBytes: action.sizeBytes, info, ...(action.contentHash !== undefined ? { contentHash: action.contentHash } : {}), ...(action.deployment !== undefined ? { deployment: action.deployment } : {}) };
      const recording = { ...openRecordingIdentity(opened), channelCount: info.channelCount, sampleRateHz: info.sampleRateHz, frameCount: info.frameCount };
      // Reopening the project's own recording only completes its identity: nothing the user made has changed.
      const previous = state.document.recording;
      const same = previous !== undefined && sameRecording(previous, recording);
      const path = same && previous.path !== undefined ? { path: previous.path } : {};
      return { ...state, recording: opened, clocks: { kind: 'files' }, envelope: undefined, envelopeProgress: 0, events: [], selectedEventIndex: undefined, selection: undefined, document: { ...state.document, recording: { ...recording, ...path } }, dirty: same ? state.dirty : true };
    }
    case 'clocks/set':
      if (state.recording?.deployment === undefined) return state;
      return { ...state, clocks: action.clocks, events: [], selectedEventIndex: undefined, envelope: undefined, envelopeProgress: 0 };
    case 'envelope/progress':
      return { ...state, envelopeProgress: action.fraction };
    case 'envelope/done':
      return { ...state, envelope: action.envelope, envelopeProgress: undefined };
    case 'events/replace':
      return { ...state, events: action.events, selectedEventIndex: action.events.length > 0 ? 0 : undefined };
    case 'events/add':
      return { ...state, events: [...state.events, action.event], selectedEventIndex: state.events.length };
    case 'events/resolved': {
      const events = [...state.events];
      for (const { index, solve } of action.solves) {
        const located = events[index];
        if (located !== undefined) events[index] = { ...located, solve };
      }
      return { ...state, events };
    }
    case 'event/select': {
      const located = action.index === undefined ? undefined : state.events[action.index];
      return { ...state, selectedEventIndex: action.index, selection: located ? { startSeconds: located.windowStartSeconds, endSeconds: located.windowEndSeconds } : state.selection };
    }
    case 'selection/set':
      return { ...state, selection: action.selection };
    case 'fixes/log-events': {
      if (state.recording === undefined) return state;
      const identity = openRecordingIdentity(state.recording);
      const alreadyLogged = loggedEventIndices(state.document.fixes, identity, state.events);
      const added: FixLogEntry[] = [];
      const info = state.recording.info;
      const origin = state.document.array.origin;
      for (const index of action.indices) {
        const located = state.events[index];
        if (located === undefined || alreadyLogged.has(located.event.index)) continue;
        alreadyLogged.add(located.event.index);
        const id = fixIdFor({ ...state, document: { ...state.document, fixes: [...state.document.fixes, ...added] } }, located.event.index);
        const entry = fixLogEntryFromLocated(located, { id, recording: identity, verdict: locatedVerdict(located, state.document.array), label: '', ...(origin !== undefined ? { origin } : {}), ...(info.startTime !== undefined ? { recordingStartTime: info.startTime, sampleRateHz: info.sampleRateHz } : {}) });
        added.push(entry);
      }
      if (added.length === 0) return state;
      const working = undoableEdit(state, { ...state.document, fixes: [...state.document.fixes, ...added] }, snapshotOf(state.document, 'fixes', added.length === 1 ? 'log a fix' : `log ${added.length} fixes`));
      return { ...working, selectedFixId: added[added.length - 1]!.id };
    }
    case 'fix/update':
      return undoableEdit(state, { ...state.document, fixes: state.document.fixes.map((fix) => (fix.id === action.id ? { ...fix, ...action.patch } : fix)) }, snapshotOf(state.document, 'fixes', 'fix log edit'));
    case 'fixes/set':
      return undoableEdit(state, { ...state.document, fixes: action.fixes }, snapshotOf(state.document, 'fixes', 'fix log edit'));
    case 'fixes/remove':
      return undoableEdit(state, { ...state.document, fixes: state.document.fixes.filter((entry) => !action.ids.has(entry.id)) }, snapshotOf(state.document, 'fixes', 'fix log edit'));
    case 'fix/select':
      return { ...state, selectedFixId: action.id };
    case 'busy/set':
      return { ...state, busy: action.busy };
    case 'notice/add':
      return { ...state, notices: addNotice(state.notices, { id: state.nextNoticeId, level: action.level, text: action.text, ...(action.cause !== undefined ? { cause: action.cause } : {}) }), nextNoticeId: state.nextNoticeId + 1 };
    case 'notice/dismiss':
      return { ...state, notices: state.notices.filter((notice) => notice.id !== action.id) };
    case 'project/saved':
      return { ...state, dirty: false, projectPath: action.path ?? state.projectPath, fromDemo: false };
  }
}
