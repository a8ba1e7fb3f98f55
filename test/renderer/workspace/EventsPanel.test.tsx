import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { locatedVerdict } from '../../../core/pipeline';
import { EventsPanel } from '../../../renderer/workspace/EventsPanel';
import { locatedEvent, squareArray } from '../fixlog/locatedFixtures';

const noop = () => undefined;

/** The text of the table cells of one row, tags stripped. */
function cellsOfRow(html: string, row: number): string[] {
  const start = html.indexOf(`data-testid="event-row-${row}"`);
  const end = html.indexOf('</tr>', start);
  return [...html.slice(start, end).matchAll(/<td[^>]*>([\s\S]*?)<\/td>/g)].map((match) => (match[1] ?? '').replace(/<[^>]+>/g, ''));
}

describe('EventsPanel', () => {
  it('EventsPanel numbers events from 1 and writes coordinates with a true minus and never "−0.00"', () => {
    // A fix a hair west and south of the origin rounds to 0.00, not -0.00 (common practice: no signed zero in tables);
    // negative values use U+2212 like the map and the fix log (BIPM SI Brochure, 9th ed., 5.4.2: the minus sign).
    const nearOrigin = locatedEvent(squareArray, [-0.001, -0.002, 1.5], 0, 2, 1, 1e-9);
    const southWest = locatedEvent(squareArray, [-13.99, -9.5, 1.5], 1, 2, 2, 1e-9);
    const events = [nearOrigin, southWest];
    const html = renderToStaticMarkup(<EventsPanel events={events} verdicts={events.map((event) => locatedVerdict(event, { microphones: squareArray }))} selectedIndex={undefined} loggedEventIndices={new Set()} onSelect={noop} onLog={noop} />);
    const first = cellsOfRow(html, 0);
    const second = cellsOfRow(html, 1);
    expect(first[0]).toBe('1');
    expect(second[0]).toBe('2');
    expect(first[3]).toBe('0.00');
    expect(first[4]).toBe('0.00');
    expect(second[3]).toBe('−13.99');
    expect(second[4]).toBe('−9.50');
  });
});
