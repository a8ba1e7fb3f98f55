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
