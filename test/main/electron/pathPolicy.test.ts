import { describe, expect, it } from 'vitest';
import { checkUserPath } from '../../../main/electron/pathPolicy';
import { safeFileName } from '../../../main/electron/dialogs';

describe('checkUserPath()', () => {
  // Expected values: the behaviour this project specifies (accepted extensions, messages, codes); no outside reference.
  it('accepts absolute paths of the kinds Whence reads, whatever the letter case', () => {
    expect(checkUserPath('/data/night3/HEDGE_0003.WAV', 'recording')).toBe('/data/night3/HEDGE_0003.WAV');
    expect(checkUserPath('/data/long.rf64', 'recording')).toBe('/data/long.rf64');
    expect(checkUserPath('/data/array.csv', 'array')).toBe('/data/array.csv');
    expect(checkUserPath('/data/survey.whence', 'project')).toBe('/data/survey.whence');
    expect(checkUserPath('/data/survey.whence.bak', 'project')).toBe('/data/survey.whence.bak');
  });

  it('refuses relative paths, NUL characters and other kinds of file, saying what it accepts', () => {
    expect(() => checkUserPath('night3/a.wav', 'recording')).toThrow(/full path/);
    expect(() => checkUserPath('/data/a.wav\0.txt', 'recording')).toThrow(/full path/);
    expect(() => checkUserPath('/home/me/.ssh/id_rsa', 'recording')).toThrow(/\.wav, \.wave, \.rf64, \.bwf/);
    expect(() => checkUserPath('/data/a.wav', 'project')).toThrow(/not a project file/);
    expect(() => checkUserPath('/etc/passwd', 'array')).toThrow(expect.objectContaining({ code: 'path-refused' }));
  });
});

describe('safeFileName()', () => {
  // Expected values: characters reserved in file names on desktop systems (: / and control characters), common practice; the 120-character cap is this project's choice.
  it('replaces characters no desktop system allows and falls back when nothing is left', () => {
    expect(safeFileName('Pond: night 3/4', 'Untitled')).toBe('Pond- night 3-4');
    expect(safeFileName('a\u0001b', 'x')).toBe('a-b');
    expect(safeFileName(' .. ', 'Untitled')).toBe('Untitled');
    expect(safeFileName('x'.repeat(300), 'u')).toHaveLength(120);
  });
});
