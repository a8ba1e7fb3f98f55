import { describe, expect, it } from 'vitest';
import { jsonForTerminal, terminalDataSafe, terminalSafe, verdictTally } from '../../../main/cli/format';

// Expected: this project's rule (issue 11); the characters are the ECMA-48 C0/C1 controls, DEL and Unicode's
// separators and bidirectional controls (UAX #9).
describe('terminal guards', () => {
  it('terminalSafe() escapes control characters in messages, keeping line breaks and a progress line\'s leading CR', () => {
    expect(terminalSafe('\r[###   ] 50%')).toBe('\r[###   ] 50%');
    expect(terminalSafe('warning: a\u001b[2Jb\rforged\n')).toBe('warning: a\\x1b[2Jb\\x0dforged\n');
  });

  it('terminalDataSafe() keeps tabs and line breaks of results and writes other controls as JSON-valid \\u escapes', () => {
    expect(terminalDataSafe('a\tb\r\nc\u001b[31m\u009b\u202e\u0007')).toBe('a\tb\r\nc\\u001b[31m\\u009b\\u202e\\u0007');
    const json = JSON.stringify({ name: 'x\u009by\u2028z' });
    expect(JSON.parse(terminalDataSafe(json))).toEqual({ name: 'x\u009by\u2028z' });
  });

  it('jsonForTerminal() gives JSON that reads back the same and holds no raw DEL, C1 or bidi control', () => {
    const value = { file: 'a\u007f\u0085\u202eb', warnings: ['\u001b[2J'] };
    const text = jsonForTerminal(value);
    // eslint-disable-next-line no-control-regex -- finding raw control characters is the point
    expect(text).not.toMatch(/[\u0000-\u0009\u000b-\u001f\u007f-\u009f\u202e]/);
    expect(JSON.parse(text)).toEqual(value);
  });
});

describe('verdictTally()', () => {
  // Expected: counted by hand from the records below; grades in core/locate VERDICT_GRADES order.
  it('verdictTally() counts the records of each grade, every grade named, in grade order', () => {
    expect(verdictTally([{ verdict: 'doubtful' }, { verdict: 'firm' }, { verdict: 'doubtful' }, { status: 'ok' }])).toBe('1 firm, 2 doubtful, 0 unusable');
  });
});
