// The workspace controller: state (workspaceReducer) plus the asynchronous work around it — the host (files),
// the pipeline worker (recording, envelope, locate, correlations, spectrograms) and re-solving on edits.
import { useCallback, useEffect, useMemo, useReducer, useRef, useState } from 'react';
import type { WavInfo } from '../../core/audio';
import type { MenuCommand } from '../../core/contract';
import { envelopePreviewWorthwhile, type CorrelationPlots, type EnvelopePyramid, type Spectrogram, type SpectrogramRequest } from '../../core/overview';
import type { LocatedEvent, PipelineProgress, PipelineResult } from '../../core/pipeline';
import { emptyProjectDocument, parseArrayCsv, parseProjectDocument, sameRecording, type FixLogEntry, type ProjectArray, type ProjectDocument, type ProjectMedium, type ProjectSettings, type SitePicture } from '../../core/project';
import { fixLogExportText, fixLogFileName, openRecordingIdentity, type FixLogContext, type FixLogExport, type FixLogExportKind } from '../fixlog';
import { recoveryTimeText } from '../workspace/recoveryTime';
import { duplicateLocateQuestion, loggedFixesInSpan } from '../workspace/duplicateLocate';
import { exportFileName } from '../workspace/exportFileName';
import { surveyLogRunNotes } from '../../core/export';
import { pathBaseName, type ClockFitKind, type DeploymentClockReport } from '../../core/deployment';
import { conditionsQuestion, deploymentTableQuestion, discardWorkQuestion, reopenRecordingHint, staleFixesQuestion, type Question } from './questions';
import type { Host, OpenedRecording } from '../host';
import { pickFiles } from '../host/pickFiles';
import { PipelineBridge, WorkerCallError, type WorkerCall } from '../worker/bridge';
import type { SyncClocksParams, WorkerOpenResult } from '../worker/protocol';
import { chooseDeploymentTable, csvKindOfHead, deploymentSizeBytes, isAudioFileName, isCsvFileName, pickedPath, type PickedTable } from '../deployment/pickedFiles';
import { clockFitKindWords, clocksInUseText, clocksPhrase, type ClocksInUse } from '../deployment/clockFitRows';
import { deploymentLogNotes, deploymentOpenedText, deploymentErrorHint } from '../deployment/deploymentNotes';
import { fixLogContextOf, geometryOf, locateContext, locateReadiness, speedInUse, type SpeedInUse } from './derive';
import { resolveEvent } from './resolve';
import { runMenuCommand } from './menuCommands';
import { initialWorkspace, NEW_PROJECT_NAME, workspaceReducer, type WorkspaceState } from './workspace';
import { maxOf } from '../../core/units';

