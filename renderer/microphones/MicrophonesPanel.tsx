// The microphone table: channel, label, position (local metres or WGS84 latitude/longitude about the origin), survey sigma;
// messages next to each wrong cell; import and export of the array table. Cells keep what was typed; the array in use
// changes when a cell is committed (Enter or leaving it) and the whole table reads as valid, not on every keystroke.
import { useState, type ChangeEvent, type KeyboardEvent, type ReactNode } from 'react';
import type { GeodeticPosition } from '../../core/geo';
import type { ArrayMicrophone } from '../../core/project';
import { arrayCsvText, importArrayText } from './arrayCsvText';
import { blankRow, fieldsOf, rowsFromMicrophones, setRowPosition, type MicrophoneField, type MicrophoneRowText, type PositionMode } from './arrayRows';
import { originTextFrom, parseOriginText, type OriginField, type OriginParse, type OriginText } from './originText';
import { validateArray, type ArrayValidation, type RowCheck } from './validateArray';
import './microphones.css';
import { maxOf } from '../../core/units';

/** What an import hands back: the text of the chosen file and its name (core/contract's TextFile fits). */
export interface ArrayImportText {
  name: string;
  text: string;
}

export interface MicrophonesPanelProps {
  microphones: ArrayMicrophone[];
  origin?: GeodeticPosition;
  /** Channels of the open recording; channels beyond it are marked. */
  recordingChannelCount?: number;
  /** The usable rows (in local metres) and the origin, after each edit that changes them. Wrong rows stay in the table only. */
  onChange(microphones: ArrayMicrophone[], origin: GeodeticPosition | undefined): void;
  /**
   * Asks the parent to open an array table through the host. Either the parent replaces `microphones` (return nothing),
   * or it returns the file's text and the panel reads it with parseArrayCsv and shows any error in the table.
   */
  onImportArray(): void | Promise<ArrayImportText | null | undefined>;
  /** The table as `whence locate --array` reads it, for the parent to save through the host. */
  onExportArray(csvText: string): void;
}

interface TableState {
  rows: MicrophoneRowText[];
  mode: PositionMode;
  originText: OriginText;
  note?: { kind: 'error' | 'info'; lines: string[] };
  /** Key of the props the table was last filled from or agreed with. */
  syncedKey: string;
  /** Key of the last value handed to onChange. */
  emittedKey?: string;
}

const COLUMN_HEADS: Record<MicrophoneField, ReactNode> = {
  channel: <>Ch</>,
  label: <>Label</>,
  east: <>East (m)</>,
  north: <>North (m)</>,
  up: <>Up (m)</>,
  lat: <>Latitude (°)</>,
  lon: <>Longitude (°)</>,
  alt: <>Alt. (m)</>,
  sigma: <>σ (m)</>,
};

const COLUMN_TITLES: Partial<Record<MicrophoneField, string>> = {
  channel: 'Recording channel of the microphone; 1 is the first channel',
  up: 'Metres above the local origin; blank means 0',
  alt: 'Height above the WGS84 ellipsoid (not above sea level); blank means 0',
  sigma: 'Survey sigma: standard deviation of each surveyed coordinate, metres; blank means 0 (positions treated as exact)',
  lat: 'Decimal degrees (52.1234) or degrees, minutes, seconds with N/S (52°07\'24.2"N)',
  lon: 'Decimal degrees (-1.5678) or degrees, minutes, seconds with E/W (1°34\'04.1"W)',
};

const FIELD_LABELS: Record<MicrophoneField, string> = {
  channel: 'Channel', label: 'Label', east: 'East (m)', north: 'North (m)', up: 'Up (m)', lat: 'Latitude (°)', lon: 'Longitude (°)', alt: 'Altitude (m)', sigma: 'Survey sigma (m)',
};

const NUMERIC: ReadonlySet<MicrophoneField> = new Set(['channel', 'east', 'north', 'up', 'lat', 'lon', 'alt', 'sigma']);

