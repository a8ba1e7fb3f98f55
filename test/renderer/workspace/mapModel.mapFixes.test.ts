import { describe, expect, it } from 'vitest';
import { mapFixes } from '../../../renderer/workspace/mapModel';
import { locatedEvent, squareArray } from '../fixlog/locatedFixtures';

describe('mapFixes()', () => {
  // Expected values: invented events (../fixlog/locatedFixtures); the verdicts are given by the caller, so the map shows exactly those.
  it('mapFixes() marks each fix with the verdict given for its event, in the order of the events', () => {
    const events = [locatedEvent(squareArray, [20, 35, 1.5], 0, 2, 4), locatedEvent(squareArray, [-15, 10, 1.5], 1, 2, 5)];
    const verdicts = [{ grade: 'doubtful' as const, reason: 'first' }, { grade: 'firm' as const, reason: 'second' }];
    const fixes = mapFixes(events, 1, verdicts);
    expect(fixes.map((fix) => [fix.id, fix.verdict, fix.verdictReason, fix.selected])).toEqual([
      ['event-0', 'doubtful', 'first', false],
      ['event-1', 'firm', 'second', true],
    ]);
  });
});
