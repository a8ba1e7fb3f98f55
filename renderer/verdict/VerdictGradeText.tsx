// The grade of a verdict in a table cell: its symbol in the verdict's colour, then the grade in words ("△ doubtful").
// Shared by the events table and the fix log so both show a verdict the same way.
import type { VerdictGrade as Grade } from '../../core/locate';
import { VERDICT_STYLES } from './verdictStyle';

export function VerdictGradeText({ grade }: { grade: Grade }) {
  const style = VERDICT_STYLES[grade];
  return (
    <span className="verdict-grade"><span className="verdict-symbol" style={{ color: style.colour }} aria-hidden="true">{style.symbol}</span> {grade}</span>
  );
}