function keyOf(microphones: readonly ArrayMicrophone[], origin: GeodeticPosition | undefined): string {
  return JSON.stringify([microphones, origin ?? null]);
}

function stateFromProps(microphones: readonly ArrayMicrophone[], origin: GeodeticPosition | undefined, mode: PositionMode): TableState {
  const shownMode = mode === 'geodetic' && origin === undefined ? 'local' : mode;
  return { rows: rowsFromMicrophones(microphones, shownMode, origin), mode: shownMode, originText: originTextFrom(origin), syncedKey: keyOf(microphones, origin) };
}

interface Derived {
  originParse: OriginParse;
  validation: ArrayValidation;
}

function derive(state: TableState, propsOrigin: GeodeticPosition | undefined, recordingChannelCount: number | undefined): Derived {
  const originParse = parseOriginText(state.originText);
  const origin = originParse.kind === 'ok' ? originParse.origin : originParse.kind === 'invalid' ? propsOrigin : undefined;
  return { originParse, validation: validateArray(state.rows, recordingChannelCount, { mode: state.mode, origin }) };
}

function nextNumberChannel(rows: readonly MicrophoneRowText[]): number {
  const used = rows.map((row) => Number(row.channel.trim())).filter((channel) => Number.isInteger(channel) && channel >= 1);
  return used.length === 0 ? 1 : maxOf(used) + 1;
}

