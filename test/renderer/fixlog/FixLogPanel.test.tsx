import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { locatedVerdict } from '../../../core/pipeline';
import { FixLogPanel } from '../../../renderer/fixlog';
import { fixLogEntryFromLocated } from '../../../renderer/fixlog/entryFromLocated';
import { locatedEvent, siteRecording, squareArray, surveyContext } from './locatedFixtures';

const entries = [locatedEvent(squareArray, [100, 150, 1.5], 0, 2, 1), locatedEvent(squareArray, [20, 35, 1.5], 1, 2, 2)]
  .map((event, i) => fixLogEntryFromLocated(event, { id: `f${i + 1}`, recording: siteRecording, verdict: locatedVerdict(event, { microphones: squareArray }), label: i === 0 ? 'owl' : '', accepted: i === 0 }));
const noop = () => undefined;

/** The opening tag of the element with this test id. */
function tagOf(html: string, testId: string): string {
  const at = html.indexOf(`data-testid="${testId}"`);
  if (at < 0) return '';
  return html.slice(html.lastIndexOf('<', at), html.indexOf('>', at) + 1);
}

describe('FixLogPanel', () => {
  it('FixLogPanel renders a row per fix with its accept toggle, label and note by test id', () => {
    const html = renderToStaticMarkup(<FixLogPanel entries={entries} context={surveyContext(squareArray, 2, true)} selectedId="f2" onChange={noop} onSelect={noop} onExport={noop} />);
    for (const id of ['fixlog-panel', 'fixlog-row-f1', 'fixlog-row-f2', 'fixlog-accept-f1', 'fixlog-label-f1', 'fixlog-note-f2', 'fixlog-export-csv', 'fixlog-export-geojson']) {
      expect(html).toContain(`data-testid="${id}"`);
    }
    expect(tagOf(html, 'fixlog-accept-f1')).toContain('checked=""');
    expect(tagOf(html, 'fixlog-accept-f2')).not.toContain('checked');
    expect(tagOf(html, 'fixlog-row-f2')).toContain('aria-selected="true"');
    expect(tagOf(html, 'fixlog-row-f1')).toContain('aria-selected="false"');
    expect(html).toContain('value="owl"');
    expect(html).toContain('Lat, Lon (°)');
  });

  it('FixLogPanel disables GeoJSON without an origin and both exports without a context', () => {
    const noOrigin = renderToStaticMarkup(<FixLogPanel entries={entries} context={surveyContext(squareArray, 2, false)} onChange={noop} onSelect={noop} onExport={noop} />);
    expect(tagOf(noOrigin, 'fixlog-export-geojson')).toContain('disabled=""');
    expect(tagOf(noOrigin, 'fixlog-export-csv')).not.toContain('disabled');
    expect(noOrigin).not.toContain('Lat, Lon (°)');
    const noContext = renderToStaticMarkup(<FixLogPanel entries={entries} context={undefined} onChange={noop} onSelect={noop} onExport={noop} />);
    expect(tagOf(noContext, 'fixlog-export-csv')).toContain('disabled=""');
  });
});
