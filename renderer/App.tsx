// The workspace: a toolbar, the array and conditions on the left, the map with the recording and correlations in
// the middle, the sounds found and the survey log on the right. Heavy work runs in the pipeline worker.
import { useMemo, useState, type DragEvent } from 'react';
import { WHENCE_VERSION } from '../core/version';
import { locatedVerdict } from '../core/pipeline';
import { CorrelationsView } from './correlations';
import { FixLogPanel, fixLogFileName, loggedEventIndices, openRecordingIdentity } from './fixlog';
import { detectHost } from './host';
import { MapView } from './map';
import { MicrophonesPanel } from './microphones';
import { CautionsPanel } from './panels/CautionsPanel';
import { RecordingView } from './recording';
import { SettingsPanel } from './settings';
import { useWorkspace } from './state/useWorkspace';
import { EventsPanel } from './workspace/EventsPanel';
import { ConfirmDialog } from './workspace/ConfirmDialog';
import { mapFixes, mapHyperbolae, mapMicrophones, meanUpMeters, planeHeightMeters, precisionOverlay, srpOverlay } from './workspace/mapModel';
import { Toolbar } from './workspace/Toolbar';
import { NoticeBar } from './workspace/NoticeBar';

type SideTab = 'microphones' | 'conditions';
type BottomTab = 'recording' | 'correlations' | 'safety';

const host = detectHost();

