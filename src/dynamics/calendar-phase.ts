import type { PersonSeriesInput } from './types.js';

/** Which calendar cycle seasonal surrogates keep. */
export type Season = 'auto' | 'day' | 'week' | 'none';

/** Day of the week (0 = Sunday … 6 = Saturday) of a local date written `YYYY-MM-DD…`, or undefined. */
function weekday(binStart: string | undefined): number | undefined {
  const m = /^(\d{4})-(\d{2})-(\d{2})/.exec(binStart ?? '');
  if (!m) return undefined;
  const day = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]))).getUTCDay();
  return Number.isNaN(day) ? undefined : day;
}

/**
 * The calendar phase of each of a person's bins, for seasonal surrogates: the bin of the local
 * day (`bin_of_day`) for a daily cycle, the local weekday of `bin_start` for a weekly one (times
 * the bin of the day when bins are shorter than a day). Read from the calendar, so the same
 * phase means the same hour or weekday for every person, whatever day their series starts.
 * `auto` is the daily cycle for bins shorter than a day and the weekly cycle for daily bins.
 * Returns undefined when the cycle does not apply (`none`, a daily cycle of daily bins) or the
 * file lacks what it needs (`bin_of_day`, `bin_start`); bins whose start is unknown get −1.
 */
export function calendarPhase(person: PersonSeriesInput, season: Season = 'auto'): number[] | undefined {
  if (season === 'none') return undefined;
  const subDaily = person.binOfDay !== undefined && person.binOfDay.some((b) => b > 1);
  const cycle = season === 'auto' ? (subDaily ? 'day' : 'week') : season;
  if (cycle === 'day') return subDaily ? [...(person.binOfDay as readonly number[])] : undefined;
  if (!person.binStart || !person.binStart.some((s) => weekday(s) !== undefined)) return undefined;
  const starts = person.binStart;
  return person.t.map((_, i) => {
    const day = weekday(starts[i]);
    if (day === undefined) return -1;
    return subDaily ? day * 1000 + ((person.binOfDay as readonly number[])[i] as number) : day;
  });
}
