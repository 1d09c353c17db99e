import type { ShownCorrelation } from '../report-data.js';
import { formatValue } from './format-value.js';

/** `r = 0.21 [0.12, 0.30], 1,204 df` — or the reason a correlation could not be estimated. */
export function correlationText(c: ShownCorrelation | { missing: string }, countLabel: string): string {
  if ('missing' in c) return `not estimable: ${c.missing}`;
  const ci = c.ciLow !== undefined && c.ciHigh !== undefined ? ` [${formatValue(c.ciLow)}, ${formatValue(c.ciHigh)}]` : ' (no interval)';
  const count = countLabel === 'df' ? (c.df ?? c.n) : c.n;
  return `r = ${formatValue(c.r)}${ci}, ${count} ${countLabel}`;
}
