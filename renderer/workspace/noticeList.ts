// The list of notices on screen: one per cause, a repeat raises the count of the one shown and moves it to the end;
// at most `limit` kept (the oldest dropped first). Pure; tested in test/renderer/workspace/noticeList.test.ts.

export type NoticeLevel = 'info' | 'warning' | 'error';

export interface NoticeItem {
  id: number;
  level: NoticeLevel;
  text: string;
  /** What the notice is about; notices with the same cause replace each other. Default: the level and the text. */
  cause: string;
  /** How many times it was raised since it was last dismissed (1 for a first notice). */
  count: number;
}

/** Notices kept on screen at once; older ones fall off (the newest of each cause always stays). */
export const NOTICE_LIMIT = 6;

export function noticeCause(level: NoticeLevel, text: string, cause?: string): string {
  return cause ?? `${level}:${text}`;
}

/** The list after raising a notice: a notice of the same cause is replaced by the new text with its count plus one. */
export function addNotice(notices: readonly NoticeItem[], notice: { id: number; level: NoticeLevel; text: string; cause?: string }, limit = NOTICE_LIMIT): NoticeItem[] {
  const cause = noticeCause(notice.level, notice.text, notice.cause);
  const previous = notices.find((item) => item.cause === cause);
  const rest = notices.filter((item) => item.cause !== cause);
  const added: NoticeItem = { id: notice.id, level: notice.level, text: notice.text, cause, count: (previous?.count ?? 0) + 1 };
  return [...rest, added].slice(-Math.max(1, limit));
}
