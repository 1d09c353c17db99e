import type { Reconciliation } from '../../types.js';
import { escapeHtml } from './escape-html.js';
import { groupThousands } from './format-value.js';

const byCount = (a: [string, number], b: [string, number]): number => b[1] - a[1] || (a[0] < b[0] ? -1 : 1);

/**
 * The input reconciliation as a table: rows read = scored + rejected (by reason) + dropped (by
 * reason, e.g. third-party messages), with each share of rows read. A sum that does not add up is
 * shown as a highlighted line, never hidden.
 */
export function reconciliationTable(r: Reconciliation): string {
  const share = (n: number): string => (r.read > 0 ? `${((100 * n) / r.read).toFixed(1)}%` : '–');
  const rejected = Object.values(r.rejected).reduce((a, b) => a + b, 0);
  const dropped = Object.values(r.dropped).reduce((a, b) => a + b, 0);
  const row = (label: string, n: number, cls = ''): string => `<tr${cls ? ` class="${cls}"` : ''}><th scope="row">${escapeHtml(label)}</th><td class="num">${groupThousands(n)}</td><td class="num">${share(n)}</td></tr>`;
  const rows = [row('Rows read', r.read, 'total'), row('Scored', r.scored)];
  rows.push(row('Rejected', rejected));
  for (const [code, n] of Object.entries(r.rejected).sort(byCount)) rows.push(row(`  ${code.replace(/_/g, ' ')}`, n, 'sub'));
  rows.push(row('Dropped on purpose', dropped));
  for (const [code, n] of Object.entries(r.dropped).sort(byCount)) rows.push(row(`  ${code.replace(/_/g, ' ')}`, n, 'sub'));
  const sum = r.scored + rejected + dropped;
  if (sum !== r.read) rows.push(`<tr class="mismatch"><td colspan="3">The counts do not add up: scored + rejected + dropped = ${groupThousands(sum)}, not ${groupThousands(r.read)}. Please report this as a bug.</td></tr>`);
  return `<table class="reconciliation"><caption>Input reconciliation: every row read is scored, rejected with a reason, or dropped on purpose</caption><thead><tr><th>Rows</th><th class="num">Count</th><th class="num">Share of read</th></tr></thead><tbody>${rows.join('')}</tbody></table>`;
}
