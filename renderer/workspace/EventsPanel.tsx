// The events found in the recording this session (numbered from 1): time, verdict, status, position and the ellipse's
// semi-axes; select one to see it on the map and its correlations; log its fix (words as in DEVELOPERS.md's glossary).
import type { Verdict } from '../../core/locate';
import type { LocatedEvent } from '../../core/pipeline';
import { signedFixed } from '../map';
import { VerdictGradeText } from '../verdict';

export interface EventsPanelProps {
  events: LocatedEvent[];
  /** The verdict of each event, in the order of `events`. */
  verdicts: readonly Verdict[];
  selectedIndex: number | undefined;
  /** Event numbers (event.index) of this recording already in the fix log (renderer/fixlog loggedEventIndices: recording and event). */
  loggedEventIndices: ReadonlySet<number>;
  onSelect(index: number): void;
  onLog(indices: number[]): void;
}

/** The log-all button's words: how many ok fixes are not in the log yet. */
export function logAllText(unloggedOkCount: number, eventCount: number): string {
  if (unloggedOkCount > 0) return `Log ${unloggedOkCount} ok fix${unloggedOkCount === 1 ? '' : 'es'}`;
  return eventCount === 0 ? 'Nothing to log' : 'Every ok fix is logged';
}

export function EventsPanel({ events, verdicts, selectedIndex, loggedEventIndices, onSelect, onLog }: EventsPanelProps) {
  const confidencePercent = Math.round(100 * (events.find((e) => e.solve.fix)?.solve.fix?.ellipse.confidence ?? 0.95));
  const unloggedOk = events.map((located, index) => ({ located, index })).filter(({ located }) => located.solve.status === 'ok' && !loggedEventIndices.has(located.event.index)).map(({ index }) => index);
  return (
    <section className="panel events-panel" data-testid="events-panel" aria-label="Events">
      <header className="panel-head">
        <h2>Events{events.length > 0 ? ` (${events.length})` : ''}</h2>
        <button type="button" disabled={unloggedOk.length === 0} onClick={() => onLog(unloggedOk)} data-testid="events-log-all" title="Add every ok fix not yet in the fix log">{logAllText(unloggedOk.length, events.length)}</button>
      </header>
      {events.length === 0 ? (
        <p className="muted">None yet. Open a recording and press Find &amp; locate, or select a span on the recording and locate it.</p>
      ) : (
        <table className="compact">
          <thead><tr><th title="Event number, from 1, as in the survey log">#</th><th title="Emission time, seconds from the start of the recording">time (s)</th><th title="Verdict (firm, doubtful, unusable) with its main reason, and the solver's status">verdict · status</th><th title="East of the origin">x (m)</th><th title="North of the origin">y (m)</th><th title={`Semi-axes of the ${confidencePercent} % ellipse: semi-major × semi-minor`}>{confidencePercent} % semi-axes (m)</th><th /></tr></thead>
          <tbody>
            {events.map((located, index) => {
              const fix = located.solve.fix;
              const logged = loggedEventIndices.has(located.event.index);
              const verdict = verdicts[index];
              return (
                <tr key={`${located.event.index}-${index}`} className={index === selectedIndex ? 'selected' : undefined} onClick={() => onSelect(index)} data-testid={`event-row-${index}`}>
                  <td>{located.event.index + 1}</td>
                  <td className="num">{(located.emissionTimeSeconds ?? located.firstArrivalSeconds).toFixed(2)}</td>
                  <td className="verdict" data-testid={`event-verdict-${index}`} data-verdict={verdict?.grade} title={verdict?.reasons.join('\n')}>
                    {verdict !== undefined && (
                      <>
                        <VerdictGradeText grade={verdict.grade} />
                        <span className={`status status-${located.solve.status}`} title={[...located.warnings, ...located.solve.warnings].join('\n')}>{located.solve.status}</span>
                        <span className="verdict-reason">{verdict.reason}</span>
                      </>
                    )}
                  </td>
                  <td className="num">{fix ? signedFixed(fix.eastMeters, 2) : '–'}</td>
                  <td className="num">{fix ? signedFixed(fix.northMeters, 2) : '–'}</td>
                  <td className="num axes">{fix ? `${fix.ellipse.semiMajorMeters.toFixed(2)} × ${fix.ellipse.semiMinorMeters.toFixed(2)}` : '–'}</td>
                  <td>{logged ? <span className="muted logged-mark" data-testid={`event-logged-${index}`} title="logged: its fix is in the fix log" aria-label="logged">✓</span> : <button type="button" className="small" onClick={(event) => { event.stopPropagation(); onLog([index]); }} data-testid={`event-log-${index}`}>Log</button>}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      )}
    </section>
  );
}
