// The error for a table a user gave us: names the file, the line and the column so it can be fixed in a spreadsheet.
import { WhenceError } from '../errors';

export interface CsvLocation { fileName: string; lineNumber?: number; columnName?: string }

export class CsvError extends WhenceError {
  readonly location: CsvLocation;

  constructor(location: CsvLocation, problem: string) {
    const where = [location.fileName, location.lineNumber !== undefined ? `line ${location.lineNumber}` : undefined, location.columnName !== undefined ? `column '${location.columnName}'` : undefined]
      .filter((part) => part !== undefined)
      .join(', ');
    super('bad-table', `${where}: ${problem}`);
    this.name = 'CsvError';
    this.location = location;
  }
}
