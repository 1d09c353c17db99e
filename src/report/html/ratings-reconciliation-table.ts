import type { RatingsReconciliation } from '../report-data.js';
import { escapeHtml } from './escape-html.js';
import { groupThousands } from './format-value.js';

/** Plain words for the reason codes the validate stage gives most often; any other code is shown with spaces for `_`. */
const REASONS: Readonly<Record<string, string>> = {
  bad_time: 'time not readable',
  missing_time: 'no time given',
  missing_person: 'no person id',
  no_zone: 'no time zone known for the person',
  unknown_zone: 'time zone name not known',
  time_in_gap: 'local time skipped by a clock change',
  time_ambiguous: 'local time repeated by a clock change',
  time_outside_window: 'outside the study window',
  field_count: 'wrong number of fields',
  unclosed_quote: 'quote never closed',
  field_too_long: 'field too long',
  bad_json: 'line is not valid JSON',
  rating_not_numeric: 'not a number',
  rating_out_of_scale: 'outside the declared scale',
  rating_person_not_in_series: 'person has no text series',
  rating_outside_series: 'outside every bin of the person\'s series',
  bad_series_row: 'unreadable row of the series file',
  bad_entry_row: 'unreadable row of the entry file',
};

/** Words for the further counts the validate stage records under a name of its own. */
const COUNT_NAMES: Readonly<Record<string, string>> = {
  missing: 'Ratings missing (an empty cell or a missing-value code), by column',
  notes: 'Rows read with a note',
  time_iso_fallback: 'time read as RFC 3339 instead of the given format',
};

/** A code in words. */
const reason = (code: string): string => REASONS[code] ?? COUNT_NAMES[code] ?? code.replace(/_/g, ' ');

/** `missingCodes` or `missing_codes` → `Missing codes`. */
function words(name: string): string {
  const spaced = name.replace(/([a-z0-9])([A-Z])/g, '$1 $2').replace(/[_-]+/g, ' ').toLowerCase().trim();
  return spaced.charAt(0).toUpperCase() + spaced.slice(1);
}

const total = (r: Record<string, number>): number => Object.values(r).reduce((a, b) => a + b, 0);
const byCount = (a: [string, number], b: [string, number]): number => b[1] - a[1] || (a[0] < b[0] ? -1 : 1);

function row(label: string, n: number | undefined, cls = ''): string {
  return `<tr${cls ? ` class="${cls}"` : ''}><th scope="row">${escapeHtml(label)}</th><td class="num">${n === undefined ? '–' : groupThousands(n)}</td></tr>`;
}

/** A line with its total, then one indented line per reason (largest first); nothing when empty. */
function withReasons(label: string, counts: Record<string, number>, label_: (code: string) => string = reason): string[] {
  const entries = Object.entries(counts).filter(([, n]) => n > 0);
  if (entries.length === 0) return [];
  return [row(label, total(counts)), ...entries.sort(byCount).map(([code, n]) => row(label_(code), n, 'sub'))];
}

/**
 * How the self-reports were read and matched to the text, as a table of counts with labels in
 * words: rows read, rows kept, rows left out by reason, single ratings left out by reason, any
 * further count the stage recorded; then self-reports that found no text, the aligned occasions
 * (with text) and persons, and other problems of the stage. When rows read − rows kept differs
 * from the rows left out, a highlighted line says so.
 */
export function ratingsReconciliationTable(r: RatingsReconciliation): string {
  const group = (label: string): string => `<tr class="group"><th scope="rowgroup" colspan="2">${escapeHtml(label)}</th></tr>`;
  const rows: string[] = [group('Reading the self-report file')];
  if (r.read !== undefined) rows.push(row('Rows read', r.read, 'total'));
  if (r.kept !== undefined) rows.push(row('Rows kept (usable person and time)', r.kept));
  const leftOut = total(r.rowsLeftOut);
  if (leftOut > 0 || r.read !== undefined) rows.push(...(leftOut > 0 ? withReasons('Rows left out', r.rowsLeftOut) : [row('Rows left out', 0)]));
  rows.push(...withReasons('Single ratings left out (the rest of the row kept)', r.valuesLeftOut));
  for (const m of r.more) {
    const label = COUNT_NAMES[m.name] ?? words(m.name);
    if (typeof m.value === 'number') rows.push(row(label, m.value));
    else rows.push(...withReasons(label, m.value, (code) => COUNT_NAMES[code] ?? code));
  }
  if (r.read !== undefined && r.kept !== undefined && r.read - r.kept !== leftOut) {
    rows.push(`<tr class="mismatch"><td colspan="2">The counts do not add up: rows read − rows kept = ${groupThousands(r.read - r.kept)}, but the rows left out by reason number ${groupThousands(leftOut)}. Please report this as a bug.</td></tr>`);
  }
  rows.push(group('Pairing with the text'));
  if (r.unanswered !== undefined && r.unanswered > 0) rows.push(row('Prompts with no rating at all (kept for the study window, not paired)', r.unanswered));
  rows.push(...withReasons('Self-reports with no text to pair with', r.notPaired));
  if (r.occasions !== undefined) rows.push(row('Aligned occasions (bins, or windows before a self-report)', r.occasions));
  if (r.occasionsWithText !== undefined) rows.push(row('of which with text', r.occasionsWithText, 'sub'));
  if (r.persons !== undefined) rows.push(row('Persons', r.persons));
  rows.push(...withReasons('Other problems of the validate stage', r.other));
  return `<table class="reconciliation ratings-reconciliation"><caption>Self-reports: every row read is kept or left out with a reason, and every kept self-report is paired with text or said why not</caption><thead><tr><th>Self-reports</th><th class="num">Count</th></tr></thead><tbody>${rows.join('')}</tbody></table><p class="note">Each row or rating left out is listed with its file, line and reason in <code>validation-diagnostics.csv</code>.</p>`;
}
