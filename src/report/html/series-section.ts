import type { Part, SeriesData } from '../report-data.js';
import { absentNote } from './absent-note.js';
import { escapeHtml } from './escape-html.js';
import { sectionFrame } from './section-frame.js';
import { seriesChart } from './series-chart.js';
import { seriesSparkline } from './series-sparkline.js';

/** Most small multiples drawn; beyond this the page says how many persons are left out. */
export const MAX_SMALL_MULTIPLES = 60;

const HOUR = 3_600_000;

/**
 * Section 2: the selected person's score and self-report on a shared time axis with two labelled
 * scales, then small multiples of the first {@link MAX_SMALL_MULTIPLES} persons (in id order) over
 * the same time range, so a 500-person study still gives a page that opens quickly.
 */
export function seriesSection(series: Part<SeriesData>): string {
  if (!series.ok) return sectionFrame('series', 2, 'Per-person series', 'Each person\'s text score beside their self-reports over time.', absentNote('The per-person series are', series.reason));
  const s = series.value;
  const parts: string[] = [];
  const selected = s.persons.find((p) => p.person === s.selected) ?? s.persons[0];
  const others = s.scores.filter((c) => c !== s.score);
  parts.push(
    `<p>Score drawn: <code>${escapeHtml(s.score)}</code>${others.length ? ` (also in the series: ${others.map((c) => `<code>${escapeHtml(c)}</code>`).join(', ')}; choose with <code>--score</code>)` : ''}. ` +
      `Self-report: ${s.rating ? `<code>${escapeHtml(s.rating)}</code>` : 'none aligned to the bins'}. Large view: person <code>${escapeHtml(selected?.person ?? '–')}</code> (choose with <code>--person</code>).</p>`,
  );
  if (selected) parts.push(seriesChart(selected, { score: s.score, ...(s.rating ? { rating: s.rating } : {}), binHours: s.binHours }));
  let xMin = Infinity;
  let xMax = -Infinity;
  for (const p of s.persons) {
    const a = p.points[0];
    const b = p.points[p.points.length - 1];
    if (a && a.start < xMin) xMin = a.start;
    if (b && b.start + b.hours * HOUR > xMax) xMax = b.start + b.hours * HOUR;
  }
  const shown = s.persons.slice(0, MAX_SMALL_MULTIPLES);
  parts.push(
    `<h3>All persons at a glance</h3><p class="note">Blue: ${escapeHtml(s.score)}; dashed vermillion: ${escapeHtml(s.rating ?? 'no self-report')}. Each panel has its own vertical scales (compare shapes, not heights); grey ticks along the bottom are missing bins, reddish-purple ticks at the top are clock-change days. All panels share the same dates.${
      s.persons.length > shown.length ? ` Showing the first ${shown.length} of ${s.persons.length} persons in id order to keep the page quick to open; section 5 lists every person.` : ''
    }</p>`,
  );
  parts.push(`<div class="multiples">${shown.map((p) => seriesSparkline(p, xMin, xMax, s.rating !== undefined)).join('')}</div>`);
  return sectionFrame('series', 2, 'Per-person series', 'Each person\'s text score beside their self-reports over time, with gaps and clock changes left visible.', parts.join(''));
}