export function MicrophonesPanel(props: MicrophonesPanelProps) {
  const { microphones, origin, recordingChannelCount, onChange, onImportArray, onExportArray } = props;
  const [state, setState] = useState<TableState>(() => stateFromProps(microphones, origin, 'local'));
  const [importing, setImporting] = useState(false);

  // New props from outside (a project opened, an import by the parent) replace the table; our own edits coming back do not.
  const propsKey = keyOf(microphones, origin);
  let current = state;
  if (propsKey !== state.syncedKey) {
    current = propsKey === state.emittedKey ? { ...state, syncedKey: propsKey } : stateFromProps(microphones, origin, state.mode);
    setState(current);
  }

  const { originParse, validation } = derive(current, origin, recordingChannelCount);

  /** Applies an edit: new table state, and the usable rows to the parent when they changed. */
  function commit(next: TableState): void {
    const derived = derive(next, origin, recordingChannelCount);
    let emittedKey = next.emittedKey;
    // While any row has an error the array in use stays as it was (the fixes do not jump); the table keeps the text.
    if (derived.originParse.kind !== 'invalid' && derived.validation.errorRowCount === 0) {
      const key = keyOf(derived.validation.microphones, derived.validation.origin);
      if (key !== propsKey && key !== next.emittedKey) {
        emittedKey = key;
        onChange(derived.validation.microphones, derived.validation.origin);
      }
    }
    setState({ ...next, emittedKey });
  }

  /** Typing: the table shows the text and its messages at once; the array in use waits for the cell to be committed. */
  function editCell(index: number, field: MicrophoneField, text: string): void {
    setState({ ...current, rows: current.rows.map((row, i) => (i === index ? { ...row, [field]: text } : row)), note: undefined });
  }

  function editOrigin(field: OriginField, text: string): void {
    setState({ ...current, originText: { ...current.originText, [field]: text } });
  }

  /** A cell committed (Enter or leaving it): the usable rows go to the parent when the table reads as valid and changed. */
  function commitTyped(): void {
    commit(current);
  }

  function addRow(): void {
    commit({ ...current, rows: [...current.rows, blankRow(nextNumberChannel(current.rows))], note: undefined });
  }

  function removeRow(index: number): void {
    commit({ ...current, rows: current.rows.filter((_, i) => i !== index), note: undefined });
  }

  const unreadablePositions = validation.rows.some((check, index) => check.position === undefined && !check.blank && positionTyped(current.rows[index]!, current.mode));
  const geodeticBlocked = current.mode === 'local' && originParse.kind !== 'ok'
    ? 'Enter the WGS84 origin first: latitude/longitude are converted about it.'
    : unreadablePositions ? 'Correct the marked position cells first: they are converted when you switch.' : originParse.kind === 'invalid' ? 'Correct the origin first.' : undefined;

  function switchMode(mode: PositionMode): void {
    if (mode === current.mode || geodeticBlocked !== undefined) return;
    const frameOrigin = validation.origin;
    if (frameOrigin === undefined && validation.rows.some((check) => check.position !== undefined)) return;
    const rows = current.rows.map((row, index) => {
      const position = validation.rows[index]!.position;
      return position === undefined ? row : setRowPosition(row, mode, position, frameOrigin);
    });
    // Leaving the geodetic mode with the centroid as origin: keep that origin, so the local positions stay where they are.
    const originText = originParse.kind === 'blank' && frameOrigin !== undefined ? originTextFrom(frameOrigin) : current.originText;
    commit({ ...current, rows, mode, originText, note: undefined });
  }

  async function importTable(): Promise<void> {
    setImporting(true);
    try {
      const file = await onImportArray();
      if (file === undefined || file === null) return;
      const result = importArrayText(file.text, file.name, originParse.kind === 'ok' ? originParse.origin : undefined);
      if (!result.ok) {
        setState({ ...current, note: { kind: 'error', lines: [`${file.name} was not imported: ${result.message}`] } });
        return;
      }
      const filled: TableState = {
        ...current,
        rows: rowsFromMicrophones(result.microphones, result.mode, result.origin),
        mode: result.mode,
        originText: originTextFrom(result.origin),
        note: { kind: 'info', lines: [`Imported ${result.microphones.length} microphone${result.microphones.length === 1 ? '' : 's'} from ${file.name}.`, ...result.warnings] },
      };
      commit(filled);
    } catch (error) {
      setState((previous) => ({ ...previous, note: { kind: 'error', lines: [`The array table could not be opened: ${error instanceof Error ? error.message : String(error)}`] } }));
    } finally {
      setImporting(false);
    }
  }

  const exportBlocked = validation.microphones.length === 0
    ? 'Nothing to export yet.'
    : validation.errorRowCount > 0 ? 'Correct the marked rows first: the exported table must read back as it is shown.'
    : originParse.kind === 'invalid' ? 'Correct the origin first.' : undefined;

  function exportTable(): void {
    if (exportBlocked !== undefined) return;
    onExportArray(arrayCsvText(validation.microphones, current.mode, validation.origin));
  }

  const fields = fieldsOf(current.mode);
  const geodetic = current.mode === 'geodetic';
  const columnCount = fields.length + 2 + (geodetic ? 1 : 0);
  const usable = validation.microphones.length;

  return (
    <section className="panel mic-panel" data-testid="microphones-panel" aria-labelledby="microphones-title">
      <header className="mic-head">
        <h2 id="microphones-title">Microphones</h2>
        <span className="mic-count" data-testid="microphones-count">
          {usable} usable{validation.errorRowCount > 0 ? `, ${validation.errorRowCount} to correct` : ''}
        </span>
        <div className="mic-tools">
          <div className="mic-mode" role="radiogroup" aria-label="Positions typed as">
            <button type="button" role="radio" aria-checked={!geodetic} className={geodetic ? '' : 'mic-on'} data-testid="microphones-mode-local" onClick={() => switchMode('local')} disabled={geodetic && geodeticBlocked !== undefined} title={geodetic ? geodeticBlocked : undefined}>
              East/North/Up m
            </button>
            <button type="button" role="radio" aria-checked={geodetic} className={geodetic ? 'mic-on' : ''} data-testid="microphones-mode-geodetic" onClick={() => switchMode('geodetic')} disabled={!geodetic && geodeticBlocked !== undefined} title={geodetic ? undefined : geodeticBlocked}>
              Lat/Lon
            </button>
          </div>
          <button type="button" data-testid="microphones-import" onClick={() => void importTable()} disabled={importing} title="Read an array table (CSV: channel,label,x_m,y_m,z_m,sigma_m or channel,label,lat,lon,alt_m,sigma_m); it replaces this table">
            Import…
          </button>
          <button type="button" data-testid="microphones-export" onClick={exportTable} disabled={exportBlocked !== undefined} title={exportBlocked ?? 'Save this table as CSV, readable by whence locate --array'}>
            Export…
          </button>
        </div>
      </header>

      <OriginFields text={current.originText} parse={originParse} mode={current.mode} centroid={originParse.kind === 'blank' ? validation.origin : undefined} onEdit={editOrigin} onCommit={commitTyped} />

      <div className="mic-scroll">
        <table className="mic-table">
          <thead>
            <tr>
              <th className="mic-num" scope="col">#</th>
              {fields.map((field) => (
                <th key={field} scope="col" className={NUMERIC.has(field) ? 'mic-num' : ''} title={COLUMN_TITLES[field]}>{COLUMN_HEADS[field]}</th>
              ))}
              {geodetic && <th scope="col" className="mic-num" title="The position in the local frame about the origin">E, N (m)</th>}
              <th scope="col"><span className="mic-sr">Remove</span></th>
            </tr>
          </thead>
          <tbody>
            {current.rows.map((row, index) => (
              <MicrophoneRow key={row.key} row={row} number={index + 1} fields={fields} check={validation.rows[index]!} geodetic={geodetic} columnCount={columnCount}
                onEdit={(field, text) => editCell(index, field, text)} onCommit={commitTyped} onRemove={() => removeRow(index)} />
            ))}
          </tbody>
        </table>
      </div>
      <div className="mic-foot">
        <button type="button" className="mic-add" data-testid="microphone-add" onClick={addRow}>+ Add microphone</button>
        <span className="mic-hint">Blank up/altitude and σ mean 0.</span>
      </div>
      {(validation.table.length > 0 || current.note !== undefined) && (
        <ul className="mic-table-messages" data-testid="microphones-messages">
          {current.note?.lines.map((line, i) => <li key={`note-${i}`} className={current.note!.kind === 'error' || i > 0 ? 'mic-warn' : 'mic-info'}>{line}</li>)}
          {validation.table.map((message, i) => <li key={`table-${i}`} className="mic-warn">{message.text}</li>)}
        </ul>
      )}
    </section>
  );
}

