// Questions the workspace asks before a step that could lose or mislead work: discarding unsaved work, and keeping
// conditions set for another recording. Pure texts and choices; the ConfirmDialog shows them. Units as in the texts.
import type { ProjectDocument } from '../../core/project';

export interface QuestionChoice { id: string; label: string; primary?: boolean }
export interface Question { title: string; text: string; choices: QuestionChoice[]; /** The choice Escape picks. */ cancelId: string }

/** "air 14 °C, 85 % humidity, 100.9 kPa; 2-D, source height 0.3 m": the conditions a recording was located with. */
export function describeConditions(document: Pick<ProjectDocument, 'medium' | 'settings'>): string {
  const m = document.medium;
  const parts: string[] = [];
  if (m.medium === 'air') {
    parts.push(`air ${m.temperatureCelsius} °C`);
    if (m.relativeHumidityPercent !== undefined) parts.push(`${m.relativeHumidityPercent} % humidity`);
    if (m.pressureKilopascals !== undefined) parts.push(`${m.pressureKilopascals} kPa`);
  } else if (m.medium === 'fixed-speed') {
    parts.push(`speed of sound ${m.speedMetersPerSecond} m/s`);
  } else {
    parts.push(`${m.medium} ${m.temperatureCelsius} °C`);
  }
  const s = document.settings;
  const height = s.dimensions === 2 ? (s.sourceUpMeters !== undefined ? `, source height ${s.sourceUpMeters} m` : ', source at the microphones\' mean height') : '';
  return `${parts.join(', ')}; ${s.dimensions}-D${height}`;
}

/** Asked when a recording other than the project's is opened into it: keep the project's conditions or start from defaults. */
export function conditionsQuestion(document: Pick<ProjectDocument, 'medium' | 'settings' | 'recording'>, newRecordingName: string): Question {
  const was = document.recording?.name ?? 'another recording';
  return {
    title: 'Settings for this recording?',
    text: `The project's settings (${describeConditions(document)}) were set for ${was}. Are they right for ${newRecordingName}? Resetting sets air at 20 °C and the other settings to their defaults; the array and the fix log stay as they are.`,
    choices: [
      { id: 'reset', label: 'Reset the settings', primary: true },
      { id: 'keep', label: `Keep them for ${newRecordingName}` },
    ],
    cancelId: 'keep',
  };
}

/** Asked before `what` ("open the demo", "open a project", "start a new project") replaces unsaved work. */
export function discardWorkQuestion(document: Pick<ProjectDocument, 'name' | 'fixes'>, what: string): Question {
  const fixes = document.fixes.length;
  const log = fixes === 0 ? '' : ` and its fix log of ${fixes} fix${fixes === 1 ? '' : 'es'}`;
  return {
    title: `Unsaved changes in ${document.name || 'this project'}`,
    text: `To ${what}, the project ${document.name || '(untitled)'}${log} is closed. Its changes since the last save would be lost.`,
    choices: [
      { id: 'save', label: `Save, then ${what}`, primary: true },
      { id: 'discard', label: `Discard changes and ${what}` },
      { id: 'cancel', label: 'Keep working' },
    ],
    cancelId: 'cancel',
  };
}

/** Asked when the picked folder (or files) hold several deployment tables: which one to open. Choice ids are the paths. */
export function deploymentTableQuestion(paths: readonly string[], what: string): Question {
  return {
    title: 'Which deployment table?',
    text: `${what} holds ${paths.length} deployment tables (CSV files starting with recorder,file,file_channel,microphone). Which one describes the deployment to open? Its files are looked for among the files picked.`,
    choices: [...paths.map((path, index) => ({ id: `table:${path}`, label: path, ...(index === 0 ? { primary: true } : {}) })), { id: 'cancel', label: 'Cancel' }],
    cancelId: 'cancel',
  };
}

/** What to open after a project (or its recovery copy) was opened: its recording, or its deployment (named by its table, a .csv). */
export function reopenRecordingHint(recording: { name: string } | undefined): string {
  if (recording === undefined) return 'Open a recording (or a deployment) to locate.';
  if (/\.csv$/i.test(recording.name)) return `Open its deployment ${recording.name} again (Open deployment…: the folder with the table and its WAV files, and the same file-name time pattern if one was given) to locate again.`;
  return `Open its recording ${recording.name} again to locate again.`;
}

/** Asked when the clocks of a deployment change while the fix log holds fixes of it located with the clocks before. */
export function staleFixesQuestion(count: number, deploymentName: string, clocksBefore: string, clocksNow: string): Question {
  const fixes = `${count} fix${count === 1 ? '' : 'es'}`;
  return {
    title: 'Fixes located with other clocks',
    text: `The fix log holds ${fixes} of ${deploymentName} located with ${clocksBefore}. The deployment is now read through ${clocksNow}, which moves its sounds' time differences: those fixes are out of date. Remove them from the log (Undo brings them back) and log the fixes located again, or keep them as they are?`,
    choices: [
      { id: 'remove', label: `Remove the ${fixes}`, primary: true },
      { id: 'keep', label: 'Keep them' },
    ],
    cancelId: 'keep',
  };
}
