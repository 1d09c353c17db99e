import type { CoverageCell, CoverageData } from '../report-data.js';
import { dayHours } from './day-hours.js';
import { groupRowsByPerson } from './group-rows-by-person.js';
import { modalValue } from './modal-value.js';
import type { SeriesRow } from './series-row.js';

const DAY = 86_400_000;

function dateRange(first: string, last: string): string[] {
  const out: string[] = [];
  const end = Date.parse(`${last}T00:00:00Z`);
  for (let d = Date.parse(`${first}T00:00:00Z`); d <= end; d += DAY) out.push(new Date(d).toISOString().slice(0, 10));
  return out;
}

/**
 * Person × local-date coverage from series rows: per day the words, bins, observed bins, the
 * dominant missing reason when no bin was observed, and the day's real hours when a clock change
 * made it longer or shorter than 24 (see {@link dayHours}).
 */
export function coverageFromRows(rows: readonly SeriesRow[]): CoverageData {
  const byPerson = groupRowsByPerson(rows);
  const binHours = modalValue(rows.map((r) => r.binHours)) ?? 24;
  const missingBins: Record<string, number> = {};
  let first: string | undefined;
  let last: string | undefined;
  const persons = [...byPerson].map(([person, list]) => {
    const days = new Map<string, SeriesRow[]>();
    for (const r of list) {
      if (r.missing) missingBins[r.missing] = (missingBins[r.missing] ?? 0) + 1;
      if (!r.localDate) continue;
      if (first === undefined || r.localDate < first) first = r.localDate;
      if (last === undefined || r.localDate > last) last = r.localDate;
      const day = days.get(r.localDate);
      if (day) day.push(r);
      else days.set(r.localDate, [r]);
    }
    const cells: CoverageCell[] = [...days].map(([date, bins]) => {
      const observed = bins.filter((b) => !b.missing);
      const cell: CoverageCell = { date, words: bins.reduce((s, b) => s + b.words, 0), bins: bins.length, observedBins: observed.length };
      if (observed.length === 0) cell.missing = modalValue(bins.map((b) => b.missing)) ?? 'no_text';
      const hours = dayHours(bins, binHours);
      if (hours !== undefined) cell.hours = hours;
      return cell;
    });
    return { person, cells };
  });
  return { dates: first && last ? dateRange(first, last) : [], persons, binHours, missingBins, totalBins: rows.length };
}