function positionTyped(row: MicrophoneRowText, mode: PositionMode): boolean {
  const fields: MicrophoneField[] = mode === 'local' ? ['east', 'north', 'up'] : ['lat', 'lon', 'alt'];
  return fields.some((field) => row[field].trim() !== '');
}

interface MicrophoneRowProps {
  row: MicrophoneRowText;
  number: number;
  fields: MicrophoneField[];
  check: RowCheck;
  geodetic: boolean;
  columnCount: number;
  onEdit(field: MicrophoneField, text: string): void;
  onCommit(): void;
  onRemove(): void;
}

/** Enter commits a cell as leaving it does. */
function commitOnEnter(onCommit: () => void) {
  return (event: KeyboardEvent<HTMLInputElement>) => { if (event.key === 'Enter') onCommit(); };
}

function MicrophoneRow({ row, number, fields, check, geodetic, columnCount, onEdit, onCommit, onRemove }: MicrophoneRowProps) {
  const hasError = check.messages.some((message) => message.severity === 'error');
  const rowClass = hasError ? 'mic-row mic-row-error' : 'mic-row';
  const labelPlaceholder = /^\d+$/.test(row.channel.trim()) ? `M${row.channel.trim()}` : '';
  return (
    <>
      <tr className={rowClass} data-testid={`microphone-row-${number}`}>
        <td className="mic-num mic-index">{number}</td>
        {fields.map((field) => {
          const message = check.cells[field];
          const cellClass = message === undefined ? '' : message.severity === 'error' ? 'mic-cell-error' : 'mic-cell-warning';
          return (
            <td key={field} className={`mic-cell-${field}`}>
              <input
                type="text"
                inputMode={field === 'label' ? 'text' : field === 'channel' ? 'numeric' : 'decimal'}
                spellCheck={false}
                className={`${NUMERIC.has(field) ? 'mic-num' : ''} ${cellClass}`}
                value={row[field]}
                placeholder={field === 'label' ? labelPlaceholder : field === 'up' || field === 'alt' || field === 'sigma' ? '0' : ''}
                aria-label={`${FIELD_LABELS[field]}, row ${number}`}
                aria-invalid={message?.severity === 'error' ? true : undefined}
                title={message?.text}
                data-testid={`microphone-cell-${number}-${field}`}
                onChange={(event: ChangeEvent<HTMLInputElement>) => onEdit(field, event.target.value)}
                onBlur={onCommit}
                onKeyDown={commitOnEnter(onCommit)}
              />
            </td>
          );
        })}
        {geodetic && (
          <td className="mic-num mic-derived" data-testid={`microphone-local-${number}`}>
            {check.position === undefined ? '' : `${check.position.eastMeters.toFixed(2)}, ${check.position.northMeters.toFixed(2)}`}
          </td>
        )}
        <td>
          <button type="button" className="mic-remove" data-testid={`microphone-remove-${number}`} onClick={onRemove} title={`Remove row ${number}`} aria-label={`Remove row ${number}`}>×</button>
        </td>
      </tr>
      {check.messages.length > 0 && (
        <tr className="mic-message-row">
          <td />
          <td colSpan={columnCount - 1} data-testid={`microphone-message-${number}`} className={check.blank ? 'mic-info' : 'mic-warn'}>
            {hasError && <strong>Not used: </strong>}
            {check.messages.map((message, i) => (
              <span key={i} className="mic-message">{message.text}{i < check.messages.length - 1 ? '; ' : ''}</span>
            ))}
          </td>
        </tr>
      )}
    </>
  );
}