export function App() {
  const workspace = useWorkspace(host);
  const { state } = workspace;
  const [sideTab, setSideTab] = useState<SideTab>('microphones');
  const [bottomTab, setBottomTab] = useState<BottomTab>('recording');
  const [overlayKind, setOverlayKind] = useState<'none' | 'precision' | 'srp'>('none');
  const speedMetersPerSecond = 'error' in workspace.speed ? 343 : workspace.speed.speedMetersPerSecond;
  const selected = state.selectedEventIndex === undefined ? undefined : state.events[state.selectedEventIndex];

  const microphones = useMemo(() => mapMicrophones(state.document), [state.document]);
  const settingsValue = useMemo(() => ({ medium: state.document.medium, settings: state.document.settings }), [state.document.medium, state.document.settings]);
  const meanUp = useMemo(() => meanUpMeters(state.document.array.microphones), [state.document.array.microphones]);
  const hyperbolae = useMemo(() => mapHyperbolae(selected), [selected]);
  const verdicts = useMemo(() => state.events.map((located) => locatedVerdict(located, state.document.array)), [state.events, state.document.array]);
  const fixes = useMemo(() => mapFixes(state.events, state.selectedEventIndex, verdicts), [state.events, state.selectedEventIndex, verdicts]);
  const planeUp = planeHeightMeters(state.document, selected);
  const overlay = useMemo(() => {
    if (overlayKind === 'precision') return precisionOverlay(state.document, speedMetersPerSecond);
    if (overlayKind === 'srp') return srpOverlay(state.document, workspace.correlations, speedMetersPerSecond, planeUp);
    return undefined;
  }, [overlayKind, state.document, speedMetersPerSecond, workspace.correlations, planeUp]);
  const logged = useMemo(() => loggedEventIndices(state.document.fixes, state.recording === undefined ? undefined : openRecordingIdentity(state.recording), state.events), [state.document.fixes, state.recording, state.events]);
  const recordingEvents = useMemo(() => state.events.map((located, index) => ({ index, startSeconds: located.windowStartSeconds, endSeconds: located.windowEndSeconds, status: located.solve.status, selected: index === state.selectedEventIndex })), [state.events, state.selectedEventIndex]);
  const channelLabels = useMemo(() => {
    const count = state.recording?.info.channelCount ?? 0;
    return Array.from({ length: count }, (_, channel) => state.document.array.microphones.find((m) => m.channel === channel + 1)?.label ?? `ch ${channel + 1}`);
  }, [state.recording, state.document.array.microphones]);

  function onDrop(event: DragEvent<HTMLDivElement>) {
    event.preventDefault();
    for (const file of Array.from(event.dataTransfer.files)) {
      const name = file.name.toLowerCase();
      if (/\.(wav|rf64|bw64)$/.test(name)) void workspace.openRecordingFile(file);
      else if (/\.(csv|txt)$/.test(name)) void host.readTextFile(file).then((text) => workspace.importArrayText(text.name, text.text), (error: unknown) => workspace.importArrayText(file.name, String(error)));
      else workspace.importArrayText(file.name, '');
    }
  }

  return (
    <div className="workspace" onDragOver={(event) => event.preventDefault()} onDrop={onDrop}>
      <Toolbar
        projectName={state.document.name}
        dirty={state.dirty}
        hostDescription={host.kind === 'web' ? `web ${WHENCE_VERSION}` : host.description}
        busy={state.busy}
        canLocate={state.recording !== undefined}
        selection={state.selection}
        undoLabel={workspace.undoLabel}
        redoLabel={workspace.redoLabel}
        onNewProject={() => void workspace.newProject()}
        onUndo={workspace.undo}
        onRedo={workspace.redo}
        onOpenRecording={() => void workspace.openRecording()}
        onOpenArray={() => void workspace.openArray()}
        onOpenProject={() => void workspace.openProject()}
        onSave={() => void workspace.saveProject(false)}
        onDemo={() => void workspace.openDemo()}
        onLocateAll={() => void workspace.locateAll()}
        onLocateSelection={() => { if (state.selection) void workspace.locateSpan(state.selection.startSeconds, state.selection.endSeconds); }}
        onCancel={workspace.cancelWork}
      />
      <NoticeBar notices={state.notices} onDismiss={workspace.dismissNotice} recoveryOffer={workspace.recoveryOffer} onRestore={workspace.restoreRecovery} onDiscard={workspace.discardRecovery} />
      <div className="workspace-body">
        <aside className="side">
          <nav className="tabs" role="tablist">
            <button type="button" role="tab" aria-selected={sideTab === 'microphones'} onClick={() => setSideTab('microphones')} data-testid="tab-microphones">Microphones</button>
            <button type="button" role="tab" aria-selected={sideTab === 'conditions'} onClick={() => setSideTab('conditions')} data-testid="tab-conditions">Conditions</button>
          </nav>
          <div className="tab-body">
            {sideTab === 'microphones' ? (
              <MicrophonesPanel
                microphones={state.document.array.microphones}
                origin={state.document.array.origin}
                recordingChannelCount={state.recording?.info.channelCount}
                onChange={(list, origin) => workspace.setArray({ ...state.document.array, microphones: list, ...(origin !== undefined ? { origin } : {}) })}
                onImportArray={() => void workspace.openArray()}
                onExportArray={(text) => void workspace.exportArray(text)}
              />
            ) : (
              <SettingsPanel value={settingsValue} meanMicrophoneUpMeters={meanUp} onChange={(next) => { if (next.medium !== state.document.medium) workspace.setMedium(next.medium); if (next.settings !== state.document.settings) workspace.setSettings(next.settings); }} />
            )}
          </div>
        </aside>
        <main className="centre">
          <section className="map-area" aria-label="Map">
            <label className="map-toggle">layer{' '}
              <select value={overlayKind} onChange={(event) => setOverlayKind(event.target.value as 'none' | 'precision' | 'srp')} data-testid="map-layer">
                <option value="none">none</option>
                <option value="precision">precision of the array</option>
                <option value="srp">SRP-PHAT of the selected sound</option>
              </select>
            </label>
            <MapView
              microphones={microphones}
              hyperbolae={hyperbolae}
              speedMetersPerSecond={speedMetersPerSecond}
              planeUpMeters={planeUp}
              fixes={fixes}
              {...(overlay !== undefined ? { overlay } : {})}
              {...(state.document.array.origin !== undefined ? { origin: state.document.array.origin } : {})}
              editable
              onMoveMicrophone={workspace.moveMicrophone}
              onSelectFix={(id) => workspace.selectEvent(Number(id.replace('event-', '')))}
            />
          </section>
          <section className="bottom-area">
            <nav className="tabs" role="tablist">
              <button type="button" role="tab" aria-selected={bottomTab === 'recording'} onClick={() => setBottomTab('recording')} data-testid="tab-recording">Recording</button>
              <button type="button" role="tab" aria-selected={bottomTab === 'correlations'} onClick={() => setBottomTab('correlations')} data-testid="tab-correlations">Correlations</button>
              <button type="button" role="tab" aria-selected={bottomTab === 'safety'} onClick={() => setBottomTab('safety')} data-testid="tab-safety">Safety &amp; about</button>
            </nav>
            <div className="tab-body">
              {bottomTab === 'recording' && (state.recording !== undefined ? (
                <RecordingView
                  info={{ name: state.recording.name, channelCount: state.recording.info.channelCount, sampleRateHz: state.recording.info.sampleRateHz, frameCount: state.recording.info.frameCount, durationSeconds: state.recording.info.durationSeconds, ...(state.recording.info.startTime ? { startTimeIso: state.recording.info.startTime.isoLocal } : {}) }}
                  channelLabels={channelLabels}
                  envelope={state.envelope}
                  {...(state.envelopeProgress !== undefined ? { envelopeProgress: state.envelopeProgress } : {})}
                  events={recordingEvents}
                  {...(state.selection ? { selection: state.selection } : {})}
                  requestSpectrogram={(startSeconds, endSeconds, widthPixels, heightPixels) => workspace.requestSpectrogram({ startSeconds, endSeconds, widthPixels, heightPixels })}
                  onSelectSpan={workspace.selectSpan}
                  onLocateSpan={(start, end) => void workspace.locateSpan(start, end)}
                  onSelectEvent={workspace.selectEvent}
                />
              ) : <p className="muted empty">No recording open. Open one from the toolbar or drop a WAV file here.</p>)}
              {bottomTab === 'correlations' && (selected !== undefined && workspace.correlations !== undefined ? (
                <CorrelationsView pairs={workspace.correlations.pairs} autocorrelations={workspace.correlations.autocorrelations} bandHz={selected.bandHz} weighting={state.document.settings.weighting} />
              ) : <p className="muted empty">Select a sound to see its correlations.</p>)}
              {bottomTab === 'safety' && <CautionsPanel />}
            </div>
          </section>
        </main>
        <aside className="side right">
          <EventsPanel events={state.events} verdicts={verdicts} selectedIndex={state.selectedEventIndex} loggedEventIndices={logged} onSelect={workspace.selectEvent} onLog={workspace.logEvents} />
          <FixLogPanel
            entries={state.document.fixes}
            {...(state.selectedFixId !== undefined ? { selectedId: state.selectedFixId } : {})}
            context={workspace.fixLogContext}
            onChange={workspace.setFixes}
            onSelect={workspace.selectFix}
            onExport={(kind, text) => void workspace.exportText(fixLogFileName(kind), text, kind)}
          />
        </aside>
      </div>
      <ConfirmDialog question={workspace.question} onAnswer={workspace.answerQuestion} />
    </div>
  );
}
