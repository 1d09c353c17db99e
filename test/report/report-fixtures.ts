/**
 * Small builders of study output files for report tests (invented data, no real persons).
 * Daily bins with a 04:00 day start; persons in Europe/Brussels change clocks on 2026-03-29
 * (IANA tz database: EU summer time starts the last Sunday of March), so the study day
 * 2026-03-28 (04:00 → 04:00 next morning) lasts 23 hours.
 */
import { csvDocument } from '../../src/report/csv.js';
import { formatNumber } from '../../src/report/format-number.js';

export interface SeriesFixture {
  persons: number;
  days: number;
  /** Missing reason for person index p and day index d, or '' when observed. */
  missing?: (p: number, d: number) => string;
  /** Score of person p on day d. */
  score?: (p: number, d: number) => number;
}

const pad = (n: number): string => String(n).padStart(2, '0');

/** Local date `2026-03-DD` etc. for day index d from 2026-03-20. */
function localDate(d: number): string {
  const t = Date.UTC(2026, 2, 20 + d);
  return new Date(t).toISOString().slice(0, 10);
}

/** Brussels offset at 04:00 local on a study date (summer time from 2026-03-29). */
function offset(date: string): string {
  return date >= '2026-03-29' ? '+02:00' : '+01:00';
}

/** Person ids p01, p02, … */
export const personId = (p: number): string => `p${pad(p + 1)}`;

/** A series-long.csv text with columns per docs/architecture.md and two scores. */
export function seriesCsv(f: SeriesFixture): string {
  const header = ['person', 't', 'bin_start', 'bin_end', 'local_date', 'day', 'bin_of_day', 'bin_hours', 'hours_since_prev', 'entries', 'words', 'missing', 'lag_valid', 'vader.compound', 'vader.compound.n', 'vader.compound.person_mean', 'vader.compound.within', 'afinn-165.valence', 'afinn-165.valence.n'];
  const rows: string[][] = [];
  for (let p = 0; p < f.persons; p++) {
    let prevObserved = false;
    for (let d = 0; d < f.days; d++) {
      const date = localDate(d);
      const next = localDate(d + 1);
      const missing = f.missing?.(p, d) ?? '';
      const hours = date === '2026-03-28' ? 23 : 24;
      const score = missing ? undefined : (f.score?.(p, d) ?? Math.sin(p + d) / 2);
      const words = missing === 'no_text' ? 0 : missing === 'too_few_words' ? 4 : 40 + ((p * 7 + d * 13) % 60);
      rows.push([
        personId(p),
        String(d),
        `${date}T04:00:00${offset(date)}`,
        `${next}T04:00:00${offset(next)}`,
        date,
        String(d + 1),
        '1',
        String(hours),
        '',
        String(missing === 'no_text' ? 0 : 3),
        String(words),
        missing,
        prevObserved && !missing ? '1' : '0',
        formatNumber(score),
        missing ? '0' : '2',
        '',
        '',
        formatNumber(score === undefined ? undefined : score * 4),
        missing ? '0' : '1',
      ]);
      prevObserved = !missing;
    }
  }
  return csvDocument(header, rows);
}

/** A manifest.json object as the study runner writes it (fields the report reads). */
export function manifestFixture(): Record<string, unknown> {
  return {
    tool: { name: 'lexichron', version: '0.1.0' },
    created: '2026-05-01T00:00:00Z',
    command: 'lexichron run study.json',
    inputs: [{ path: 'messages.csv', sha256: 'ab'.repeat(32), rows: 120 }],
    lexicons: [{ name: 'vader', version: 'fixture', sha256: 'cd'.repeat(32) }],
    parameters: { study: { name: 'Fixture study' }, series: { bin: '1d' } },
    reconciliation: { read: 120, scored: 110, rejected: { bad_time: 6, empty_text: 2 }, dropped: { third_party: 2 } },
    outputs: [],
  };
}

/** validation-pairs.csv text: person, time (bin start), the score and a rating y = 50 + 20·score + person offset. */
export function alignedCsv(series: SeriesFixture): string {
  const rows: string[][] = [];
  for (let p = 0; p < series.persons; p++)
    for (let d = 0; d < series.days; d++) {
      const date = localDate(d);
      const missing = series.missing?.(p, d) ?? '';
      const score = missing ? undefined : (series.score?.(p, d) ?? Math.sin(p + d) / 2);
      rows.push([personId(p), `${date}T04:00:00${offset(date)}`, missing, formatNumber(score), formatNumber(50 + 20 * (score ?? 0) - p)]);
    }
  return csvDocument(['person', 'time', 'text_missing', 'vader.compound', 'mood'], rows);
}

/** A term audit JSON in the shape of src/terms/term-auditor.ts TermAudit (fields the report reads). */
export function termsFixture(): unknown {
  return {
    lexicon: { name: 'daily-constructs' },
    terms: [
      { term: 'tired', category: 'fatigue', hits: 30, share: 0.6, flags: ['over_share'] },
      { term: 'exhausted', category: 'fatigue', hits: 15, share: 0.3, flags: [] },
      { term: 'sleepy', category: 'fatigue', hits: 5, share: 0.1, flags: ['few_persons'] },
      { term: 'drained', category: 'fatigue', hits: 0, flags: ['no_hits'] },
      { term: 'worr*', category: 'worry', hits: 8, share: 1, flags: ['over_share'] },
    ],
  };
}
