// The workspace toolbar: files, the demo, locating, and the progress of running work with its Stop button.
import type { Busy } from '../state/workspace';

export interface ToolbarProps {
  projectName: string;
  dirty: boolean;
  hostDescription: string;
  busy: Busy | undefined;
  canLocate: boolean;
  selection: { startSeconds: number; endSeconds: number } | undefined;
  /** What Undo and Redo would do ("log 15 fixes"); undefined disables the button. */
  undoLabel: string | undefined;
  redoLabel: string | undefined;
  onNewProject(): void;
  onUndo(): void;
  onRedo(): void;
  onOpenRecording(): void;
  onOpenDeployment(): void;
  onOpenArray(): void;
  onOpenProject(): void;
  onSave(): void;
  onDemo(): void;
  onLocateAll(): void;
  onLocateSelection(): void;
  onCancel(): void;
}

export function Toolbar(props: ToolbarProps) {
  const { busy } = props;
  return (
    <header className="topbar">
      <h1>Whence</h1>
      <span className="project" data-testid="project-name">{props.projectName}{props.dirty ? ' •' : ''}</span>
      <div className="toolbar-buttons">
        <button type="button" onClick={props.onNewProject} data-testid="new-project">New project</button>
        <button type="button" onClick={props.onOpenRecording} data-testid="open-recording">Open recording</button>
        <button type="button" onClick={props.onOpenDeployment} data-testid="open-deployment" title="Several recorders, each with its own files and clock: a deployment table (CSV) and its WAV files">Open deployment…</button>
        <button type="button" onClick={props.onOpenArray} data-testid="open-array">Open array</button>
        <button type="button" onClick={props.onOpenProject} data-testid="open-project">Open project</button>
        <button type="button" onClick={props.onSave} data-testid="save-project">Save project</button>
        <button type="button" onClick={props.onDemo} data-testid="open-demo">Demo</button>
        <span className="divider" />
        <button type="button" disabled={props.undoLabel === undefined} onClick={props.onUndo} title={props.undoLabel === undefined ? 'Nothing to undo' : `Undo: ${props.undoLabel} (Ctrl+Z)`} aria-label={props.undoLabel === undefined ? 'Undo' : `Undo ${props.undoLabel}`} data-testid="undo">Undo</button>
        <button type="button" disabled={props.redoLabel === undefined} onClick={props.onRedo} title={props.redoLabel === undefined ? 'Nothing to redo' : `Redo: ${props.redoLabel} (Ctrl+Shift+Z)`} aria-label={props.redoLabel === undefined ? 'Redo' : `Redo ${props.redoLabel}`} data-testid="redo">Redo</button>
        <span className="divider" />
        <button type="button" className="primary" disabled={!props.canLocate || busy !== undefined} onClick={props.onLocateAll} data-testid="locate-all">Find &amp; locate</button>
        <button type="button" disabled={!props.canLocate || props.selection === undefined || busy !== undefined} onClick={props.onLocateSelection} data-testid="locate-selection">Locate selection</button>
      </div>
      {busy !== undefined && (
        <div className="busy" role="status" data-testid="busy">
          <span>{busy.label}{busy.detail ? ` (${busy.detail})` : ''}</span>
          <progress max={1} value={busy.progress} />
          <button type="button" onClick={props.onCancel} data-testid="cancel-work">Stop</button>
        </div>
      )}
      <span className="host">{props.hostDescription}</span>
    </header>
  );
}
