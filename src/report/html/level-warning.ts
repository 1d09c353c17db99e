import type { ValidationPair } from '../report-data.js';
import { formatValue } from './format-value.js';

/** A difference this large between within- and between-person r is worth a warning (common practice). */
const SIZE_GAP = 0.3;

const clear = (c: { ciLow?: number; ciHigh?: number }): boolean => c.ciLow !== undefined && c.ciHigh !== undefined && (c.ciLow > 0 || c.ciHigh < 0);

/**
 * A plain-words warning when the within-person and between-person correlations of a pair
 * disagree in sign or differ by 0.3 or more while both intervals exclude zero, or undefined when
 * they agree, one is missing or one interval includes zero. Used when the validate stage's own
 * warnings are not at hand.
 */
export function levelWarning(pair: ValidationPair): string | undefined {
  const w = pair.within;
  const b = pair.between;
  if ('missing' in w || 'missing' in b || !clear(w) || !clear(b)) return undefined;
  if (Math.sign(w.r) !== Math.sign(b.r))
    return `Within persons r = ${formatValue(w.r)}, between persons r = ${formatValue(b.r)}: the two levels point in opposite directions. What is true across people is not true within a person here; do not read one level as the other.`;
  if (Math.abs(w.r - b.r) >= SIZE_GAP)
    return `Within persons r = ${formatValue(w.r)}, between persons r = ${formatValue(b.r)}: the levels differ in size. Report them separately; the pooled r mixes both.`;
  return undefined;
}