function message(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

/** The speed of sound of a medium, or the model's message when it gives none. */
function currentSpeed(medium: ProjectMedium): SpeedInUse | { error: string } {
  try {
    return speedInUse(medium);
  } catch (error) {
    return { error: message(error) };
  }
}

function createWorker(): Worker {
  return new Worker(new URL('../worker/pipelineWorker.ts', import.meta.url), { type: 'module' });
}

/** How a deployment is picked: a folder holding its table and files, or the table and its files picked together. */
export type DeploymentPick = 'folder' | 'files';

export type { PickedTable };

export interface WorkspaceController {
  state: WorkspaceState;
  speed: SpeedInUse | { error: string };
  correlations: CorrelationPlots | undefined;
  openRecording(): Promise<void>;
  /** Picks and opens a deployment; `nameTime` is the file-name time pattern (the command line's --name-time), if any. */
  openDeployment(how: DeploymentPick, nameTime: string | undefined): Promise<void>;
  /** Whether the Open deployment dialog is shown (the toolbar's button and the menu's Open deployment… show it). */
  deploymentDialogOpen: boolean;
  showDeploymentDialog(open: boolean): void;
  /** Calibration tables found beside the open deployment's table. */
  deploymentCalibrationTables: PickedTable[];
  /** Shared-sound tables found beside the open deployment's table. */
  deploymentSharedSoundTables: PickedTable[];
  /** Fits the open deployment's clocks from a calibration or (options.kind) shared-sound table ('pick': the user chooses the file now). */
  fitClocks(table: PickedTable | 'pick', options: { kind?: ClockFitKind; referenceRecorder?: string; searchSeconds?: number; offsetSigmaSeconds?: number }): Promise<void>;
  /** Back to each recorder's own file stamps. */
  clearClocks(): Promise<void>;
  openRecordingFile(file: File): Promise<void>;
  openArray(): Promise<void>;
  importArrayText(name: string, text: string): void;
  exportArray(text: string): Promise<void>;
  openProject(): Promise<void>;
  saveProject(saveAs: boolean): Promise<void>;
  openDemo(): Promise<void>;
  locateAll(): Promise<void>;
  locateSpan(startSeconds: number, endSeconds: number): Promise<void>;
  cancelWork(): void;
  setArray(array: ProjectArray): void;
  moveMicrophone(index: number, eastMeters: number, northMeters: number): void;
  setMedium(medium: ProjectMedium): void;
  setSettings(settings: ProjectSettings): void;
  /** Places, changes (opacity) or removes (undefined) the site picture under the map. */
  setSitePicture(sitePicture: SitePicture | undefined): void;
  selectEvent(index: number | undefined): void;
  selectSpan(startSeconds: number, endSeconds: number): void;
  logEvents(indices: number[]): void;
  updateFix(id: string, patch: { label?: string; note?: string; accepted?: boolean }): void;
  setFixes(fixes: FixLogEntry[]): void;
  selectFix(id: string | undefined): void;
  /** The accepted fixes of the log, written as the Fix log panel writes them. */
  exportLog(kind: FixLogExportKind): Promise<void>;
  exportText(name: string, text: string, kind: 'csv' | 'geojson' | 'json'): Promise<void>;
  requestSpectrogram(request: SpectrogramRequest): Promise<Spectrogram>;
  dismissNotice(id: number): void;
  restoreRecovery(): void;
  discardRecovery(): void;
  recoveryOffer: { savedAtIso: string; document: ProjectDocument } | undefined;
  /** A new, empty project (asks first when there are unsaved changes). */
  newProject(): Promise<void>;
  undo(): void;
  redo(): void;
  /** What Undo and Redo would do ("log 15 fixes"), undefined when there is nothing. */
  undoLabel: string | undefined;
  redoLabel: string | undefined;
  /** The question waiting for the user's answer (ConfirmDialog), if any. */
  question: Question | undefined;
  answerQuestion(choiceId: string): void;
  /** What the fix log's exports say about the run (undefined without a recording or a speed). */
  fixLogContext: FixLogContext | undefined;
}

export function useWorkspace(host: Host): WorkspaceController {
  const [state, dispatch] = useReducer(workspaceReducer, undefined, () => initialWorkspace(emptyProjectDocument('Untitled survey')));
  const stateRef = useRef(state);
  stateRef.current = state;
  const bridgeRef = useRef<PipelineBridge | undefined>(undefined);
  const recordingRef = useRef<OpenedRecording | undefined>(undefined);
  const workRef = useRef<WorkerCall<unknown> | undefined>(undefined);
  /** Spectrogram reads wait for a long recording's first overview, so they do not compete with its reads. */
  const previewShownRef = useRef<Promise<void>>(Promise.resolve());
  const [correlations, setCorrelations] = useState<CorrelationPlots | undefined>(undefined);
  const [recovery, setRecovery] = useState<{ document: ProjectDocument; savedAtIso: string; path?: string } | undefined>(undefined);

  const bridge = useCallback((): PipelineBridge => {
    if (bridgeRef.current === undefined) bridgeRef.current = new PipelineBridge(createWorker());
    return bridgeRef.current;
  }, []);
  useEffect(() => () => bridgeRef.current?.terminate(), []);

  const notify = useCallback((level: 'info' | 'warning' | 'error', text: string) => dispatch({ type: 'notice/add', level, text }), []);

  // One question at a time; a second one (rare) waits for the first to be answered.
  const [question, setQuestion] = useState<Question | undefined>(undefined);
  const answerRef = useRef<((choiceId: string) => void) | undefined>(undefined);
  const ask = useCallback((next: Question): Promise<string> => new Promise<string>((resolve) => {
    answerRef.current = resolve;
    setQuestion(next);
  }), []);
  const answerQuestion = useCallback((choiceId: string) => {
    const resolve = answerRef.current;
    answerRef.current = undefined;
    setQuestion(undefined);
    resolve?.(choiceId);
  }, []);

  const speed = useMemo(() => currentSpeed(state.document.medium), [state.document.medium]);
  // The head notes of the last locate run (as `whence locate` writes them), for the recording (and clocks) it ran over;
  // a deployment's head lines (its files and clocks, as `whence locate --deployment` writes them) come first.
  const [runNotes, setRunNotes] = useState<{ recordingName: string; clocks: ClocksInUse; notes: string[] } | undefined>(undefined);
  const fixLogContext = useMemo(() => {
    const context = fixLogContextOf({ document: state.document, recording: state.recording, events: state.events });
    if (context === undefined) return undefined;
    if (runNotes !== undefined && runNotes.recordingName === state.recording?.name && runNotes.clocks === state.clocks) return { ...context, runNotes: runNotes.notes };
    const deployment = state.recording?.deployment;
    return deployment === undefined ? context : { ...context, runNotes: deploymentLogNotes(deployment, state.clocks) };
  }, [state.document, state.recording, state.clocks, state.events, runNotes]);
  // Calibration tables picked with the open deployment (offered by the Clock fit panel).
  const [deploymentCalibrationTables, setDeploymentCalibrationTables] = useState<PickedTable[]>([]);
  const [deploymentSharedSoundTables, setDeploymentSharedSoundTables] = useState<PickedTable[]>([]);
  const [deploymentDialogOpen, showDeploymentDialog] = useState(false);

  /** The overview (envelope) of the open recording: a sampled one first for a long recording, then the exact one. */
  const buildOverview = useCallback(async (name: string, info: WavInfo): Promise<void> => {
    const worker = bridge();
    dispatch({ type: 'busy/set', busy: { label: `Overview of ${name}`, progress: 0 } });
    if (envelopePreviewWorthwhile(info.frameCount)) {
      // A long recording: a sampled overview within seconds, then the exact one from a pass over every frame.
      const preview = worker.call<EnvelopePyramid>('envelopePreview', {});
      workRef.current = preview;
      previewShownRef.current = preview.promise.then(() => undefined, () => undefined);
      dispatch({ type: 'envelope/done', envelope: await preview.promise });
    }
    const call = worker.call<EnvelopePyramid>('envelope', {}, (fraction) => {
      dispatch({ type: 'envelope/progress', fraction: fraction as number });
      dispatch({ type: 'busy/set', busy: { label: `Overview of ${name}`, progress: fraction as number } });
    });
    workRef.current = call;
    const envelope = await call.promise;
    dispatch({ type: 'envelope/done', envelope });
  }, [bridge]);

  const loadRecording = useCallback(async (opened: OpenedRecording): Promise<WavInfo | undefined> => {
    const previous = recordingRef.current;
    const worker = bridge();
    worker.setByteReader(opened.byteReader);
    const isDeployment = opened.workerSource.kind === 'deployment';
    dispatch({ type: 'busy/set', busy: { label: `Reading ${isDeployment ? 'the deployment ' : ''}${opened.name}`, progress: 0 } });
    let info: WavInfo;
    let contentHash: string;
    let deployment: WorkerOpenResult['deployment'];
    try {
      ({ info, contentHash, deployment } = await worker.call<WorkerOpenResult>('open', { source: opened.workerSource }).promise);
    } catch (error) {
      // The recording that was open stays open and in use.
      worker.setByteReader(previous?.byteReader);
      await opened.close().catch(() => undefined);
      dispatch({ type: 'busy/set', busy: undefined });
      const hint = isDeployment ? deploymentErrorHint(error instanceof WorkerCallError ? error.code : undefined) : '';
      notify('error', `${isDeployment ? 'The deployment ' : ''}${opened.name} could not be opened: ${message(error)}${hint === '' ? '' : ` ${hint}`} Your project and the recording in use are unchanged.`);
      return undefined;
    }
    recordingRef.current = opened;
    if (previous !== undefined && previous !== opened) await previous.close().catch(() => undefined);
    try {
      // Conditions set for another recording do not pass silently to this one (the demo's never do).
      const current = stateRef.current;
      const reference = current.document.recording;
      const identity = openRecordingIdentity({ name: opened.name, sizeBytes: opened.sizeBytes, info, contentHash });
      if (reference !== undefined && !sameRecording(reference, identity)) {
        if (current.fromDemo) {
          dispatch({ type: 'conditions/reset', leaveDemo: true });
          notify('info', `A new project for ${opened.name}: the demo's conditions, array and name are not carried over (set them for this recording). The demo's fixes stay in the log, each with its recording's name.`);
        } else if (await ask(conditionsQuestion(current.document, opened.name)) === 'reset') {
          dispatch({ type: 'conditions/reset', leaveDemo: false });
        }
      }
      dispatch({ type: 'recording/opened', name: opened.name, sizeBytes: opened.sizeBytes, info, contentHash, ...(deployment !== undefined ? { deployment } : {}) });
      if (deployment !== undefined) notify('info', deploymentOpenedText(deployment));
      const warnings = [...info.warnings, ...(deployment?.warnings ?? []).filter((warning) => !info.warnings.includes(warning))];
      for (const warning of warnings) notify('warning', `${opened.name}: ${warning}`);
      await buildOverview(opened.name, info);
      return info;
    } catch (error) {
      notify('error', `${opened.name} could not be opened: ${message(error)} Your project is unchanged.`);
      return undefined;
    } finally {
      workRef.current = undefined;
      dispatch({ type: 'busy/set', busy: undefined });
    }
  }, [bridge, notify, ask, buildOverview]);

  const locateAll = useCallback(async () => {
    const ready = locateReadiness(stateRef.current.document, stateRef.current.recording);
    if ('problems' in ready) { notify('warning', `Cannot locate yet: ${ready.problems.join(' ')}`); return; }
    const { context } = ready;
    dispatch({ type: 'busy/set', busy: { label: 'Finding and locating events', progress: 0 } });
    const call = bridge().call<PipelineResult>('run', { context }, (progress) => {
      const p = progress as PipelineProgress;
      dispatch({ type: 'busy/set', busy: { label: 'Finding and locating events', progress: p.fraction, detail: `${p.eventsFound} found, ${p.eventsLocated} located` } });
    });
    workRef.current = call as WorkerCall<unknown>;
    try {
      const result = await call.promise;
      dispatch({ type: 'events/replace', events: result.located });
      const { recording, clocks } = stateRef.current;
      if (recording !== undefined) setRunNotes({ recordingName: recording.name, clocks, notes: [...(recording.deployment !== undefined ? deploymentLogNotes(recording.deployment, clocks) : []), ...surveyLogRunNotes(result)] });
      const fixed = result.located.filter((l) => l.solve.status === 'ok').length;
      notify(result.cancelled ? 'warning' : 'info', `${result.cancelled ? 'Stopped: ' : ''}${result.eventsFound} event${result.eventsFound === 1 ? '' : 's'} found, ${fixed} ok.`);
      for (const warning of result.warnings) notify('warning', warning);
    } catch (error) {
      notify('error', `Locating failed: ${message(error)}`);
    } finally {
      workRef.current = undefined;
      dispatch({ type: 'busy/set', busy: undefined });
    }
  }, [bridge, notify]);

  const locateSpan = useCallback(async (startSeconds: number, endSeconds: number) => {
    const current = stateRef.current;
    const ready = locateReadiness(current.document, current.recording);
    if ('problems' in ready) { notify('warning', `Cannot locate yet: ${ready.problems.join(' ')}`); return; }
    // A span whose event is already logged: the user chooses to replace that fix or keep both (or not to locate).
    const span = { startSeconds, endSeconds };
    const duplicates = loggedFixesInSpan(current.document.fixes, current.recording === undefined ? undefined : openRecordingIdentity(current.recording), span);
    let replaceIds = new Set<string>();
    if (duplicates.length > 0) {
      const choice = await ask(duplicateLocateQuestion(duplicates, span));
      if (choice === 'cancel') return;
      if (choice === 'replace') replaceIds = new Set(duplicates.map((entry) => entry.id));
    }
    dispatch({ type: 'busy/set', busy: { label: 'Locating the selection', progress: 0.5 } });
    try {
      const index = Math.max(-1, maxOf(current.events.map((e) => e.event.index))) + 1;
      const located = await bridge().call<LocatedEvent>('locateSpan', { context: ready.context, startSeconds, endSeconds, index }).promise;
      if (replaceIds.size > 0) dispatch({ type: 'fixes/remove', ids: replaceIds });
      dispatch({ type: 'events/add', event: located });
      dispatch({ type: 'fixes/log-events', indices: [current.events.length] });
      notify(located.solve.status === 'ok' ? 'info' : 'warning', `Selection ${startSeconds.toFixed(2)}-${endSeconds.toFixed(2)} s: ${located.solve.status}${located.solve.status === 'ok' ? '' : ` (${located.solve.warnings[0] ?? 'no fix'})`}; ${replaceIds.size > 0 ? `it replaces the logged fix of event ${duplicates.map((entry) => entry.eventIndex + 1).join(', ')} in the log` : duplicates.length > 0 ? 'added to the log beside the one already there' : 'added to the log'}.`);
    } catch (error) {
      notify('error', `Locating the selection failed: ${message(error)}`);
    } finally {
      dispatch({ type: 'busy/set', busy: undefined });
    }
  }, [bridge, notify, ask]);

  // Re-solve the located events whenever the array, the medium or the settings change (delays stay as measured):
  // the selected event at once, the others just after (a pending batch is replaced by the next change only).
  const solveKey = useRef<unknown[]>([]);
  const solveTimer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);
  useEffect(() => {
    const key = [state.document.array, state.document.medium, state.document.settings];
    const changed = key.some((part, i) => part !== solveKey.current[i]);
    solveKey.current = key;
    if (!changed || state.events.length === 0 || state.recording === undefined || 'error' in speed) return;
    const context = locateContext(state.document, speed, state.recording.deployment);
    const fs = state.recording.info.sampleRateHz;
    const selected = state.selectedEventIndex;
    if (selected !== undefined && state.events[selected] !== undefined) {
      dispatch({ type: 'events/resolved', solves: [{ index: selected, solve: resolveEvent(state.events[selected]!, context, fs) }] });
    }
    if (solveTimer.current !== undefined) clearTimeout(solveTimer.current);
    solveTimer.current = setTimeout(() => {
      solveTimer.current = undefined;
      dispatch({ type: 'events/resolved', solves: stateRef.current.events.map((located, index) => ({ index, solve: resolveEvent(located, context, fs) })) });
    }, 120);
  }, [state.document, state.events, state.recording, state.selectedEventIndex, speed]);
  useEffect(() => () => { if (solveTimer.current !== undefined) clearTimeout(solveTimer.current); }, []);

  // Correlation plots of the selected event.
  useEffect(() => {
    const located = state.selectedEventIndex === undefined ? undefined : state.events[state.selectedEventIndex];
    if (located === undefined || 'error' in speed || state.recording === undefined) { setCorrelations(undefined); return; }
    let live = true;
    const usedPairs = located.reduced.droppedPairs.length === 0 ? undefined : located.pairs.filter((p) => !located.reduced.droppedPairs.some((d) => d.indexA === p.indexA && d.indexB === p.indexB)).map((p) => `${p.indexA}-${p.indexB}`);
    bridge().call<CorrelationPlots>('correlations', { context: locateContext(stateRef.current.document, speed, stateRef.current.recording?.deployment), startSeconds: located.windowStartSeconds, endSeconds: located.windowEndSeconds, bandHz: located.bandHz, usedPairs, ...(located.firstArrivalSeconds !== undefined ? { atSeconds: located.firstArrivalSeconds } : {}), channelSeconds: located.event.onsetSeconds }).promise.then(
      (plots) => { if (live) setCorrelations(plots); },
      (error: unknown) => { if (live) { setCorrelations(undefined); notify('warning', `Correlation plots: ${message(error)}`); } },
    );
    return () => { live = false; };
  }, [state.selectedEventIndex, state.events, state.recording, speed, bridge, notify]);

  // Keep a recovery copy of unsaved work; never while an older copy is on offer (it survives until the user chose).
  const offerPending = recovery !== undefined;
  useEffect(() => {
    if (!state.dirty || offerPending) return;
    const timer = setTimeout(() => { void host.writeRecoveryCopy(stateRef.current.document, stateRef.current.projectPath).catch(() => undefined); }, 1500);
    return () => clearTimeout(timer);
  }, [state.document, state.dirty, host, offerPending]);

  const importArrayText = useCallback((name: string, text: string) => {
    try {
      const geometry = parseArrayCsv(text, name);
      const array: ProjectArray = { microphones: geometry.microphones, sourceName: name };
      if (geometry.origin !== undefined) array.origin = geometry.origin;
      dispatch({ type: 'array/set', array });
      notify('info', `Read ${geometry.microphones.length} microphones from ${name}.`);
      for (const warning of geometry.warnings) notify('warning', warning);
    } catch (error) {
      notify('error', `${message(error)} The array in use is unchanged.`);
    }
  }, [notify]);

  /** Before `what` replaces the document: true to go on (after a save, or a discard the user chose), false to stay. */
  const mayReplaceWork = useCallback(async (what: string): Promise<boolean> => {
    const current = stateRef.current;
    if (!current.dirty) return true;
    const choice = await ask(discardWorkQuestion(current.document, what));
    if (choice === 'cancel') return false;
    if (choice === 'discard') return true;
    try {
      const saved = await host.saveProject(current.document, current.projectPath, false);
      if (saved === null) return false;
      dispatch({ type: 'project/saved', path: saved.path });
      await host.discardRecoveryCopy().catch(() => undefined);
      notify('info', saved.message);
      return true;
    } catch (error) {
      notify('error', `Not saved: ${message(error)} Your work is still here and the previous file is intact.`);
      return false;
    }
  }, [ask, host, notify]);

  const startDemo = useCallback(async () => {
    try {
      dispatch({ type: 'busy/set', busy: { label: 'Opening the demo', progress: 0 } });
      const demo = await host.openDemo();
      const document = parseProjectDocument(demo.project.text, demo.project.name);
      dispatch({ type: 'document/replace', document, path: undefined, dirty: false, fromDemo: true });
      const info = await loadRecording(demo.recording);
      if (info !== undefined) await locateAll();
    } catch (error) {
      dispatch({ type: 'busy/set', busy: undefined });
      notify('error', `The demo could not be opened: ${message(error)}`);
    }
  }, [host, loadRecording, locateAll, notify]);

  const openDemo = useCallback(async () => {
    if (await mayReplaceWork('open the demo')) await startDemo();
  }, [mayReplaceWork, startDemo]);

  // On start: offer the recovery copy if the last session ended unsaved (and nothing else until the user chose), else open the demo.
  const started = useRef(false);
  useEffect(() => {
    if (started.current) return;
    started.current = true;
    void host.takeRecoveryCopy().then((copy) => {
      if (copy !== null) setRecovery(copy);
      else void startDemo();
    }, () => void startDemo());
  }, [host, startDemo]);

  const exportText = useCallback(async (name: string, text: string, kind: 'csv' | 'geojson' | 'json') => {
    try {
      const where = await host.exportText(name, text, kind);
      if (where !== null) notify('info', `Exported ${where}.`);
    } catch (error) {
      notify('error', `Export failed: ${message(error)} Nothing was overwritten.`);
    }
  }, [host, notify]);

  const exportLog = useCallback(async (kind: FixLogExportKind) => {
    if (fixLogContext === undefined) { notify('warning', 'Open a recording and set a valid medium before exporting the log.'); return; }
    let result: FixLogExport;
    try {
      result = fixLogExportText(kind, stateRef.current.document.fixes, fixLogContext);
    } catch (error) {
      notify('error', `The log could not be written: ${message(error)}`);
      return;
    }
    if (!result.ok) { notify('warning', result.message); return; }
    await exportText(fixLogFileName(kind, stateRef.current.document.name, new Date()), result.text, kind);
  }, [exportText, notify, fixLogContext]);

  /** After the clocks changed: the overview again, a warning about logged fixes of the old clocks, and the events located again. */
  const afterClocksChanged = useCallback(async (before: ClocksInUse, after: ClocksInUse, hadEvents: boolean) => {
    const current = stateRef.current;
    const recording = current.recording;
    if (recording === undefined) return;
    const identity = openRecordingIdentity(recording);
    const stale = current.document.fixes.filter((entry) => sameRecording(entry.recording, identity));
    if (stale.length > 0) {
      const choice = await ask(staleFixesQuestion(stale.length, recording.name, clocksPhrase(before), clocksPhrase(after)));
      if (choice === 'remove') {
        dispatch({ type: 'fixes/remove', ids: new Set(stale.map((entry) => entry.id)) });
        notify('info', `Removed ${stale.length} fix${stale.length === 1 ? '' : 'es'} of ${recording.name} located with ${clocksPhrase(before)} from the log (Undo brings them back).`);
      } else {
        notify('warning', `The fix log keeps ${stale.length} fix${stale.length === 1 ? '' : 'es'} of ${recording.name} located with ${clocksPhrase(before)}, not ${clocksPhrase(after)} now in use: they are not moved. Log the fixes located again and delete the old ones when you are sure.`);
      }
    }
    try {
      await buildOverview(recording.name, recording.info);
    } catch (error) {
      notify('warning', `The overview could not be redrawn: ${message(error)}`);
    } finally {
      workRef.current = undefined;
      dispatch({ type: 'busy/set', busy: undefined });
    }
    if (hadEvents) {
      notify('info', `Locating again through ${clocksPhrase(after)}: the events found through ${clocksPhrase(before)} are gone.`);
      await locateAll();
    }
  }, [ask, buildOverview, locateAll, notify]);

  const openDeployment = useCallback(async (how: DeploymentPick, nameTime: string | undefined) => {
    // the file input first, while the click that asked for it still counts as the user's
    const files = await pickFiles(how === 'folder' ? { directory: true, testId: 'deployment-folder-input' } : { multiple: true, accept: '.csv,.wav,.rf64,.bw64,text/csv,audio/wav,audio/x-wav', testId: 'deployment-files-input' });
    if (files === null) return;
    const unchanged = 'Nothing was opened; your project and the recording in use are unchanged.';
    try {
      const folderName = how === 'folder' ? files[0]?.webkitRelativePath.split('/')[0] : undefined;
      const what = folderName !== undefined && folderName !== '' ? `The folder ${folderName}` : 'The files you picked';
      const audio = files.filter((file) => isAudioFileName(file.name)).map((file) => ({ path: pickedPath(file.name, file.webkitRelativePath), blob: file as Blob }));
      const csvs = await Promise.all(files.filter((file) => isCsvFileName(file.name)).map(async (file) => {
        const text = await file.text();
        return { path: pickedPath(file.name, file.webkitRelativePath), name: file.name, text, kind: csvKindOfHead(text) };
      }));
      const choice = chooseDeploymentTable(csvs, audio.length, what);
      if (choice.kind === 'none') { notify('error', `${choice.message} ${unchanged}`); return; }
      let tablePath = choice.kind === 'one' ? choice.path : undefined;
      if (choice.kind === 'ask') {
        const answer = await ask(deploymentTableQuestion(choice.paths, what));
        if (!answer.startsWith('table:')) return;
        tablePath = answer.slice('table:'.length);
      }
      const table = csvs.find((csv) => csv.path === tablePath)!;
      if (audio.length === 0) {
        notify('error', `${what} holds the deployment table ${table.path} but no WAV files. Pick the folder that holds the recorders' files too, or pick the table and its WAV files together. ${unchanged}`);
        return;
      }
      const sizeBytes = deploymentSizeBytes(table, audio.map((file) => ({ path: file.path, sizeBytes: file.blob.size }))) ?? audio.reduce((sum, file) => sum + file.blob.size, 0);
      const opened: OpenedRecording = {
        name: pathBaseName(table.path), sizeBytes,
        workerSource: { kind: 'deployment', table: { name: table.path, text: table.text }, files: audio, ...(nameTime !== undefined ? { nameTime } : {}) },
        close: () => Promise.resolve(),
      };
      const info = await loadRecording(opened);
      if (info === undefined) return;
      setDeploymentCalibrationTables(csvs.filter((csv) => csv.kind === 'calibration').map((csv) => ({ name: csv.path, text: csv.text })));
      setDeploymentSharedSoundTables(csvs.filter((csv) => csv.kind === 'shared-sounds').map((csv) => ({ name: csv.path, text: csv.text })));
      // An empty array (a new project, or after the demo) takes the array table picked with the deployment.
      const arrays = csvs.filter((csv) => csv.kind === 'array');
      if (stateRef.current.document.array.microphones.length === 0 && arrays.length === 1) importArrayText(arrays[0]!.path, arrays[0]!.text);
      else if (arrays.length > 0) notify('info', `${what} also holds ${arrays.map((csv) => csv.path).join(', ')}; the project's array is kept. Open ${arrays.length === 1 ? 'it' : 'one'} with Open array if it is this deployment's.`);
    } catch (error) {
      dispatch({ type: 'busy/set', busy: undefined });
      notify('error', `The deployment could not be opened: ${message(error)} ${unchanged}`);
    }
  }, [ask, importArrayText, loadRecording, notify]);

  const fitClocks = useCallback(async (source: PickedTable | 'pick', options: { kind?: ClockFitKind; referenceRecorder?: string; searchSeconds?: number; offsetSigmaSeconds?: number }) => {
    const kind = options.kind ?? 'calibration';
    let table = source;
    if (table === 'pick') {
      const files = await pickFiles({ accept: '.csv,.txt,text/csv', testId: kind === 'calibration' ? 'calibration-file-input' : 'shared-sounds-file-input' });
      if (files === null) return;
      table = { name: files[0]!.name, text: await files[0]!.text() };
    }
    const current = stateRef.current;
    const unchanged = `The clocks in use are unchanged (${clocksInUseText(current.clocks)}).`;
    if (current.recording?.deployment === undefined) { notify('warning', 'Open a deployment first (Open deployment…): the clock fit is for separate recorders.'); return; }
    const speedNow = currentSpeed(current.document.medium);
    if ('error' in speedNow) { notify('warning', `The clock fit needs the speed of sound: ${speedNow.error} Correct it in Settings. ${unchanged}`); return; }
    if (current.document.array.microphones.length === 0) { notify('warning', `The clock fit needs the array (the microphones' positions, labelled as in the deployment table): open the array table first. ${unchanged}`); return; }
    const before = current.clocks;
    const hadEvents = current.events.length > 0;
    dispatch({ type: 'busy/set', busy: { label: `Fitting the clocks from ${table.name}`, progress: 0.5 } });
    const common = {
      geometry: geometryOf(current.document), speedMetersPerSecond: speedNow.speedMetersPerSecond,
      ...(options.referenceRecorder !== undefined ? { referenceRecorder: options.referenceRecorder } : {}),
      ...(options.searchSeconds !== undefined ? { searchSeconds: options.searchSeconds } : {}),
    };
    const params: SyncClocksParams = kind === 'calibration'
      ? { ...common, calibration: table }
      : { ...common, sharedSounds: table, ...(options.offsetSigmaSeconds !== undefined ? { offsetSigmaSeconds: options.offsetSigmaSeconds } : {}) };
    const band = current.document.settings.bandHz;
    if (band !== 'automatic') params.bandHz = band;
    let report: DeploymentClockReport;
    try {
      const call = bridge().call<DeploymentClockReport>('syncClocks', params);
      workRef.current = call as WorkerCall<unknown>;
      report = await call.promise;
    } catch (error) {
      notify('error', `The clock fit from ${table.name} failed: ${message(error)} ${unchanged}`);
      return;
    } finally {
      workRef.current = undefined;
      dispatch({ type: 'busy/set', busy: undefined });
    }
    const after: ClocksInUse = { kind: 'fitted', report };
    dispatch({ type: 'clocks/set', clocks: after });
    const poor = report.recorders.filter((r) => r.warning !== undefined).map((r) => r.name);
    notify(poor.length > 0 ? 'warning' : 'info', `Clocks fitted from ${table.name}: ${report.recorders.length} recorders, ${report.sounds.length} ${clockFitKindWords(report.kind).sounds}${poor.length > 0 ? `; poor fit for ${poor.join(', ')} (see Clock fit)` : ''}. The deployment is now read through them.`);
    for (const warning of report.warnings) notify('warning', `Clock fit: ${warning}`);
    await afterClocksChanged(before, after, hadEvents);
  }, [afterClocksChanged, bridge, notify]);

  const clearClocks = useCallback(async () => {
    const current = stateRef.current;
    if (current.recording?.deployment === undefined || current.clocks.kind === 'files') return;
    const before = current.clocks;
    const hadEvents = current.events.length > 0;
    try {
      await bridge().call<null>('clearClocks', {}).promise;
    } catch (error) {
      notify('error', `Could not go back to the files' own clocks: ${message(error)} The clocks in use are unchanged (${clocksInUseText(before)}).`);
      return;
    }
    const after: ClocksInUse = { kind: 'files' };
    dispatch({ type: 'clocks/set', clocks: after });
    notify('info', `The deployment is read through the files' own clocks again (each recorder's file stamps taken as true).`);
    await afterClocksChanged(before, after, hadEvents);
  }, [afterClocksChanged, bridge, notify]);

  const controller: WorkspaceController = {
    state,
    speed,
    correlations,
    recoveryOffer: recovery,
    fixLogContext,
    openDeployment,
    deploymentDialogOpen,
    showDeploymentDialog,
    deploymentCalibrationTables,
    deploymentSharedSoundTables,
    fitClocks,
    clearClocks,
    async openRecording() {
      try {
        const opened = await host.openRecording();
        if (opened !== null) await loadRecording(opened);
      } catch (error) {
        notify('error', message(error));
      }
    },
    async openRecordingFile(file) {
      try {
        await loadRecording(await host.openRecordingFile(file));
      } catch (error) {
        notify('error', message(error));
      }
    },
    async openArray() {
      try {
        const file = await host.openArrayFile();
        if (file !== null) importArrayText(file.name, file.text);
      } catch (error) {
        notify('error', message(error));
      }
    },
    importArrayText,
    exportArray: (text) => exportText(exportFileName(stateRef.current.document.name, 'array', 'csv', new Date()), text, 'csv'),
    async openProject() {
      try {
        if (!(await mayReplaceWork('open a project'))) return;
        const opened = await host.openProject();
        if (opened === null) return;
        dispatch({ type: 'document/replace', document: opened.document, path: opened.path, dirty: false });
        if (opened.note !== undefined) notify('info', opened.note);
        notify('info', `Opened the project ${opened.document.name}. ${reopenRecordingHint(opened.document.recording)}`);
      } catch (error) {
        notify('error', `${message(error)} The project in use is unchanged.`);
      }
    },
    async saveProject(saveAs) {
      try {
        const saved = await host.saveProject(stateRef.current.document, stateRef.current.projectPath, saveAs);
        if (saved === null) return;
        dispatch({ type: 'project/saved', path: saved.path });
        await host.discardRecoveryCopy().catch(() => undefined);
        notify('info', saved.message);
      } catch (error) {
        notify('error', `Not saved: ${message(error)} Your work is still here and the previous file is intact.`);
      }
    },
    openDemo,
    locateAll,
    locateSpan,
    cancelWork: () => workRef.current?.cancel(),
    setArray: (array) => dispatch({ type: 'array/set', array }),
    moveMicrophone(index, eastMeters, northMeters) {
      const array = stateRef.current.document.array;
      const microphones = array.microphones.map((m, i) => (i === index ? { ...m, eastMeters, northMeters } : m));
      dispatch({ type: 'array/set', array: { ...array, microphones } });
    },
    setMedium: (medium) => dispatch({ type: 'medium/set', medium }),
    setSettings: (settings) => dispatch({ type: 'settings/set', settings }),
    setSitePicture: (sitePicture) => dispatch({ type: 'sitePicture/set', sitePicture }),
    selectEvent: (index) => dispatch({ type: 'event/select', index }),
    selectSpan: (startSeconds, endSeconds) => dispatch({ type: 'selection/set', selection: { startSeconds, endSeconds } }),
    logEvents: (indices) => dispatch({ type: 'fixes/log-events', indices }),
    updateFix: (id, patch) => dispatch({ type: 'fix/update', id, patch }),
    setFixes: (fixes) => dispatch({ type: 'fixes/set', fixes }),
    selectFix: (id) => dispatch({ type: 'fix/select', id }),
    exportLog,
    exportText,
    requestSpectrogram: (request) => previewShownRef.current.then(() => bridge().call<Spectrogram>('spectrogram', { request }).promise),
    dismissNotice: (id) => dispatch({ type: 'notice/dismiss', id }),
    restoreRecovery() {
      if (recovery === undefined) return;
      dispatch({ type: 'document/replace', document: recovery.document, path: recovery.path, dirty: true });
      setRecovery(undefined);
      notify('info', `Restored the unsaved work from ${recoveryTimeText(recovery.savedAtIso)}. ${reopenRecordingHint(recovery.document.recording)} Save it.`);
    },
    discardRecovery() {
      setRecovery(undefined);
      void host.discardRecoveryCopy().catch(() => undefined).then(() => startDemo());
    },
    async newProject() {
      if (!(await mayReplaceWork('start a new project'))) return;
      dispatch({ type: 'document/replace', document: emptyProjectDocument(NEW_PROJECT_NAME), path: undefined, dirty: false });
      notify('info', 'A new project: open a recording and its array, set the conditions, then Find & locate.');
    },
    undo: () => dispatch({ type: 'edit/undo' }),
    redo: () => dispatch({ type: 'edit/redo' }),
    undoLabel: state.history.undo[state.history.undo.length - 1]?.label,
    redoLabel: state.history.redo[state.history.redo.length - 1]?.label,
    question,
    answerQuestion,
  };

  useEffect(() => host.onMenuCommand((command: MenuCommand) => { runMenuCommand(command, controller); }));

  // Ctrl+Z / Ctrl+Shift+Z (and Ctrl+Y; Cmd on macOS) undo and redo array and log edits, except while typing in a field,
  // where they keep undoing the text.
  useEffect(() => {
    function onKey(event: KeyboardEvent) {
      if (!(event.ctrlKey || event.metaKey) || event.altKey) return;
      const target = event.target as HTMLElement | null;
      if (target !== null && (target.isContentEditable || target.tagName === 'TEXTAREA' || target.tagName === 'SELECT' || (target.tagName === 'INPUT' && !['checkbox', 'radio', 'button'].includes((target as HTMLInputElement).type)))) return;
      const key = event.key.toLowerCase();
      if (key === 'z' && !event.shiftKey) dispatch({ type: 'edit/undo' });
      else if ((key === 'z' && event.shiftKey) || key === 'y') dispatch({ type: 'edit/redo' });
      else return;
      event.preventDefault();
    }
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, []);

  return controller;
}
