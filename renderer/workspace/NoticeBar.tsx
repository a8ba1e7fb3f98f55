// Messages for the user (what happened, what is wrong and what to do), and the offer to restore unsaved work, in a
// one-line strip of fixed height under the toolbar (it never pushes the panels down): the newest notice with its count of
// repeats, the earlier ones in a list that drops down over the workspace on demand.
import { useEffect, useState } from 'react';
import type { Notice } from '../state/workspace';
import { recoveryOfferText } from './recoveryTime';

/** Information fades after this long; warnings and errors stay until dismissed. */
export const INFO_NOTICE_MILLISECONDS = 8000;

export interface NoticeBarProps {
  notices: Notice[];
  onDismiss(id: number): void;
  recoveryOffer: { savedAtIso: string; document?: { name: string; fixes: readonly unknown[] } } | undefined;
  onRestore(): void;
  onDiscard(): void;
}


export function NoticeBar({ notices, onDismiss, recoveryOffer, onRestore, onDiscard }: NoticeBarProps) {
  const [expanded, setExpanded] = useState(false);
  useEffect(() => {
    const timers = notices.filter((notice) => notice.level === 'info').map((notice) => setTimeout(() => onDismiss(notice.id), INFO_NOTICE_MILLISECONDS));
    return () => timers.forEach(clearTimeout);
  }, [notices, onDismiss]);
  const newest = notices[notices.length - 1];
  const earlier = notices.slice(0, -1).reverse();
  /** One notice; in the strip (`inList` false) its text is cut to one line and a click opens the list with every notice in full. */
  const line = (notice: Notice, inList: boolean) => (
    <div key={notice.id} className={`notice notice-${notice.level}`} role={notice.level === 'error' && !inList ? 'alert' : undefined} data-testid={inList ? `notice-list-${notice.level}` : `notice-${notice.level}`} data-count={notice.count} title={inList ? undefined : `${notice.text}\n(click to read every message in full)`}>
      <span className="notice-text" onClick={inList ? undefined : () => setExpanded((open) => !open)}>{notice.text}</span>
      {notice.count > 1 && <span className="notice-count" data-testid="notice-count" title={`Raised ${notice.count} times`}>×{notice.count}</span>}
      <button type="button" aria-label="Dismiss" onClick={() => onDismiss(notice.id)}>×</button>
    </div>
  );
  return (
    <div className="notices" aria-live="polite" data-testid="notices">
      {recoveryOffer !== undefined && (
        <div className="notice notice-warning" data-testid="recovery-offer">
          <span data-testid="recovery-text">{recoveryOfferText(recoveryOffer)}</span>
          <button type="button" onClick={onRestore} data-testid="recovery-restore">Restore</button>
          <button type="button" onClick={onDiscard} data-testid="recovery-discard">Discard</button>
        </div>
      )}
      {recoveryOffer === undefined && newest === undefined && <span className="notice-idle">No messages.</span>}
      {newest !== undefined && line(newest, false)}
      {newest !== undefined && (
        <button type="button" className="notice-more" onClick={() => setExpanded((open) => !open)} aria-expanded={expanded} data-testid="notices-more">
          {expanded ? 'Close' : earlier.length > 0 ? `${earlier.length} earlier` : 'In full'}
        </button>
      )}
      {expanded && newest !== undefined && <div className="notices-earlier" data-testid="notices-earlier">{[newest, ...earlier].map((notice) => line(notice, true))}</div>}
    </div>
  );
}
