// The sounds found in the recording this session: time, status, position and quality; select one to see it on the
// map and its correlations; add good fixes to the survey log.
import type { Verdict } from '../../core/locate';
import type { LocatedEvent } from '../../core/pipeline';
import { VERDICT_STYLES } from '../verdict';

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

function statusWord(status: string): string {
  return status === 'ok' ? 'fixed' : status.replace('-', ' ');
}

export function EventsPanel({ events, verdicts, selectedIndex, loggedEventIndices, onSelect, onLog }: EventsPanelProps) {
  const unloggedOk = events.map((located, index) => ({ located, index })).filter(({ located }) => located.solve.status === 'ok' && !loggedEventIndices.has(located.event.index)).map(({ index }) => index);
  return (
    <section className="panel events-panel" data-testid="events-panel" aria-label="Sounds found">
      <header className="panel-head">
        <h2>Sounds found</h2>
        <button type="button" disabled={unloggedOk.length === 0} onClick={() => onLog(unloggedOk)} data-testid="events-log-all">Log {unloggedOk.length} fixed</button>
      </header>
      {events.length === 0 ? (
        <p className="muted">None yet. Open a recording and press Find &amp; locate, or select a span on the recording and locate it.</p>
      ) : (
        <table className="compact">
          <thead><tr><th>#</th><th>time (s)</th><th>verdict</th><th>status</th><th>x (m)</th><th>y (m)</th><th>95 % (m)</th><th /></tr></thead>
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
                        <span className="verdict-grade"><span className="verdict-symbol" style={{ color: VERDICT_STYLES[verdict.grade].colour }} aria-hidden="true">{VERDICT_STYLES[verdict.grade].symbol}</span> {verdict.grade}</span>
                        <span className="verdict-reason">{verdict.reason}</span>
                      </>
                    )}
                  </td>
                  <td className={`status status-${located.solve.status}`} title={[...located.warnings, ...located.solve.warnings].join('\n')}>{statusWord(located.solve.status)}</td>
                  <td className="num">{fix ? fix.eastMeters.toFixed(2) : '–'}</td>
                  <td className="num">{fix ? fix.northMeters.toFixed(2) : '–'}</td>
                  <td className="num">{fix ? `${fix.ellipse.semiMajorMeters.toFixed(2)} × ${fix.ellipse.semiMinorMeters.toFixed(2)}` : '–'}</td>
                  <td>{logged ? <span className="muted">logged</span> : <button type="button" className="small" onClick={(event) => { event.stopPropagation(); onLog([index]); }} data-testid={`event-log-${index}`}>Log</button>}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      )}
    </section>
  );
}
