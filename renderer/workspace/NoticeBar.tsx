// Messages for the user (what happened, what is wrong and what to do), and the offer to restore unsaved work.
import { useEffect } from 'react';
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
  useEffect(() => {
    const timers = notices.filter((notice) => notice.level === 'info').map((notice) => setTimeout(() => onDismiss(notice.id), INFO_NOTICE_MILLISECONDS));
    return () => timers.forEach(clearTimeout);
  }, [notices, onDismiss]);
  if (notices.length === 0 && recoveryOffer === undefined) return null;
  return (
    <div className="notices" aria-live="polite" data-testid="notices">
      {recoveryOffer !== undefined && (
        <div className="notice notice-warning" data-testid="recovery-offer">
          <span data-testid="recovery-text">{recoveryOfferText(recoveryOffer)}</span>
          <button type="button" onClick={onRestore} data-testid="recovery-restore">Restore it</button>
          <button type="button" onClick={onDiscard} data-testid="recovery-discard">Discard</button>
        </div>
      )}
      {notices.map((notice) => (
        <div key={notice.id} className={`notice notice-${notice.level}`} role={notice.level === 'error' ? 'alert' : undefined} data-testid={`notice-${notice.level}`}>
          <span>{notice.text}</span>
          <button type="button" aria-label="Dismiss" onClick={() => onDismiss(notice.id)}>×</button>
        </div>
      ))}
    </div>
  );
}
