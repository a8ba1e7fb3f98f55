// The workspace state and its reducer: the project document (what is saved) and the session around it
// (open recording, located events, selection, running work, notices). Pure; tested in test/renderer/state.
import type { WavInfo } from '../../core/audio';
import type { EnvelopePyramid } from '../../core/overview';
import { locatedVerdict, type LocatedEvent } from '../../core/pipeline';
import type { FixLogEntry, ProjectArray, ProjectDocument, ProjectMedium, ProjectSettings } from '../../core/project';
import type { SolveResult } from '../../core/locate';
import { fixLogEntryFromLocated } from '../fixlog';

export interface Notice { id: number; level: 'info' | 'warning' | 'error'; text: string }
export interface Busy { label: string; progress: number; detail?: string }

export interface WorkspaceState {
  document: ProjectDocument;
  projectPath: string | undefined;
  dirty: boolean;
  recording: { name: string; sizeBytes: number; info: WavInfo } | undefined;
  envelope: EnvelopePyramid | undefined;
  envelopeProgress: number | undefined;
  events: LocatedEvent[];
  selectedEventIndex: number | undefined;
  selectedFixId: string | undefined;
  selection: { startSeconds: number; endSeconds: number } | undefined;
  busy: Busy | undefined;
  notices: Notice[];
  nextNoticeId: number;
}

export type WorkspaceAction =
  | { type: 'document/replace'; document: ProjectDocument; path: string | undefined; dirty: boolean }
  | { type: 'array/set'; array: ProjectArray }
  | { type: 'medium/set'; medium: ProjectMedium }
  | { type: 'settings/set'; settings: ProjectSettings }
  | { type: 'recording/opened'; name: string; sizeBytes: number; info: WavInfo }
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
  | { type: 'fix/select'; id: string | undefined }
  | { type: 'busy/set'; busy: Busy | undefined }
  | { type: 'notice/add'; level: Notice['level']; text: string }
  | { type: 'notice/dismiss'; id: number }
  | { type: 'project/saved'; path: string | undefined };

export function initialWorkspace(document: ProjectDocument): WorkspaceState {
  return { document, projectPath: undefined, dirty: false, recording: undefined, envelope: undefined, envelopeProgress: undefined, events: [], selectedEventIndex: undefined, selectedFixId: undefined, selection: undefined, busy: undefined, notices: [], nextNoticeId: 1 };
}

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
    case 'document/replace':
      return { ...state, document: action.document, projectPath: action.path, dirty: action.dirty, selectedFixId: undefined };
    case 'array/set':
      return editDocument(state, { ...state.document, array: action.array });
    case 'medium/set':
      return editDocument(state, { ...state.document, medium: action.medium });
    case 'settings/set':
      return editDocument(state, { ...state.document, settings: action.settings });
    case 'recording/opened': {
      const { info } = action;
      const recording = { name: action.name, sizeBytes: action.sizeBytes, channelCount: info.channelCount, sampleRateHz: info.sampleRateHz, frameCount: info.frameCount };
      return { ...state, recording: { name: action.name, sizeBytes: action.sizeBytes, info }, envelope: undefined, envelopeProgress: 0, events: [], selectedEventIndex: undefined, selection: undefined, document: { ...state.document, recording }, dirty: true };
    }
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
      let working = state;
      const added: FixLogEntry[] = [];
      for (const index of action.indices) {
        const located = state.events[index];
        if (located === undefined) continue;
        const id = fixIdFor({ ...working, document: { ...working.document, fixes: [...working.document.fixes, ...added] } }, located.event.index);
        const info = state.recording?.info;
        const entry = fixLogEntryFromLocated(located, { id, verdict: locatedVerdict(located, state.document.array), label: `sound ${located.event.index + 1}`, ...(info?.startTime !== undefined ? { recordingStartTime: info.startTime, sampleRateHz: info.sampleRateHz } : {}) });
        added.push(entry);
      }
      working = editDocument(state, { ...state.document, fixes: [...state.document.fixes, ...added] });
      return added.length > 0 ? { ...working, selectedFixId: added[added.length - 1]!.id } : working;
    }
    case 'fix/update':
      return editDocument(state, { ...state.document, fixes: state.document.fixes.map((fix) => (fix.id === action.id ? { ...fix, ...action.patch } : fix)) });
    case 'fixes/set':
      return editDocument(state, { ...state.document, fixes: action.fixes });
    case 'fix/select':
      return { ...state, selectedFixId: action.id };
    case 'busy/set':
      return { ...state, busy: action.busy };
    case 'notice/add':
      return { ...state, notices: [...state.notices.slice(-4), { id: state.nextNoticeId, level: action.level, text: action.text }], nextNoticeId: state.nextNoticeId + 1 };
    case 'notice/dismiss':
      return { ...state, notices: state.notices.filter((notice) => notice.id !== action.id) };
    case 'project/saved':
      return { ...state, dirty: false, projectPath: action.path ?? state.projectPath };
  }
}
