// What the app says about an open deployment: the survey log's head lines for it (core/export deploymentHeadNotes, as
// `whence locate --deployment` writes them), the notice on opening it and hints for failures. Pure; seconds.
import { deploymentHeadNotes } from '../../core/export';
import { formatLocalInstant, type DeploymentLayout } from '../../core/deployment';
import type { ClocksInUse } from './clockFitRows';
import { formatGapLength } from './recorderLanes';

/** The head lines of a survey log located over the deployment with these clocks. */
export function deploymentLogNotes(layout: DeploymentLayout, clocks: ClocksInUse): string[] {
  return deploymentHeadNotes(layout, clocks.kind === 'fitted' ? clocks.report.headLines : undefined);
}

/** "Opened the deployment deployment.csv: 6 recorders, 13 files, 6 microphones, 82.0 s from 2025-05-17T05:09:50.000; 1 gap. ..." */
export function deploymentOpenedText(layout: DeploymentLayout): string {
  const files = layout.recorders.reduce((count, recorder) => count + recorder.files.length, 0);
  const gaps = layout.recorders.reduce((count, recorder) => count + recorder.gaps.length, 0);
  return `Opened the deployment ${layout.tableName}: ${layout.recorders.length} recorder${layout.recorders.length === 1 ? '' : 's'}, ${files} file${files === 1 ? '' : 's'}, ${layout.microphones.length} microphone${layout.microphones.length === 1 ? '' : 's'}, ${formatGapLength(layout.durationSeconds)} from ${formatLocalInstant(layout.origin, 3).replace('T', ' ')}; ${gaps === 0 ? 'no gaps' : `${gaps} gap${gaps === 1 ? '' : 's'}`}. It is read through the files' own clocks until you fit them (Clock fit).`;
}

/** What to do in the app when the worker refused a deployment, by the error's code (the core messages name command-line options). */
export function deploymentErrorHint(code: string | undefined): string {
  switch (code) {
    case 'no-start-time':
      return 'In the app, give the pattern in Open deployment… under "Start times in file names", or fill the table\'s start_time column.';
    case 'deployment-file-not-picked':
    case 'deployment-file-ambiguous':
    case 'file-open-failed':
      return 'Pick the folder that holds the table and every file it names (subfolders are included).';
    default:
      return '';
  }
}
