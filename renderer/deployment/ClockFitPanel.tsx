// The Clock fit panel: which clocks the deployment is read through, fitting them from a calibration table (as `whence sync`),
// per recorder offset (ms), drift (ppm), sigmas and residual RMS (µs), per calibration sound its residuals (µs), and the way back.
import { useState } from 'react';
import type { DeploymentLayout } from '../../core/deployment';
import type { PickedTable } from '../state/useWorkspace';
import { clocksInUseText, recorderClockRows, residualMicrophones, RESIDUAL_MARK_SIGMAS, soundResidualRows, type ClocksInUse } from './clockFitRows';
import './deployment.css';

export interface ClockFitPanelProps {
  layout: DeploymentLayout | undefined;
  clocks: ClocksInUse;
  /** Calibration tables picked with the deployment. */
  calibrationTables: PickedTable[];
  busy: boolean;
  onFit(calibration: PickedTable | 'pick', options: { referenceRecorder?: string; searchSeconds?: number }): void;
  onClear(): void;
}

const DEFAULT_SEARCH_SECONDS = 3;

export function ClockFitPanel({ layout, clocks, calibrationTables, busy, onFit, onClear }: ClockFitPanelProps) {
  const [reference, setReference] = useState('');
  const [searchText, setSearchText] = useState(String(DEFAULT_SEARCH_SECONDS));
  if (layout === undefined) {
    return <p className="muted empty" data-testid="clock-fit-panel">Open a deployment (several recorders, each with its own clock) to fit its clocks from calibration sounds.</p>;
  }
  const searchSeconds = Number(searchText);
  const searchOk = Number.isFinite(searchSeconds) && searchSeconds >= 0.1 && searchSeconds <= 600;
  const options = { ...(reference !== '' ? { referenceRecorder: reference } : {}), ...(searchOk && searchSeconds !== DEFAULT_SEARCH_SECONDS ? { searchSeconds } : {}) };
  const report = clocks.kind === 'fitted' ? clocks.report : undefined;
  const rows = report === undefined ? [] : recorderClockRows(report);
  const microphones = report === undefined ? [] : residualMicrophones(report, layout.microphones.map((m) => m.label));
  const sounds = report === undefined ? [] : soundResidualRows(report, microphones);
  const disabled = busy || !searchOk;
  return (
    <section className="clock-fit" data-testid="clock-fit-panel" aria-label="Clock fit">
      <div className="clock-fit-bar">
        <span>Clocks in use: <strong className={clocks.kind === 'fitted' ? 'clocks-fitted' : 'clocks-files'} data-testid="clocks-in-use">{clocksInUseText(clocks)}</strong></span>
        {clocks.kind === 'fitted' && <button type="button" disabled={busy} onClick={onClear} data-testid="clear-clocks" title="Read every recorder through its own file stamps again">Use the files' own clocks</button>}
      </div>
      <div className="clock-fit-bar">
        <span>Fit from</span>
        {calibrationTables.map((table) => (
          <button key={table.name} type="button" className="primary" disabled={disabled} onClick={() => onFit(table, options)} data-testid="fit-clocks-picked" title={`Fit every recorder's offset and drift from the calibration sounds in ${table.name}`}>{table.name}</button>
        ))}
        <button type="button" className={calibrationTables.length === 0 ? 'primary' : undefined} disabled={disabled} onClick={() => onFit('pick', options)} data-testid="fit-clocks-choose"
          title="Choose a calibration table: time,x_m,y_m[,z_m][,emitted_at][,label][,sigma_m]">{calibrationTables.length === 0 ? 'a calibration table…' : 'another table…'}</button>
        <label>with reference recorder{' '}
          <select value={reference} onChange={(event) => setReference(event.target.value)} data-testid="reference-recorder" title="The recorder whose clock is the time base (offset 0, drift 0) unless the table gives emission times">
            <option value="">{layout.recorders[0]?.name} (the table's first)</option>
            {layout.recorders.slice(1).map((recorder) => <option key={recorder.name} value={recorder.name}>{recorder.name}</option>)}
          </select>
        </label>
        <label title="How far from its rough time a calibration sound is looked for">searching ±{' '}
          <input type="number" min={0.1} max={600} step={0.5} value={searchText} onChange={(event) => setSearchText(event.target.value)} className={searchOk ? 'clock-fit-search' : 'clock-fit-search invalid'} aria-invalid={!searchOk} data-testid="search-seconds" /> s
        </label>
      </div>
      {!searchOk && <p className="error">The search must be 0.1 to 600 seconds.</p>}
      {report === undefined ? (
        <p className="muted clock-fit-help">
          Each recorder's time is t_start + (1 + drift) · t_file + offset. Choose a calibration table (<code>time,x_m,y_m[,z_m][,emitted_at]</code>: the rough time and
          surveyed place of sounds made on purpose, e.g. clapper shots, two near the start and two near the end) to fit every offset and drift by weighted
          least squares, as <code>whence sync</code> does, with the array and the speed of sound of Settings. Until then each file's own start time is taken as true.
        </p>
      ) : (
        <div className="clock-fit-tables">
          <table className="compact clock-fit-recorders" data-testid="clock-fit-recorders">
            <caption>Recorders (fitted from {report.calibrationName})</caption>
            <thead>
              <tr><th scope="col">Recorder</th><th scope="col" className="num">Offset (ms)</th><th scope="col" className="num">± (ms)</th><th scope="col" className="num">Drift (ppm)</th><th scope="col" className="num">± (ppm)</th><th scope="col" className="num">Residual RMS (µs)</th><th scope="col" className="num">Sounds</th><th scope="col">Fit</th></tr>
            </thead>
            <tbody>
              {rows.map((row) => (
                <tr key={row.name} data-testid={`clock-row-${row.name}`} className={row.warning !== undefined ? 'clock-poor' : undefined}>
                  <th scope="row">{row.name}{row.reference ? <span className="muted"> (reference)</span> : null}</th>
                  <td className="num" data-testid="clock-offset-ms">{row.offsetMs}</td>
                  <td className="num">{row.offsetSigmaMs}</td>
                  <td className="num" data-testid="clock-drift-ppm">{row.driftPpm}</td>
                  <td className="num">{row.driftSigmaPpm}</td>
                  <td className="num">{row.residualRmsMicroseconds}</td>
                  <td className="num">{row.soundCount}</td>
                  <td>{row.warning !== undefined ? <span className="clock-warning" data-testid="clock-warning" title={row.warning}>⚠ Poor fit: {row.warning}</span> : row.reference ? 'time base' : 'good'}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <table className="compact clock-fit-sounds" data-testid="clock-fit-sounds">
            <caption>Calibration sounds: residual at each microphone (µs); marked beyond {RESIDUAL_MARK_SIGMAS} sigmas; — not heard</caption>
            <thead>
              <tr><th scope="col">Sound</th><th scope="col" className="num">Emitted (s)</th>{microphones.map((label) => <th key={label} scope="col" className="num">{label}</th>)}</tr>
            </thead>
            <tbody>
              {sounds.map((sound) => (
                <tr key={sound.label} data-testid={`clock-sound-${sound.label}`}>
                  <th scope="row">{sound.label}</th>
                  <td className="num">{sound.timeSeconds}</td>
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
