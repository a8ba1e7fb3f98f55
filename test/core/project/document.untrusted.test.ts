import { describe, expect, it } from 'vitest';
import { readProjectText } from '../../../core/project';

describe('readProjectText() with a file that is not a project', () => {
  // Expected: this project's rule (issue 11): a message quoting a file's bytes shows them escaped and short.
  it('readProjectText() quotes the bytes of broken JSON escaped and short', () => {
    const text = `\u001b[2J\u001b]0;title\u0007${'\u009b'.repeat(5000)}`;
    let message = '';
    try {
      readProjectText(text, 'binary.whence');
    } catch (error) {
      message = (error as Error).message;
    }
    expect(message).toMatch(/^binary\.whence could not be read as a Whence project: its JSON text is broken \(/);
    // eslint-disable-next-line no-control-regex -- finding raw control characters is the point
    expect(message).not.toMatch(/[\u0000-\u001f\u007f-\u009f]/);
    expect(message.length).toBeLessThan(400);
  });
});
