// The Clock fit panel: which clocks the deployment is read through, fitting them (as `whence sync`) from a calibration table
// or a shared-sound table with its offset prior (ms), per recorder offset (ms), drift (ppm), sigmas and residual RMS (µs),
// per sound its residuals (µs) and a shared sound's fitted place (m), and the way back.
import { useState } from 'react';
import type { ClockFitKind, DeploymentLayout } from '../../core/deployment';
import type { PickedTable } from './pickedFiles';
import { clockFitKindWords, clocksInUseText, offsetPriorFromMs, recorderClockRows, residualMicrophones, RESIDUAL_MARK_SIGMAS, soundResidualRows, type ClocksInUse } from './clockFitRows';
import './deployment.css';

export interface ClockFitOptions { kind: ClockFitKind; referenceRecorder?: string; searchSeconds?: number; offsetSigmaSeconds?: number }

export interface ClockFitPanelProps {
  layout: DeploymentLayout | undefined;
  clocks: ClocksInUse;
  /** Calibration tables picked with the deployment. */
  calibrationTables: PickedTable[];
  /** Shared-sound tables picked with the deployment. */
  sharedSoundTables: PickedTable[];
  busy: boolean;
  onFit(table: PickedTable | 'pick', options: ClockFitOptions): void;
  onClear(): void;
}

const DEFAULT_SEARCH_SECONDS = 3;

