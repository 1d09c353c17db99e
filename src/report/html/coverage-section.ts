import type { CoverageData, Part } from '../report-data.js';
import type { Reconciliation } from '../../types.js';
import { absentNote } from './absent-note.js';
import { coverageHeatmap } from './coverage-heatmap.js';
import { groupThousands } from './format-value.js';
import { htmlTable } from './html-table.js';
import { MISSING_STYLE } from './palette.js';
import { reconciliationTable } from './reconciliation-table.js';
import { sectionFrame } from './section-frame.js';

/** Section 1: who wrote when (heatmap, missing bins by reason) and what happened to every input row. */
export function coverageSection(coverage: Part<CoverageData>, reconciliation: Part<Reconciliation>): string {
  const parts: string[] = [];
  if (coverage.ok) {
    const c = coverage.value;
    parts.push(coverageHeatmap(c));
    const missingTotal = Object.values(c.missingBins).reduce((a, b) => a + b, 0);
    const rows = Object.entries(c.missingBins)
      .sort((a, b) => b[1] - a[1])
      .map(([reason, n]) => [reason, MISSING_STYLE[reason]?.label ?? 'other', groupThousands(n), `${((100 * n) / Math.max(1, c.totalBins)).toFixed(1)}%`]);
    rows.push(['all missing', '', groupThousands(missingTotal), `${((100 * missingTotal) / Math.max(1, c.totalBins)).toFixed(1)}%`]);
    parts.push(
      htmlTable(
        [{ label: 'Reason' }, { label: 'Meaning' }, { label: 'Bins', numeric: true }, { label: `Share of ${groupThousands(c.totalBins)} bins`, numeric: true }],
        rows,
        `Missing bins by reason (bins of ${c.binHours} h)`,
      ),
    );
  } else parts.push(absentNote('The coverage heatmap is', coverage.reason));
  parts.push(reconciliation.ok ? reconciliationTable(reconciliation.value) : absentNote('The input reconciliation is', reconciliation.reason));
  return sectionFrame('coverage', 1, 'Coverage', 'Who wrote on which days, which bins are missing and why, and what became of every input row.', parts.join(''));
}
