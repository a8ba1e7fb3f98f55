import { describe, expect, it } from 'vitest';
import { exportFileName, fileNamePart, localDateText } from '../../../renderer/workspace/exportFileName';

// Expected values: the naming rule is this project's choice (issue 10, defect 6); the characters refused are those Windows
// refuses in file names (common practice: < > : " / \ | ? * and control characters), which macOS and Linux accept.
describe('exportFileName()', () => {
  const date = new Date(2026, 11, 3, 9, 30);

  it('exportFileName() names an export after the project, what it is and the local date', () => {
    expect(exportFileName('Quillmere Pond dawn survey (invented demo)', 'log', 'csv', date)).toBe('Quillmere-Pond-dawn-survey-(invented-demo)-log-2026-12-03.csv');
    expect(exportFileName('Site 4', 'array', 'csv', date)).toBe('Site-4-array-2026-12-03.csv');
  });

  it('fileNamePart() turns refused characters into dashes and falls back to "whence" when nothing is left', () => {
    expect(fileNamePart('a/b\\c:d*e?f"g<h>i|j\u0007k')).toBe('a-b-c-d-e-f-g-h-i-j-k');
    expect(fileNamePart('  ..//  ')).toBe('whence');
    expect(fileNamePart('Étang de la Brenne')).toBe('Étang-de-la-Brenne');
    expect(Array.from(fileNamePart('x'.repeat(200)))).toHaveLength(60);
  });

  it('localDateText() writes the local calendar date with two-digit month and day', () => {
    expect(localDateText(new Date(2027, 0, 5, 23, 59))).toBe('2027-01-05');
  });
});
