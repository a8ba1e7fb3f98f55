// The workspace: a toolbar, the array and settings on the left, the map (the largest panel), the recording and
// correlations under both, the events and the fix log on the right; panels resize and collapse. Work runs in the pipeline worker.
import { useEffect, useMemo, useRef, useState, type DragEvent } from 'react';
import { WHENCE_VERSION } from '../core/version';
import { locatedVerdict } from '../core/pipeline';
import { CorrelationsView } from './correlations';
import { ClockFitPanel, OpenDeploymentDialog, RecordersTimeline } from './deployment';
import { FixLogPanel, fixLogFileName, loggedEventIndices, openRecordingIdentity } from './fixlog';
import { detectHost } from './host';
import { MapView } from './map';
import { MicrophonesPanel } from './microphones';
import { CautionsPanel } from './panels/CautionsPanel';
import { RecordingView, type ViewSpan } from './recording';
import { SettingsPanel } from './settings';
import { SitePictureControl, useSitePictureImage } from './sitePicture';
import { useWorkspace } from './state/useWorkspace';
import { EventsPanel } from './workspace/EventsPanel';
import { ConfirmDialog } from './workspace/ConfirmDialog';
import { mapFixes, mapHyperbolae, mapMicrophones, meanUpMeters, planeHeightMeters, precisionOverlay, srpOverlay } from './workspace/mapModel';
import { Toolbar } from './workspace/Toolbar';
import { NoticeBar } from './workspace/NoticeBar';
import { clampPanelLayout, defaultPanelLayout, panelGridTracks, type PanelLayout } from './workspace/panelLayout';
import { Splitter } from './workspace/Splitter';

type SideTab = 'microphones' | 'settings';
type BottomTab = 'recording' | 'clocks' | 'correlations' | 'safety';

const host = detectHost();

function windowSize(): { widthPixels: number; heightPixels: number } {
  return { widthPixels: window.innerWidth, heightPixels: window.innerHeight };
}

/** The panel layout, kept within its limits when the window changes size. */
function usePanelLayout(): [PanelLayout, (change: (layout: PanelLayout) => PanelLayout) => void] {
  const [layout, setLayout] = useState<PanelLayout>(() => { const size = windowSize(); return defaultPanelLayout(size.widthPixels, size.heightPixels); });
  useEffect(() => {
    const onResize = () => { const size = windowSize(); setLayout((current) => clampPanelLayout(current, size.widthPixels, size.heightPixels)); };
    window.addEventListener('resize', onResize);
    return () => window.removeEventListener('resize', onResize);
  }, []);
  const change = (edit: (layout: PanelLayout) => PanelLayout) => setLayout((current) => { const size = windowSize(); return clampPanelLayout(edit(current), size.widthPixels, size.heightPixels); });
  return [layout, change];
}

/** The title bar of a panel with its collapse (or expand) button. */
function PanelBar({ title, open, side, onToggle, testId }: { title: string; open: boolean; side: 'left' | 'right' | 'bottom'; onToggle(): void; testId: string }) {
  const arrow = side === 'left' ? (open ? '‹' : '›') : side === 'right' ? (open ? '›' : '‹') : (open ? '⌄' : '⌃');
  return (
    <button type="button" className={`panel-collapse panel-collapse-${side}${open ? '' : ' panel-collapsed'}`} onClick={onToggle} aria-expanded={open} data-testid={testId}
      title={open ? `Hide ${title.toLowerCase()} (more room for the map)` : `Show ${title.toLowerCase()}`}>
      <span aria-hidden="true">{arrow}</span>{open ? '' : <span className="panel-collapse-title">{title}</span>}
    </button>
  );
}

