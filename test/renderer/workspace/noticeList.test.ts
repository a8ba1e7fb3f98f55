import { describe, expect, it } from 'vitest';
import { addNotice, type NoticeItem } from '../../../renderer/workspace/noticeList';

// Expected values: the collapsing rule is this project's choice (issue 10, defect 4): one notice per cause, a repeat raises
// the count and moves it to the end, at most `limit` kept.
describe('addNotice()', () => {
  it('addNotice() collapses a repeated notice into one with a count, newest last', () => {
    let list: NoticeItem[] = [];
    list = addNotice(list, { id: 1, level: 'error', text: 'Row 2: east is not a number.' });
    list = addNotice(list, { id: 2, level: 'info', text: '21 events found, 21 ok.' });
    list = addNotice(list, { id: 3, level: 'error', text: 'Row 2: east is not a number.' });
    list = addNotice(list, { id: 4, level: 'error', text: 'Row 2: east is not a number.' });
    expect(list.map((n) => [n.text, n.count])).toEqual([['21 events found, 21 ok.', 1], ['Row 2: east is not a number.', 3]]);
    expect(list[1]!.id).toBe(4);
  });

  it('addNotice() keeps one notice per cause: a new text of the same cause replaces the old one', () => {
    let list = addNotice([], { id: 1, level: 'warning', text: 'Cannot locate yet: channel 7 missing.', cause: 'locate-readiness' });
    list = addNotice(list, { id: 2, level: 'warning', text: 'Cannot locate yet: channel 8 missing.', cause: 'locate-readiness' });
    expect(list).toHaveLength(1);
    expect(list[0]).toMatchObject({ text: 'Cannot locate yet: channel 8 missing.', count: 2 });
  });

  it('addNotice() tells the same text at different levels apart and drops the oldest beyond the limit', () => {
    let list = addNotice([], { id: 1, level: 'warning', text: 'same' });
    list = addNotice(list, { id: 2, level: 'error', text: 'same' });
    expect(list).toHaveLength(2);
    for (let id = 3; id <= 10; id++) list = addNotice(list, { id, level: 'info', text: `n${id}` }, 3);
    expect(list.map((n) => n.text)).toEqual(['n8', 'n9', 'n10']);
  });
});
