// Undo and redo of the user's edits to the array and the fix log: each edit keeps the part it replaced (a snapshot),
// undo swaps it back and keeps the undone state for redo. Pure; at most EDIT_HISTORY_LIMIT steps back.
import type { FixLogEntry, ProjectArray, ProjectDocument } from '../../core/project';

export type EditSnapshot =
  | { part: 'array'; label: string; array: ProjectArray }
  | { part: 'fixes'; label: string; fixes: FixLogEntry[] };

export interface EditHistory {
  /** Oldest first; the last one is what Undo restores. */
  undo: EditSnapshot[];
  /** The last one is what Redo restores. */
  redo: EditSnapshot[];
}

export const EDIT_HISTORY_LIMIT = 100;
export const EMPTY_HISTORY: EditHistory = Object.freeze({ undo: [], redo: [] }) as EditHistory;

/** The document's `part` as it is now, named by what the edit about to happen does (for "Undo: ..."). */
export function snapshotOf(document: ProjectDocument, part: EditSnapshot['part'], label: string): EditSnapshot {
  return part === 'array' ? { part, label, array: document.array } : { part, label, fixes: document.fixes };
}

function applySnapshot(document: ProjectDocument, snapshot: EditSnapshot): ProjectDocument {
  return snapshot.part === 'array' ? { ...document, array: snapshot.array } : { ...document, fixes: snapshot.fixes };
}

/** After an edit: the replaced part goes on the undo stack (oldest dropped past the limit) and redo is cleared. */
export function recordEdit(history: EditHistory, before: EditSnapshot): EditHistory {
  return { undo: [...history.undo, before].slice(-EDIT_HISTORY_LIMIT), redo: [] };
}

/** The document with the last edit undone, and the history after it; undefined when there is nothing to undo. */
export function undoEdit(document: ProjectDocument, history: EditHistory): { document: ProjectDocument; history: EditHistory; label: string } | undefined {
  const last = history.undo[history.undo.length - 1];
  if (last === undefined) return undefined;
  const current = snapshotOf(document, last.part, last.label);
  return { document: applySnapshot(document, last), history: { undo: history.undo.slice(0, -1), redo: [...history.redo, current] }, label: last.label };
}

/** The document with the last undone edit made again; undefined when there is nothing to redo. */
export function redoEdit(document: ProjectDocument, history: EditHistory): { document: ProjectDocument; history: EditHistory; label: string } | undefined {
  const last = history.redo[history.redo.length - 1];
  if (last === undefined) return undefined;
  const current = snapshotOf(document, last.part, last.label);
  return { document: applySnapshot(document, last), history: { undo: [...history.undo, current], redo: history.redo.slice(0, -1) }, label: last.label };
}
