// The fix log: one row per fix, key columns first (keep, event, verdict, position, ellipse), then time and quality; accept toggles, inline label and note, row selection;
// export of the accepted fixes as the survey-log CSV or GeoJSON through core/export's writers.
import { useRef, useState, type KeyboardEvent, type MouseEvent } from 'react';
import type { FixLogEntry } from '../../core/project';
import { VerdictGradeText } from '../verdict';
import { fixLogExportText, type FixLogContext, type FixLogExportKind } from './fixLogRecords';
import { fixLogRows, type FixLogRow } from './fixLogRows';
import './fixlog.css';

export interface FixLogPanelProps {
  entries: FixLogEntry[];
  /** What the exported log says about the run (recording, array and origin, medium, settings); absent: export is unavailable. */
  context: FixLogContext | undefined;
  selectedId?: string;
  /** The entries after an accept toggle or a label/note edit. */
  onChange(entries: FixLogEntry[]): void;
  onSelect(id: string): void;
  /** Text of the accepted fixes, for the parent to save through the host. */
  onExport(kind: FixLogExportKind, text: string): void;
}

type EditableField = 'label' | 'note';

export function FixLogPanel({ entries, context, selectedId, onChange, onSelect, onExport }: FixLogPanelProps) {
  const [exportMessage, setExportMessage] = useState<string | undefined>(undefined);
  const origin = context?.geometry.origin;
  const rows = fixLogRows(entries, origin, context?.located);
  const acceptedCount = entries.filter((entry) => entry.accepted).length;
  const showUp = context?.dimensions === 3 || entries.some((entry) => entry.covarianceMeters2?.length === 3);
  const geo = origin !== undefined || entries.some((entry) => entry.origin !== undefined);
  // A log holding fixes of several recordings names each fix's recording beside its event number.
  const mixed = new Set(entries.map((entry) => entry.recording.name)).size > 1;

  function update(id: string, patch: Partial<Pick<FixLogEntry, 'accepted' | 'label' | 'note'>>): void {
    onChange(entries.map((entry) => (entry.id === id ? { ...entry, ...patch } : entry)));
  }

  function exportAs(kind: FixLogExportKind): void {
    if (context === undefined) return;
    try {
      const result = fixLogExportText(kind, entries, context);
      if (!result.ok) {
        setExportMessage(result.message);
        return;
      }
      setExportMessage(undefined);
      onExport(kind, result.text);
    } catch (error) {
      setExportMessage(`The log could not be written: ${error instanceof Error ? error.message : String(error)}`);
    }
  }

  const exportBlocked = context === undefined ? 'Open a recording and an array first: the log names them.' : acceptedCount === 0 ? 'No accepted fixes to export.' : undefined;
  const geoBlocked = exportBlocked ?? (geo ? undefined : 'GeoJSON needs WGS84 positions: set the array\'s origin in the Microphones panel.');

  return (
    <section className="panel fl-panel" data-testid="fixlog-panel" aria-labelledby="fixlog-title">
      <header className="fl-head">
        <h2 id="fixlog-title">Fix log</h2>
        <span className="fl-count" data-testid="fixlog-count">{entries.length} fix{entries.length === 1 ? '' : 'es'}, {acceptedCount} accepted</span>
        <div className="fl-tools">
          <button type="button" data-testid="fixlog-export-csv" disabled={exportBlocked !== undefined} title={exportBlocked ?? 'The accepted fixes as the survey-log CSV (the columns of whence locate)'} onClick={() => exportAs('csv')}>Export CSV…</button>
          <button type="button" data-testid="fixlog-export-geojson" disabled={geoBlocked !== undefined} title={geoBlocked ?? 'The accepted fixes with their uncertainty ellipses as GeoJSON (WGS84)'} onClick={() => exportAs('geojson')}>Export GeoJSON…</button>
        </div>
      </header>
      {exportMessage !== undefined && <p className="fl-warn fl-export-message" role="alert" data-testid="fixlog-export-message">{exportMessage}</p>}
      {entries.length === 0 ? (
        <p className="fl-empty">No fixes yet: locate the events of a recording, and each fix appears here.</p>
      ) : (
        <div className="fl-scroll">
          <table className="fl-table">
            <thead>
              <tr className="fl-groups">
                <th colSpan={3} />
                <th colSpan={showUp ? 3 : 2} className="fl-group">Position</th>
                <th colSpan={3} className="fl-group">Ellipse</th>
                <th colSpan={2 + (geo ? 1 : 0)} className="fl-group">Time{geo ? ', WGS84' : ''}</th>
                <th colSpan={4} className="fl-group">Quality</th>
                <th colSpan={2} />
              </tr>
              <tr>
                <th scope="col" title="Accepted fixes are exported">Keep</th>
                <th scope="col" className="fl-num" title="Event number, as in the survey log, under its recording's name when the log holds several recordings">#</th>
                <th scope="col" title="Plain-words verdict: firm (act on it), doubtful (check it first), unusable (do not act on it), with its main reason">Verdict</th>
                <th scope="col" className="fl-num">E (m)</th>
                <th scope="col" className="fl-num">N (m)</th>
                {showUp && <th scope="col" className="fl-num">U (m)</th>}
                <th scope="col" className="fl-num" title="Semi-axes of the ellipse: semi-major × semi-minor">a × b (m)</th>
                <th scope="col" className="fl-num" title="Major axis, counter-clockwise from east">Axis (°)</th>
                <th scope="col" className="fl-num">Conf.</th>
                <th scope="col" className="fl-num" title="Emission time, seconds from the start of the recording">Emitted (s)</th>
                <th scope="col" className="fl-num" title="Local clock time of the first arrival, when the recording carries a start time">Clock</th>
                {geo && <th scope="col" className="fl-num">Lat, Lon (°)</th>}
                <th scope="col">Status</th>
                <th scope="col" className="fl-num" title="Root-mean-square residual of the time differences">RMS resid.</th>
                <th scope="col" className="fl-num" title="Independent delays used in the fix (pairs_used in the survey log): the kept pairs reduced to arrival times, one fewer than the microphones heard">Delays used</th>
                <th scope="col" className="fl-num" title="Smallest ratio of a pair's correlation peak to its second peak (1 = no clear peak)">Min peak ratio</th>
                <th scope="col">Label</th>
                <th scope="col">Note</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((row, index) => (
                <FixRow key={row.id} row={row} entry={entries[index]!} selected={row.id === selectedId} showUp={showUp} geo={geo} mixed={mixed} onSelect={onSelect} onUpdate={update} />
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}

interface FixRowProps {
  row: FixLogRow;
  entry: FixLogEntry;
  selected: boolean;
  showUp: boolean;
  geo: boolean;
  /** The log holds several recordings: show this fix's. */
  mixed: boolean;
  onSelect(id: string): void;
  onUpdate(id: string, patch: Partial<Pick<FixLogEntry, 'accepted' | 'label' | 'note'>>): void;
}

function FixRow({ row, entry, selected, showUp, geo, mixed, onSelect, onUpdate }: FixRowProps) {
  const classes = ['fl-row', selected ? 'fl-selected' : '', row.accepted ? '' : 'fl-rejected'].filter(Boolean).join(' ');
  const select = () => onSelect(row.id);
  const stop = (event: MouseEvent) => event.stopPropagation();
  return (
    <tr className={classes} data-testid={`fixlog-row-${row.id}`} aria-selected={selected} onClick={select}>
      <td className="fl-keep" onClick={stop}>
        <input type="checkbox" checked={row.accepted} data-testid={`fixlog-accept-${row.id}`} aria-label={`Keep event ${row.eventNumber} (accepted fixes are exported)`} onChange={(event) => onUpdate(row.id, { accepted: event.target.checked })} />
      </td>
      <td className="fl-num fl-event" title={`Event ${row.eventNumber} of ${row.recordingName}`} data-recording={row.recordingName} data-testid={`fixlog-event-${row.id}`}>
        {mixed && <span className="fl-recording">{row.recordingName}</span>}
        <button type="button" className="fl-link" onClick={select} aria-label={`Show event ${row.eventNumber} of ${row.recordingName}`}>{row.eventNumber}</button>
      </td>
      <td className="fl-verdict" data-testid={`fixlog-verdict-${row.id}`} data-verdict={row.verdict} title={row.verdictReason}>
        <VerdictGradeText grade={row.verdict} />
        <span className="fl-verdict-reason">{row.verdictReason}</span>
      </td>
      <td className="fl-num">{row.eastText}</td>
      <td className="fl-num">{row.northText}</td>
      {showUp && <td className="fl-num">{row.upText}</td>}
      <td className="fl-num">{row.axesText}</td>
      <td className="fl-num">{row.angleText}</td>
      <td className="fl-num">{row.confidenceText}</td>
      <td className="fl-num" title={row.emissionText === '—' ? `First arrival ${row.arrivalText} s (no emission time: the fix has no position)` : `First arrival ${row.arrivalText} s`}>
        {row.emissionText === '—' ? <span className="fl-muted">arr. {row.arrivalText}</span> : row.emissionText}
      </td>
      <td className="fl-num fl-clock" title={row.clockTitle}>{row.clockText}</td>
      {geo && <td className="fl-num fl-latlon">{row.latLonText}</td>}
      <td>
        <span className={`fl-status fl-tone-${row.statusTone}`}>{row.statusText}</span>
        {row.warnings.length > 0 && (
          <span className="fl-warning-mark" title={row.warnings.join('\n')} data-testid={`fixlog-warnings-${row.id}`} aria-label={`${row.warnings.length} warning${row.warnings.length === 1 ? '' : 's'}: ${row.warnings.join(' ')}`}>
            ⚠{row.warnings.length > 1 ? row.warnings.length : ''}
          </span>
        )}
      </td>
      <td className="fl-num">{row.residualText}</td>
      <td className="fl-num">{row.pairsText}</td>
      <td className="fl-num">{row.peakRatioText}</td>
      <td className="fl-text fl-label-cell" onClick={stop}>
        <InlineText field="label" id={row.id} value={entry.label} placeholder="label" width="8rem" onCommit={(text) => onUpdate(row.id, { label: text })} />
      </td>
      <td className="fl-text fl-note-cell" onClick={stop}>
        <InlineText field="note" id={row.id} value={entry.note} placeholder="note" width="100%" onCommit={(text) => onUpdate(row.id, { note: text })} />
      </td>
    </tr>
  );
}

interface InlineTextProps {
  field: EditableField;
  id: string;
  value: string;
  placeholder: string;
  width: string;
  onCommit(text: string): void;
}

/** A text cell edited in place: the draft is kept while typing, applied on Enter or on leaving the cell; Escape restores it. */
function InlineText({ field, id, value, placeholder, width, onCommit }: InlineTextProps) {
  const [draft, setDraft] = useState<string | undefined>(undefined);
  const discard = useRef(false);
  const onBlur = () => {
    if (!discard.current && draft !== undefined && draft !== value) onCommit(draft);
    discard.current = false;
    setDraft(undefined);
  };
  const onKeyDown = (event: KeyboardEvent<HTMLInputElement>) => {
    if (event.key === 'Enter') {
      event.currentTarget.blur();
    } else if (event.key === 'Escape') {
      discard.current = true;
      event.currentTarget.blur();
    }
  };
  return (
    <input type="text" className="fl-inline" style={{ width }} value={draft ?? value} placeholder={placeholder} maxLength={field === 'label' ? 200 : 10_000}
      data-testid={`fixlog-${field}-${id}`} aria-label={field === 'label' ? 'Label' : 'Note'} onFocus={(event) => event.currentTarget.select()}
      onChange={(event) => setDraft(event.target.value)} onBlur={onBlur} onKeyDown={onKeyDown} />
  );
}
