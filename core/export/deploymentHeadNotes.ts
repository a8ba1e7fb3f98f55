// The head lines of a deployment's survey log, the same from `whence locate --deployment` and from the app: the table,
// where the file start times came from, the gaps, then the clock fit's lines (core/deployment clockFitHeadLines) or none.
import { formatLocalInstant, type DeploymentLayout } from '../deployment';

/** Said when each recorder is read through its own file stamps (no clock fit). */
export const CLOCKS_NOT_FITTED_NOTE = 'clocks: not fitted (no calibration or shared-sound table): each recorder\'s file stamps taken as true';

/** `clockHeadLines`: the fit's head lines (core/deployment clockFitHeadLines), or undefined when the clocks are not fitted. */
export function deploymentHeadNotes(layout: Pick<DeploymentLayout, 'tableName' | 'origin' | 'recorders' | 'microphones'>, clockHeadLines?: readonly string[]): string[] {
  const files = layout.recorders.flatMap((recorder) => recorder.files);
  const sources = [...new Set(files.map((file) => file.startSource))].map((source) => `${files.filter((file) => file.startSource === source).length} from ${source}`);
  const gaps = layout.recorders.reduce((count, recorder) => count + recorder.gaps.length, 0);
  return [
    `deployment: ${layout.tableName}, ${layout.recorders.length} recorders, ${layout.microphones.length} microphones; time_s from its earliest start ${formatLocalInstant(layout.origin, 3)}`,
    `file start times: ${sources.join(', ')}; ${gaps} gap${gaps === 1 ? '' : 's'} between files (silent, flagged on the events they touch)`,
    ...(clockHeadLines === undefined ? [CLOCKS_NOT_FITTED_NOTE] : clockHeadLines),
  ];
}
