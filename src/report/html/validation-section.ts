import { centrePoints } from '../data/centre-points.js';
import type { Part, RatingsReconciliation, ValidationData, ValidationPair } from '../report-data.js';
import { absentNote } from './absent-note.js';
import { correlationText } from './correlation-text.js';
import { escapeHtml } from './escape-html.js';
import { formatValue, groupThousands } from './format-value.js';
import { htmlTable } from './html-table.js';
import { levelWarning } from './level-warning.js';
import { PALETTE } from './palette.js';
import { ratingsReconciliationTable } from './ratings-reconciliation-table.js';
import { reliabilityChart } from './reliability-chart.js';
import { scatterChart } from './scatter-chart.js';
import { sectionFrame } from './section-frame.js';

/** `r = 0.31, 1,204 pairs`: the pooled r without an interval, or why it is missing. */
function pooledText(c: ValidationPair['pooled']): string {
  return 'missing' in c ? `not estimable: ${c.missing}` : `r = ${formatValue(c.r)}, ${groupThousands(c.n)} pairs`;
}

function warningsOf(pair: ValidationPair): string[] {
  if (pair.warnings.length) return pair.warnings;
  const own = levelWarning(pair);
  return own ? [own] : [];
}

function scatters(pair: ValidationPair): string {
  if (!pair.points || pair.points.length === 0) return absentNote('The scatters are', 'the aligned pairs of this score and rating were not found in the output folder.');
  const { within, means } = centrePoints(pair.points);
  return (
    `<div class="side-by-side">` +
    scatterChart({
      name: 'scatter-within',
      title: `Within persons: ${pair.score} against ${pair.rating}, each centred on the person's mean`,
      note: 'One dot per aligned bin; 0 is the person\'s own average.',
      points: within,
      xLabel: `${pair.score} − person mean (score units)`,
      yLabel: `${pair.rating} − person mean (rating units)`,
      colour: PALETTE.score,
      statText: `r_rm = ${correlationText(pair.within, 'df').replace(/^r = /, '')}`,
    }) +
    scatterChart({
      name: 'scatter-between',
      title: `Between persons: each person's mean ${pair.score} against mean ${pair.rating}`,
      note: 'One dot per person.',
      points: means,
      xLabel: `Person mean of ${pair.score} (score units)`,
      yLabel: `Person mean of ${pair.rating} (rating units)`,
      colour: PALETTE.between,
      statText: correlationText(pair.between, 'persons'),
      radius: 4,
    }) +
    `</div>`
  );
}

/**
 * Section 3: for the shown score × rating pair, the within-person scatter (centred values) beside
 * the between-person scatter (person means), each with its r and interval; the pooled r; the
 * verdict and plain-words warnings; a table of every pair; how the self-reports were read and paired (the ratings reconciliation); and the reliability-by-word-count
 * curves.
 */
export function validationSection(validation: Part<ValidationData>, ratings?: RatingsReconciliation): string {
  const purpose = 'Does the text score track what the same people report, within a person over time and between people?';
  const matched = ratings ? `<h3>How the self-reports were read and paired</h3>${ratingsReconciliationTable(ratings)}` : '';
  if (!validation.ok) return sectionFrame('validation', 3, 'Validation against self-reports', purpose, absentNote('Validation is', validation.reason) + matched);
  const v = validation.value;
  const parts: string[] = [];
  const pair = v.pairs[v.shown];
  if (pair) {
    parts.push(`<h3>${escapeHtml(pair.score)} × ${escapeHtml(pair.rating)}</h3>`);
    parts.push(scatters(pair));
    parts.push(`<p class="pooled">Pooled over all ${pair.pairs} pairs, ignoring who wrote them: ${escapeHtml(pooledText(pair.pooled))}. The pooled r mixes the two levels above and answers neither question on its own; it is a description only, with no interval or p-value, because a person's occasions are not independent (Bland &amp; Altman 1995).</p>`);
    if (pair.verdict) parts.push(`<p class="verdict">${escapeHtml(pair.verdict)}</p>`);
    const warnings = warningsOf(pair);
    if (warnings.length) parts.push(`<div class="warning" role="note"><strong>Read with care</strong><ul>${warnings.map((w) => `<li>${escapeHtml(w)}</li>`).join('')}</ul></div>`);
  }
  if (v.pairs.length > 0) {
    parts.push(
      htmlTable(
        [{ label: 'Text score' }, { label: 'Self-report' }, { label: 'Pairs', numeric: true }, { label: 'Persons', numeric: true }, { label: 'Within persons (repeated-measures r, 95% CI)' }, { label: 'Between persons (r of means, 95% CI)' }, { label: 'Pooled r (descriptive, no interval)' }, { label: 'Warnings', numeric: true }],
        v.pairs.map((p) => [p.score, p.rating, String(p.pairs), String(p.persons), correlationText(p.within, 'df'), correlationText(p.between, 'persons'), pooledText(p.pooled), String(warningsOf(p).length)]),
        'Every text score × self-report pair',
      ),
    );
  } else parts.push(absentNote('Correlations are', 'the validation output lists no score × rating pair.'));
  if (matched) parts.push(matched);
  if (v.reliability.length) {
    parts.push('<h3>How many words make a reliable score?</h3>');
    parts.push(`<div class="multiples wide">${v.reliability.map(reliabilityChart).join('')}</div>`);
    const advice = v.reliability.filter((c) => c.recommendedMinWords !== undefined && c.target !== undefined);
    if (advice.length)
      parts.push(
        `<p>Words a bin needs to reach the target reliability: ${advice.map((c) => `<code>${escapeHtml(c.score)}</code> about ${c.recommendedMinWords} (target ${c.target})`).join('; ')}. Raise <code>--min-words</code> in the series step, or choose longer bins, to leave out thinner bins; a figure beyond the largest bins observed is a projection, not an observation.</p>`,
      );
  } else parts.push(absentNote('The reliability-by-word-count curve is', 'the validation output holds no reliability estimates.'));
  return sectionFrame('validation', 3, 'Validation against self-reports', purpose, parts.join(''));
}