interface OriginFieldsProps {
  text: OriginText;
  parse: OriginParse;
  mode: PositionMode;
  centroid: GeodeticPosition | undefined;
  onEdit(field: OriginField, text: string): void;
  onCommit(): void;
}

function OriginFields({ text, parse, mode, centroid, onEdit, onCommit }: OriginFieldsProps) {
  const messages = parse.kind === 'invalid' ? parse.messages : {};
  const hint = parse.kind === 'invalid'
    ? 'Not applied until corrected.'
    : parse.kind === 'blank'
      ? mode === 'geodetic'
        ? centroid !== undefined ? `Blank: the microphones' centroid (${centroid.latitudeDegrees.toFixed(6)}, ${centroid.longitudeDegrees.toFixed(6)}) is the origin.` : 'Blank: the microphones\' centroid will be the origin.'
        : 'Blank: local frame only (no latitude/longitude for fixes).'
      : 'Local east/north/up metres are measured from here.';
  const field = (name: OriginField, label: string, placeholder: string, width: string) => (
    <label className="mic-origin-field">
      <span>{label}</span>
      <input type="text" spellCheck={false} inputMode="decimal" className={`mic-num ${messages[name] !== undefined ? 'mic-cell-error' : ''}`} style={{ width }} value={text[name]} placeholder={placeholder}
        aria-invalid={messages[name] !== undefined ? true : undefined} title={messages[name]} data-testid={`microphones-origin-${name}`} onChange={(event) => onEdit(name, event.target.value)} onBlur={onCommit} onKeyDown={commitOnEnter(onCommit)} />
    </label>
  );
  return (
    <div className="mic-origin" data-testid="microphones-origin">
      <span className="mic-origin-title" title="The WGS84 point the local east/north/up frame is centred on">Origin (WGS84)</span>
      {field('lat', 'lat °', '', '8.5em')}
      {field('lon', 'lon °', '', '8.5em')}
      {field('alt', 'alt. m', '0', '4.5em')}
      <span className={parse.kind === 'invalid' ? 'mic-warn mic-origin-hint' : 'mic-origin-hint'} data-testid="microphones-origin-message">
        {Object.values(messages).join('; ')}{parse.kind === 'invalid' ? ' ' : ''}{hint}
      </span>
    </div>
  );
}
