// The Open deployment dialog: what a deployment is, the optional file-name time pattern (the command line's --name-time),
// and the two ways to pick it: a folder holding the table and its WAV files, or the table and its files picked together.
import { useEffect, useRef, useState } from 'react';
import { nameTimePattern } from '../../core/deployment';
import type { DeploymentPick } from '../state/useWorkspace';
import '../workspace/confirmDialog.css';
import './deployment.css';

export interface OpenDeploymentDialogProps {
  open: boolean;
  onPick(how: DeploymentPick, nameTime: string | undefined): void;
  onClose(): void;
}

/** The pattern's problem in words, or undefined when it is empty or usable. */
export function nameTimeProblem(pattern: string): string | undefined {
  if (pattern.trim() === '') return undefined;
  try {
    nameTimePattern(pattern.trim());
    return undefined;
  } catch (error) {
    return (error instanceof Error ? error.message : String(error)).replace(/^--name-time /, 'The pattern ');
  }
}

export function OpenDeploymentDialog({ open, onPick, onClose }: OpenDeploymentDialogProps) {
  const [pattern, setPattern] = useState('');
  const folderRef = useRef<HTMLButtonElement | null>(null);
  useEffect(() => {
    if (!open) return;
    folderRef.current?.focus();
    const onKey = (event: KeyboardEvent) => { if (event.key === 'Escape') { event.preventDefault(); onClose(); } };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [open, onClose]);
  if (!open) return null;
  const problem = nameTimeProblem(pattern);
  const pick = (how: DeploymentPick) => {
    if (problem !== undefined) return;
    onClose();
    onPick(how, pattern.trim() === '' ? undefined : pattern.trim());
  };
  return (
    <div className="confirm-backdrop" data-testid="deployment-dialog">
      <div className="confirm-box deployment-dialog" role="dialog" aria-modal="true" aria-labelledby="deployment-dialog-title">
        <h2 id="deployment-dialog-title">Open a deployment</h2>
        <p>
          A deployment is several recorders, each writing its own files with its own clock, read as one recording. Its
          deployment table (CSV) has one row per recorder file channel: <code>recorder,file,file_channel,microphone</code>, optionally <code>start_time</code>;
          files are named relative to the table, microphones by their labels in the array table.
        </p>
        <label className="deployment-field">
          <span>Start times in file names <span className="muted">(optional, for files without a Broadcast Wave start time)</span></span>
          <input type="text" value={pattern} onChange={(event) => setPattern(event.target.value)} placeholder="REC_YYYYMMDD_hhmmss*" spellCheck={false} data-testid="deployment-name-time"
            aria-invalid={problem !== undefined} aria-describedby="deployment-name-time-help" />
          <span id="deployment-name-time-help" className={problem === undefined ? 'muted' : 'error'} data-testid="deployment-name-time-help">
            {problem ?? 'YYYY MM DD hh mm ss, fff for milliseconds, * for any text. A start_time cell or the file\'s own BWF time comes first.'}
          </span>
        </label>
        <div className="confirm-choices">
          <button type="button" ref={folderRef} className="primary" disabled={problem !== undefined} onClick={() => pick('folder')} data-testid="deployment-pick-folder"
            title="A folder holding the deployment table and the recorders' WAV files (subfolders included)">Choose folder…</button>
          <button type="button" disabled={problem !== undefined} onClick={() => pick('files')} data-testid="deployment-pick-files"
            title="The deployment table and its WAV files, selected together">Choose table and WAV files…</button>
          <button type="button" onClick={onClose} data-testid="deployment-dialog-cancel">Cancel</button>
        </div>
      </div>
    </div>
  );
}
