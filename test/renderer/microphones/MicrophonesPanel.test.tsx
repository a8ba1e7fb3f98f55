import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import type { ArrayMicrophone } from '../../../core/project';
import { MicrophonesPanel } from '../../../renderer/microphones';

const microphones: ArrayMicrophone[] = [
  { channel: 1, label: 'gate', eastMeters: 0, northMeters: 0, upMeters: 1.5, surveySigmaMeters: 0.03 },
  { channel: 2, label: 'oak', eastMeters: 38.42, northMeters: 4.1, upMeters: 1.62, surveySigmaMeters: 0.03 },
  { channel: 6, label: 'pond', eastMeters: 52.05, northMeters: 36.77, upMeters: 1.4, surveySigmaMeters: 0.05 },
];
const noop = () => undefined;

/** The opening tag of the element with this test id. */
function tagOf(html: string, testId: string): string {
  const at = html.indexOf(`data-testid="${testId}"`);
  if (at < 0) return '';
  return html.slice(html.lastIndexOf('<', at), html.indexOf('>', at) + 1);
}

function render(recordingChannelCount?: number): string {
  return renderToStaticMarkup(<MicrophonesPanel microphones={microphones} recordingChannelCount={recordingChannelCount} onChange={noop} onImportArray={noop} onExportArray={noop} />);
}

describe('MicrophonesPanel', () => {
  it('MicrophonesPanel renders one row per microphone with the test ids of its cells and controls', () => {
    const html = render();
    for (const id of ['microphones-panel', 'microphone-add', 'microphones-import', 'microphones-export', 'microphone-row-3', 'microphone-cell-2-east', 'microphone-cell-2-north', 'microphone-cell-2-up', 'microphone-cell-2-sigma', 'microphone-cell-1-channel', 'microphone-cell-1-label', 'microphone-remove-3']) {
      expect(html).toContain(`data-testid="${id}"`);
    }
    expect(html).toContain('value="38.42"');
    expect(html).not.toContain('microphone-message-');
  });

  it('MicrophonesPanel shows the message of a channel beyond the recording next to its row and disables export', () => {
    const html = render(4);
    const message = /data-testid="microphone-message-3"[^>]*>(.*?)<\/td>/.exec(html)?.[1] ?? '';
    expect(message).toContain('channel 6 is beyond the recording&#x27;s 4 channels');
    expect(tagOf(html, 'microphone-cell-3-channel')).toContain('aria-invalid="true"');
    expect(tagOf(html, 'microphone-cell-2-channel')).not.toContain('aria-invalid');
    expect(tagOf(html, 'microphones-export')).toContain('disabled=""');
    expect(tagOf(render(), 'microphones-export')).not.toContain('disabled');
  });
});
