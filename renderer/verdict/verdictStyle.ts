// How a verdict looks everywhere in the app: a colour from the Okabe-Ito palette (told apart by colour-blind readers),
// a marker shape and a symbol, so no grade is told by colour alone. Pure.
import type { VerdictGrade } from '../../core/locate';

export type VerdictMarker = 'plus' | 'triangle' | 'cross';

export interface VerdictStyle {
  grade: VerdictGrade;
  /** "#rrggbb": blue, orange and vermilion of the Okabe & Ito (2008) colour-blind-safe palette. */
  colour: string;
  /** Map marker at the fix: a plus for firm, a triangle for doubtful, a diagonal cross for unusable. */
  marker: VerdictMarker;
  /** The same shape as a text symbol, for tables and the legend. */
  symbol: string;
  /** What to do, for the legend and tooltips. */
  advice: string;
}

export const VERDICT_STYLES: Readonly<Record<VerdictGrade, VerdictStyle>> = Object.freeze({
  firm: { grade: 'firm', colour: '#0072b2', marker: 'plus', symbol: '+', advice: 'act on it with its ellipse' },
  doubtful: { grade: 'doubtful', colour: '#e69f00', marker: 'triangle', symbol: '△', advice: 'check it before acting' },
  unusable: { grade: 'unusable', colour: '#d55e00', marker: 'cross', symbol: '×', advice: 'do not act on it' },
});

/** The grades in the order the legend lists them. */
export const VERDICT_ORDER: readonly VerdictGrade[] = ['firm', 'doubtful', 'unusable'];

/** "△ doubtful" */
export function verdictLabel(grade: VerdictGrade): string {
  return `${VERDICT_STYLES[grade].symbol} ${grade}`;
}
