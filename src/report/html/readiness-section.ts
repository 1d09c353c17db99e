import type { DynamicsData, Part, ReadinessData } from '../report-data.js';
import { absentNote } from './absent-note.js';
import { crossMapNote } from './cross-map-note.js';
import { escapeHtml } from './escape-html.js';
import { formatValue } from './format-value.js';
import { htmlTable } from './html-table.js';
import { lagPairsChart } from './lag-pairs-chart.js';
import { sectionFrame } from './section-frame.js';

/**
 * Section 5: whether each person's series can carry dynamic models (length, % missing, longest
 * gap, usable lag pairs, lag-1 autocorrelation, MSSD), then the dynamics results when that stage
 * ran.
 */
export function readinessSection(readiness: Part<ReadinessData>, dynamics: Part<DynamicsData>): string {
  const parts: string[] = [];
  if (readiness.ok) {
    const r = readiness.value;
    parts.push(lagPairsChart(r));
    parts.push(
      htmlTable(
        [
          { label: 'Person' },
          { label: 'Bins', numeric: true, help: 'bins in the person\'s window, observed or not' },
          { label: '% missing', numeric: true },
          { label: 'Longest gap (bins)', numeric: true },
          { label: 'Longest gap (hours)', numeric: true },
          { label: 'Usable lag pairs', numeric: true, help: 'adjacent observed bins' },
          { label: 'Lag-1 autocorrelation', numeric: true, help: 'Pearson correlation of the usable lag pairs' },
          { label: 'MSSD', numeric: true, help: 'mean squared successive difference over usable lag pairs (von Neumann et al. 1941)' },
          { label: 'Ready' },
        ],
        r.persons.map((p) => [p.person, String(p.bins), formatValue(p.percentMissing, 1), String(p.longestGapBins), formatValue(p.longestGapHours, 0), String(p.lagPairs), formatValue(p.autocorrelation), formatValue(p.mssd, 3), p.ready ? 'yes' : 'no']),
        `Per person, ${r.variable}: ready means at least ${r.minLagPairs} usable lag pairs`,
        (i) => (r.persons[i]?.ready ? undefined : 'not-ready'),
      ),
    );
  } else parts.push(absentNote('Readiness figures are', readiness.reason));
  parts.push('<h3>Dynamics results</h3>');
  if (dynamics.ok) parts.push('<p class="note">One table per output file of the dynamics stage; open a table to read it (the CSV files hold the same rows).</p>');
  if (dynamics.ok) {
    const note = crossMapNote(dynamics.value);
    if (note) parts.push(note);
  }
  if (dynamics.ok) {
    for (const t of dynamics.value.tables) {
      const omitted = t.omitted ? `<p class="note">${t.omitted} more rows are in the output file; ${escapeHtml(t.title)} is cut here to keep the page light.</p>` : '';
      parts.push(`<details class="results"><summary>${escapeHtml(t.title)} (${t.rows.length + (t.omitted ?? 0)} rows)</summary>${htmlTable(t.columns.map((c) => ({ label: c })), t.rows)}${omitted}</details>`);
    }
  } else parts.push(absentNote('Dynamics results are', dynamics.reason));
  return sectionFrame('dynamics', 5, 'Dynamics readiness', 'Whether each person\'s series is long and complete enough for inertia, instability and cross-lagged models.', parts.join(''));
}
