// Public face of renderer/verdict: the look of the plain-words verdicts (colour, marker, symbol) shared by tables and map.
export { VERDICT_ORDER, VERDICT_STYLES, verdictLabel, type VerdictMarker, type VerdictStyle } from './verdictStyle';
export { VerdictGradeText } from './VerdictGradeText';
