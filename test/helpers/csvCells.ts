// How a spreadsheet splits one CSV line into cells (RFC 4180 quoting), for tests of what a written table shows.

/** RFC 4180 fields of one line, as a spreadsheet splits it (quotes open a field only at its start). */
export function spreadsheetCells(line: string): string[] {
  const cells: string[] = [];
  let i = 0;
  while (i <= line.length) {
    if (line[i] === '"') {
      let cell = '';
      i++;
      while (i < line.length) {
        if (line[i] === '"' && line[i + 1] === '"') { cell += '"'; i += 2; } else if (line[i] === '"') { i++; break; } else { cell += line[i++]; }
      }
      const end = line.indexOf(',', i);
      cells.push(cell + (end < 0 ? line.slice(i) : line.slice(i, end)));
      i = end < 0 ? line.length + 1 : end + 1;
    } else {
      const end = line.indexOf(',', i);
      cells.push(end < 0 ? line.slice(i) : line.slice(i, end));
      i = end < 0 ? line.length + 1 : end + 1;
    }
  }
  return cells;
}