export function App() {
  const workspace = useWorkspace(host);
  const { state } = workspace;
  const [sideTab, setSideTab] = useState<SideTab>('microphones');
  const [bottomTab, setBottomTab] = useState<BottomTab>('recording');
  const [overlayKind, setOverlayKind] = useState<'none' | 'precision' | 'srp'>('none');
  const [layout, changeLayout] = usePanelLayout();
  // The recording view's span (marked on the recorders time line) and a span the time line asks it to show.
  const [recordingViewSpan, setRecordingViewSpan] = useState<ViewSpan | undefined>(undefined);
  const [viewRequest, setViewRequest] = useState<(ViewSpan & { serial: number }) | undefined>(undefined);
  const deployment = state.recording?.deployment;
  // A new clock fit (or the way back) redraws the recording view from scratch: its spectrogram was read through the old clocks.
  const clocksSerial = useRef({ clocks: state.clocks, serial: 0 });
  if (clocksSerial.current.clocks !== state.clocks) clocksSerial.current = { clocks: state.clocks, serial: clocksSerial.current.serial + 1 };
  const shownBottomTab: BottomTab = bottomTab === 'clocks' && deployment === undefined ? 'recording' : bottomTab;
  const tracks = panelGridTracks(layout);
  const speedMetersPerSecond = 'error' in workspace.speed ? 343 : workspace.speed.speedMetersPerSecond;
  const selected = state.selectedEventIndex === undefined ? undefined : state.events[state.selectedEventIndex];

  const microphones = useMemo(() => mapMicrophones(state.document), [state.document]);
  const settingsValue = useMemo(() => ({ medium: state.document.medium, settings: state.document.settings }), [state.document.medium, state.document.settings]);
  const meanUp = useMemo(() => meanUpMeters(state.document.array.microphones), [state.document.array.microphones]);
  const hyperbolae = useMemo(() => mapHyperbolae(selected), [selected]);
  const verdicts = useMemo(() => state.events.map((located) => locatedVerdict(located, state.document.array)), [state.events, state.document.array]);
  const fixes = useMemo(() => mapFixes(state.events, state.selectedEventIndex, verdicts), [state.events, state.selectedEventIndex, verdicts]);
  const planeUp = planeHeightMeters(state.document, selected);
  const sitePicture = useSitePictureImage(state.document.sitePicture);
  const overlay = useMemo(() => {
    if (overlayKind === 'precision') return precisionOverlay(state.document, speedMetersPerSecond);
    if (overlayKind === 'srp') return srpOverlay(state.document, workspace.correlations, speedMetersPerSecond, planeUp);
    return undefined;
  }, [overlayKind, state.document, speedMetersPerSecond, workspace.correlations, planeUp]);
  const logged = useMemo(() => loggedEventIndices(state.document.fixes, state.recording === undefined ? undefined : openRecordingIdentity(state.recording), state.events), [state.document.fixes, state.recording, state.events]);
  const recordingEvents = useMemo(() => state.events.map((located, index) => ({ index, number: located.event.index + 1, startSeconds: located.windowStartSeconds, endSeconds: located.windowEndSeconds, status: located.solve.status, selected: index === state.selectedEventIndex })), [state.events, state.selectedEventIndex]);
  const channelLabels = useMemo(() => {
    // a deployment's channels are its microphones, named in its table
    if (state.recording?.deployment !== undefined) return state.recording.deployment.microphones.map((m) => m.label);
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
        onOpenDeployment={() => workspace.showDeploymentDialog(true)}
        onOpenArray={() => void workspace.openArray()}
        onOpenProject={() => void workspace.openProject()}
        onSave={() => void workspace.saveProject(false)}
        onDemo={() => void workspace.openDemo()}
        onLocateAll={() => void workspace.locateAll()}
        onLocateSelection={() => { if (state.selection) void workspace.locateSpan(state.selection.startSeconds, state.selection.endSeconds); }}
        onCancel={workspace.cancelWork}
      />
      <NoticeBar notices={state.notices} onDismiss={workspace.dismissNotice} recoveryOffer={workspace.recoveryOffer} onRestore={workspace.restoreRecovery} onDiscard={workspace.discardRecovery} />
      <div className="workspace-body" style={{ gridTemplateColumns: tracks.columns, gridTemplateRows: tracks.rows }} data-testid="workspace-body">
        <aside className={`side left${layout.leftOpen ? '' : ' collapsed'}`} data-testid="panel-left">
          <nav className="tabs" role="tablist">
            <PanelBar title="Microphones and settings" side="left" open={layout.leftOpen} onToggle={() => changeLayout((l) => ({ ...l, leftOpen: !l.leftOpen }))} testId="collapse-left" />
            <button type="button" role="tab" aria-selected={sideTab === 'microphones'} onClick={() => setSideTab('microphones')} data-testid="tab-microphones">Microphones</button>
            <button type="button" role="tab" aria-selected={sideTab === 'settings'} onClick={() => setSideTab('settings')} data-testid="tab-settings">Settings</button>
          </nav>
          <div className="tab-body">
            {sideTab === 'microphones' ? (
              <MicrophonesPanel
                microphones={state.document.array.microphones}
                origin={state.document.array.origin}
                recordingChannelCount={deployment === undefined ? state.recording?.info.channelCount : undefined}
                onChange={(list, origin) => workspace.setArray({ ...state.document.array, microphones: list, ...(origin !== undefined ? { origin } : {}) })}
                onImportArray={() => void workspace.openArray()}
                onExportArray={(text) => void workspace.exportArray(text)}
              />
            ) : (
              <SettingsPanel value={settingsValue} meanMicrophoneUpMeters={meanUp} onChange={(next) => { if (next.medium !== state.document.medium) workspace.setMedium(next.medium); if (next.settings !== state.document.settings) workspace.setSettings(next.settings); }} />
            )}
          </div>
        </aside>
        {layout.leftOpen ? <Splitter orientation="vertical" label="Drag to resize the microphones panel" testId="splitter-left" onDrag={(d) => changeLayout((l) => ({ ...l, leftPixels: l.leftPixels + d }))} /> : <span className="splitter-gap" />}
          <section className="map-area" aria-label="Map" data-testid="map-area">
            <MapView
              controls={(<>
                <label className="map-toggle">layer{' '}
                  <select value={overlayKind} onChange={(event) => setOverlayKind(event.target.value as 'none' | 'precision' | 'srp')} data-testid="map-layer">
                    <option value="none">none</option>
                    <option value="precision" title="Expected error of a fix at each place, from the array's geometry">precision</option>
                    <option value="srp" title="SRP-PHAT of the selected event, normalised to its peak">SRP-PHAT</option>
                  </select>
                </label>
                <SitePictureControl picture={state.document.sitePicture} origin={state.document.array.origin} onChange={workspace.setSitePicture} />
              </>)}
              microphones={microphones}
              hyperbolae={hyperbolae}
              speedMetersPerSecond={speedMetersPerSecond}
              planeUpMeters={planeUp}
              fixes={fixes}
              {...(overlay !== undefined ? { overlay } : {})}
              {...(sitePicture !== undefined ? { sitePicture } : {})}
              {...(state.document.array.origin !== undefined ? { origin: state.document.array.origin } : {})}
              editable
              onMoveMicrophone={workspace.moveMicrophone}
              onSelectFix={(id) => workspace.selectEvent(Number(id.replace('event-', '')))}
            />
          </section>
          {layout.bottomOpen ? <Splitter orientation="horizontal" label="Drag to resize the recording panel" testId="splitter-bottom" onDrag={(d) => changeLayout((l) => ({ ...l, bottomPixels: l.bottomPixels - d }))} /> : <span className="splitter-gap splitter-gap-bottom" />}
          <section className={`bottom-area${layout.bottomOpen ? '' : ' collapsed'}`} data-testid="panel-bottom">
            <nav className="tabs" role="tablist">
              <PanelBar title="Recording" side="bottom" open={layout.bottomOpen} onToggle={() => changeLayout((l) => ({ ...l, bottomOpen: !l.bottomOpen }))} testId="collapse-bottom" />
              <button type="button" role="tab" aria-selected={shownBottomTab === 'recording'} onClick={() => setBottomTab('recording')} data-testid="tab-recording">Recording</button>
              {deployment !== undefined && <button type="button" role="tab" aria-selected={shownBottomTab === 'clocks'} onClick={() => setBottomTab('clocks')} data-testid="tab-clocks" title="The recorders' clocks: fit them from calibration sounds or shared sounds">Clock fit{state.clocks.kind === 'files' ? ' (not fitted)' : ''}</button>}
              <button type="button" role="tab" aria-selected={shownBottomTab === 'correlations'} onClick={() => setBottomTab('correlations')} data-testid="tab-correlations">Correlations</button>
              <button type="button" role="tab" aria-selected={shownBottomTab === 'safety'} onClick={() => setBottomTab('safety')} data-testid="tab-safety">Safety &amp; about</button>
            </nav>
            <div className="tab-body">
              {shownBottomTab === 'recording' && state.recording !== undefined && deployment !== undefined && (
                <RecordersTimeline layout={deployment} clocks={state.clocks} view={recordingViewSpan} startTimeIso={state.recording.info.startTime?.isoLocal}
                  onMoveView={(span) => setViewRequest((previous) => ({ ...span, serial: (previous?.serial ?? 0) + 1 }))} />
              )}
              {shownBottomTab === 'recording' && (state.recording !== undefined ? (
                <RecordingView
                  key={`clocks-${clocksSerial.current.serial}`}
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
                  onViewChange={setRecordingViewSpan}
                  {...(viewRequest !== undefined ? { viewRequest } : {})}
                />
              ) : <p className="muted empty">No recording open. Open one (or a deployment of several recorders) from the toolbar, or drop a WAV file here.</p>)}
              {shownBottomTab === 'clocks' && (
                <ClockFitPanel layout={deployment} clocks={state.clocks} calibrationTables={workspace.deploymentCalibrationTables} sharedSoundTables={workspace.deploymentSharedSoundTables} busy={state.busy !== undefined}
                  onFit={(table, options) => void workspace.fitClocks(table, options)} onClear={() => void workspace.clearClocks()} />
              )}
              {shownBottomTab === 'correlations' && (selected !== undefined && workspace.correlations !== undefined ? (
                <CorrelationsView pairs={workspace.correlations.pairs} autocorrelations={workspace.correlations.autocorrelations} bandHz={selected.bandHz} weighting={state.document.settings.weighting} />
              ) : <p className="muted empty">Select a sound to see its correlations.</p>)}
              {shownBottomTab === 'safety' && <CautionsPanel />}
            </div>
          </section>
        {layout.rightOpen ? <Splitter orientation="vertical" label="Drag to resize the events and fix log panel" testId="splitter-right" onDrag={(d) => changeLayout((l) => ({ ...l, rightPixels: l.rightPixels - d }))} /> : <span className="splitter-gap splitter-gap-right" />}
        <aside className={`side right${layout.rightOpen ? '' : ' collapsed'}`} data-testid="panel-right">
          <PanelBar title="Events and fix log" side="right" open={layout.rightOpen} onToggle={() => changeLayout((l) => ({ ...l, rightOpen: !l.rightOpen }))} testId="collapse-right" />
          <EventsPanel events={state.events} verdicts={verdicts} selectedIndex={state.selectedEventIndex} loggedEventIndices={logged} onSelect={workspace.selectEvent} onLog={workspace.logEvents} />
          <FixLogPanel
            entries={state.document.fixes}
            {...(state.selectedFixId !== undefined ? { selectedId: state.selectedFixId } : {})}
            context={workspace.fixLogContext}
            onChange={workspace.setFixes}
            onSelect={workspace.selectFix}
            onExport={(kind, text) => void workspace.exportText(fixLogFileName(kind, state.document.name, new Date()), text, kind)}
          />
        </aside>
      </div>
      <OpenDeploymentDialog open={workspace.deploymentDialogOpen} onPick={(how, nameTime) => void workspace.openDeployment(how, nameTime)} onClose={() => workspace.showDeploymentDialog(false)} />
      <ConfirmDialog question={workspace.question} onAnswer={workspace.answerQuestion} />
    </div>
  );
}