export function ClockFitPanel({ layout, clocks, calibrationTables, sharedSoundTables, busy, onFit, onClear }: ClockFitPanelProps) {
  const [reference, setReference] = useState('');
  const [searchText, setSearchText] = useState(String(DEFAULT_SEARCH_SECONDS));
  const [chosenKind, setKind] = useState<ClockFitKind | undefined>(undefined);
  const [priorText, setPriorText] = useState('');
  if (layout === undefined) {
    return <p className="muted empty" data-testid="clock-fit-panel">Open a deployment (several recorders, each with its own clock) to fit its clocks from calibration sounds or shared sounds.</p>;
  }
  // until the user chooses, the kind of table the deployment's folder holds (calibration sounds when it holds both or none)
  const kind: ClockFitKind = chosenKind ?? (calibrationTables.length === 0 && sharedSoundTables.length > 0 ? 'shared-sounds' : 'calibration');
  const tables = kind === 'calibration' ? calibrationTables : sharedSoundTables;
  const words = clockFitKindWords(kind);
  const searchSeconds = Number(searchText);
  const searchOk = Number.isFinite(searchSeconds) && searchSeconds >= 0.1 && searchSeconds <= 600;
  const prior = offsetPriorFromMs(priorText);
  const priorOk = kind === 'calibration' || !('problem' in prior);
  const options: ClockFitOptions = {
    kind, ...(reference !== '' ? { referenceRecorder: reference } : {}), ...(searchOk && searchSeconds !== DEFAULT_SEARCH_SECONDS ? { searchSeconds } : {}),
    ...(kind === 'shared-sounds' && 'seconds' in prior && prior.seconds !== undefined ? { offsetSigmaSeconds: prior.seconds } : {}),
  };
  const report = clocks.kind === 'fitted' ? clocks.report : undefined;
  const rows = report === undefined ? [] : recorderClockRows(report);
  const microphones = report === undefined ? [] : residualMicrophones(report, layout.microphones.map((m) => m.label));
  const sounds = report === undefined ? [] : soundResidualRows(report, microphones);
  const shared = report?.kind === 'shared-sounds';
  const priors = report === undefined ? [] : [...new Set(report.recorders.flatMap((r) => (r.offsetPriorSigmaSeconds !== undefined && !r.reference ? [r.offsetPriorSigmaSeconds] : [])))];
  const disabled = busy || !searchOk || !priorOk;
  const tableHelp = kind === 'calibration' ? 'time,x_m,y_m[,z_m][,emitted_at][,label][,sigma_m]' : 'time[,label]';
  return (
    <section className="clock-fit" data-testid="clock-fit-panel" aria-label="Clock fit">
      <div className="clock-fit-bar">
        <span>Clocks in use: <strong className={clocks.kind === 'fitted' ? 'clocks-fitted' : 'clocks-files'} data-testid="clocks-in-use">{clocksInUseText(clocks)}</strong></span>
        {clocks.kind === 'fitted' && <button type="button" disabled={busy} onClick={onClear} data-testid="clear-clocks" title="Read every recorder through its own file stamps again">Use the files' own clocks</button>}
      </div>
      <div className="clock-fit-bar" role="radiogroup" aria-label="Fit the clocks from">
        <span>Fit from</span>
        <label title="Sounds made on purpose at surveyed points (clapper, loudspeaker): time,x_m,y_m[,z_m] (whence sync --calibration)">
          <input type="radio" name="clock-fit-kind" checked={kind === 'calibration'} onChange={() => setKind('calibration')} data-testid="clock-fit-kind-calibration" /> calibration sounds at known points
        </label>
        <label title="Sounds every recorder heard at places nobody surveyed: their places and times are fitted with the clocks (whence sync --shared-sounds)">
          <input type="radio" name="clock-fit-kind" checked={kind === 'shared-sounds'} onChange={() => setKind('shared-sounds')} data-testid="clock-fit-kind-shared-sounds" /> shared sounds at unknown points
        </label>
        {kind === 'shared-sounds' && (
          <label title="Offset prior: how far each recorder's file stamps may be off, one sigma (whence sync --offset-sigma, in seconds there). Empty: 1000 ms for stamps to the sample, 2000 ms for whole-second stamps">offset prior ±{' '}
            <input type="text" inputMode="decimal" value={priorText} placeholder="by stamp" onChange={(event) => setPriorText(event.target.value)} className={priorOk ? 'clock-fit-prior' : 'clock-fit-prior invalid'} aria-invalid={!priorOk} data-testid="offset-prior-ms" /> ms
          </label>
        )}
      </div>
      <div className="clock-fit-bar">
        <span>Table</span>
        {tables.map((table) => (
          <button key={table.name} type="button" className="primary" disabled={disabled} onClick={() => onFit(table, options)} data-testid="fit-clocks-picked" title={`Fit every recorder's offset and drift from the ${words.sounds} in ${table.name}`}>{table.name}</button>
        ))}
        <button type="button" className={tables.length === 0 ? 'primary' : undefined} disabled={disabled} onClick={() => onFit('pick', options)} data-testid="fit-clocks-choose"
          title={`Choose a ${words.table}: ${tableHelp}`}>{tables.length === 0 ? `a ${words.table}…` : 'another table…'}</button>
        <label>with reference recorder{' '}
          <select value={reference} onChange={(event) => setReference(event.target.value)} data-testid="reference-recorder" title="The recorder whose clock is the time base (offset 0, drift 0) unless the table gives emission times">
            <option value="">{layout.recorders[0]?.name} (the table's first)</option>
            {layout.recorders.slice(1).map((recorder) => <option key={recorder.name} value={recorder.name}>{recorder.name}</option>)}
          </select>
        </label>
        <label title="How far from its rough time a sound is looked for">searching ±{' '}
          <input type="number" min={0.1} max={600} step={0.5} value={searchText} onChange={(event) => setSearchText(event.target.value)} className={searchOk ? 'clock-fit-search' : 'clock-fit-search invalid'} aria-invalid={!searchOk} data-testid="search-seconds" /> s
        </label>
      </div>
      {!searchOk && <p className="error">The search must be 0.1 to 600 seconds.</p>}
      {!priorOk && 'problem' in prior && <p className="error" data-testid="offset-prior-problem">{prior.problem}</p>}
      {report === undefined ? (
        <p className="muted clock-fit-help">
          Each recorder's time is t_start + (1 + drift) · t_file + offset. Choose a calibration table (<code>time,x_m,y_m[,z_m][,emitted_at]</code>: the rough time and
          surveyed place of sounds made on purpose, e.g. clapper shots, two near the start and two near the end) to fit every offset and drift by weighted
          least squares, as <code>whence sync</code> does, with the array and the speed of sound of Settings. Without calibration sounds, choose shared sounds
          (<code>time[,label]</code>: the rough times of loud sounds every recorder heard, at least five spread over the recording): their places and times are
          fitted with the clocks, steadied by the offset prior. Until then each file's own start time is taken as true.
        </p>
      ) : (
        <div className="clock-fit-tables">
          <table className="compact clock-fit-recorders" data-testid="clock-fit-recorders">
            <caption>Recorders (fitted from {report.tableName}{shared ? `, shared sounds; offset prior ±${priors.map((p) => (p * 1e3).toFixed(p < 0.01 ? 2 : 0)).join('/')} ms` : ''})</caption>
            <thead>
              <tr><th scope="col">Recorder</th><th scope="col" className="num">Offset (ms)</th><th scope="col" className="num">± (ms)</th><th scope="col" className="num">Drift (ppm)</th><th scope="col" className="num">± (ppm)</th><th scope="col" className="num">Residual RMS (µs)</th><th scope="col" className="num">Sounds</th><th scope="col">Fit</th></tr>
            </thead>
            <tbody>
              {rows.map((row) => (
                <tr key={row.name} data-testid={`clock-row-${row.name}`} className={row.warning !== undefined ? 'clock-poor' : undefined}>
                  <th scope="row">{row.name}{row.reference ? <span className="muted"> (reference)</span> : null}</th>
                  <td className="num" data-testid="clock-offset-ms">{row.offsetMs}</td>
                  <td className="num" data-testid="clock-offset-sigma-ms">{row.offsetSigmaMs}</td>
                  <td className="num" data-testid="clock-drift-ppm">{row.driftPpm}</td>
                  <td className="num" data-testid="clock-drift-sigma-ppm">{row.driftSigmaPpm}</td>
                  <td className="num">{row.residualRmsMicroseconds}</td>
                  <td className="num">{row.soundCount}</td>
                  <td>{row.warning !== undefined ? <span className="clock-warning" data-testid="clock-warning" title={row.warning}>⚠ Poor fit: {row.warning}</span> : row.reference ? 'time base' : 'good'}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <table className="compact clock-fit-sounds" data-testid="clock-fit-sounds">
            <caption>{shared ? 'Shared sounds: fitted place (m, ± one sigma) and residual' : 'Calibration sounds: residual'} at each microphone (µs); marked beyond {RESIDUAL_MARK_SIGMAS} sigmas; — not heard</caption>
            <thead>
              <tr>
                <th scope="col">Sound</th><th scope="col" className="num">Emitted (s)</th>
                {shared && <><th scope="col" className="num">East (m)</th><th scope="col" className="num">North (m)</th><th scope="col" className="num">Up (m)</th></>}
                {microphones.map((label) => <th key={label} scope="col" className="num">{label}</th>)}
              </tr>
            </thead>
            <tbody>
              {sounds.map((sound) => (
                <tr key={sound.label} data-testid={`clock-sound-${sound.label}`}>
                  <th scope="row">{sound.label}</th>
                  <td className="num">{sound.timeSeconds}</td>
                  {shared && <><td className="num" data-testid="sound-east">{sound.place?.east ?? '—'}</td><td className="num" data-testid="sound-north">{sound.place?.north ?? '—'}</td><td className="num" data-testid="sound-up">{sound.place?.up ?? '—'}</td></>}
                  {sound.cells.map((cell, index) => <td key={microphones[index]} className={`num${cell?.beyondSigmas === true ? ' residual-beyond' : ''}`}>{cell === undefined ? '—' : cell.text}</td>)}
                </tr>
              ))}
            </tbody>
          </table>
          {report.warnings.length > 0 && <ul className="clock-fit-warnings">{report.warnings.map((warning) => <li key={warning}>⚠ {warning}</li>)}</ul>}
          <details className="clock-fit-text">
            <summary>The fit as <code>whence sync</code> prints it</summary>
            <pre>{report.lines.join('\n')}</pre>
          </details>
        </div>
      )}
    </section>
  );
}
