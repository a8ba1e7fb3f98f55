import { describe, expect, it } from 'vitest';
import { progressLine } from '../../../main/cli/progress';
import type { CliIo } from '../../../main/cli/io';

function fakeIo(terminal: boolean): CliIo & { stderr: string } {
  const io = { stderr: '', stderrIsTerminal: terminal, cwd: '/', writeStdout: () => undefined, writeStderr: (text: string) => { io.stderr += text; } };
  return io;
}

describe('progressLine()', () => {
  // Expected values: the behaviour this project specifies (bar layout, wording); time left = elapsed (1 - f) / f worked by hand.
  it('draws a bar with events found and time left on a terminal', () => {
    const io = fakeIo(true);
    let nowMilliseconds = 0;
    const line = progressLine(io, () => nowMilliseconds);
    nowMilliseconds = 10_000;
    line.update({ fraction: 0.25, eventsFound: 7, eventsLocated: 5, scannedSeconds: 150 });
    line.done();
    // A quarter done after 10 s: 30 s left at the same pace.
    expect(io.stderr).toContain(' 25%  7 events found, 5 located, 00:00:30 left');
    expect(io.stderr).toMatch(/\[#{8} {22}\]/);
    expect(io.stderr.endsWith('\n')).toBe(true);
  });

  it('stays quiet when standard error is piped', () => {
    const io = fakeIo(false);
    const line = progressLine(io, () => 5000);
    line.update({ fraction: 0.5, eventsFound: 1, eventsLocated: 1, scannedSeconds: 1 });
    line.done();
    expect(io.stderr).toBe('');
  });
});
