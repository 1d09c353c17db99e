import { formatLocal } from '../ingest/parse-instant.js';
import { zoneOffset } from '../ingest/zone-offset.js';
import type { SeriesRow } from '../series/series-types.js';
import { csvRow } from './csv.js';
import { formatNumber } from './format-number.js';

/** Fixed leading columns of the long series file (docs/architecture.md). */
export const SERIES_ID_COLUMNS = ['person', 't', 'bin_start', 'bin_end', 'local_date', 'day', 'bin_of_day', 'bin_hours', 'hours_since_prev', 'entries', 'words', 'missing', 'lag_valid'] as const;

export interface SeriesLayout {
  scores: readonly string[];
  /** Per score: whether the scores file had a matched-terms (`.n`) column (VADER columns have none). */
  matched: readonly boolean[];
  fill: boolean;
  detrend: boolean;
}

/** Header of the long series file. */
export function seriesHeader(layout: SeriesLayout): string[] {
  const header: string[] = [...SERIES_ID_COLUMNS];
  layout.scores.forEach((s, c) => {
    header.push(s);
    if (layout.matched[c]) header.push(`${s}.n`);
    header.push(`${s}.person_mean`, `${s}.within`, `${s}.lag1`, `${s}.within_lag1`);
    if (layout.fill) header.push(`${s}.filled`);
    if (layout.detrend) header.push(`${s}.detrended`);
  });
  return header;
}

/** One line of the long series file. */
export function seriesRow(row: SeriesRow, layout: SeriesLayout): string {
  const fields: string[] = [
    row.person,
    String(row.t),
    formatLocal(row.start, zoneOffset(row.zone, row.start)).replace('.000', ''),
    formatLocal(row.end, zoneOffset(row.zone, row.end)).replace('.000', ''),
    row.localDate,
    String(row.day),
    String(row.binOfDay),
    formatNumber(row.hours),
    formatNumber(row.hoursSincePrev),
    String(row.entries),
    String(row.words),
    row.missing,
    row.lagValid ? '1' : '0',
  ];
  layout.scores.forEach((_, c) => {
    fields.push(formatNumber(row.values[c]));
    if (layout.matched[c]) fields.push(formatNumber(row.matched[c]));
    fields.push(
      formatNumber(row.personMean[c]),
      formatNumber(row.within[c]),
      formatNumber(row.lag1[c]),
      formatNumber(row.withinLag1[c]),
    );
    if (layout.fill) fields.push(row.filled[c] ?? '');
    if (layout.detrend) fields.push(formatNumber(row.detrended[c]));
  });
  return csvRow(fields);
}
