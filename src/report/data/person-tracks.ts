import { wallClock } from './wall-clock.js';
import type { PersonTrack, TrackPoint } from '../report-data.js';
import { dayHours } from './day-hours.js';
import { groupRowsByPerson } from './group-rows-by-person.js';
import type { SeriesRow } from './series-row.js';

/** Ratings aligned to bins: person → bin index `t` → value. */
export type BinRatings = ReadonlyMap<string, ReadonlyMap<number, number>>;

/**
 * Each person's drawn series: per bin its wall-clock start, real hours, the chosen score, the
 * aligned rating (when given) and the missing reason; plus the local dates whose length a clock
 * change made differ from 24 h. Bins without a readable start time are left out of the drawing.
 */
export function personTracks(rows: readonly SeriesRow[], score: string, nominalBinHours: number, ratings?: BinRatings): PersonTrack[] {
  const tracks: PersonTrack[] = [];
  for (const [person, list] of groupRowsByPerson(rows)) {
    const own = ratings?.get(person);
    const points: TrackPoint[] = [];
    const days = new Map<string, SeriesRow[]>();
    for (const r of list) {
      const start = wallClock(r.binStart);
      if (start === undefined) continue;
      points.push({ t: r.t, start, hours: r.binHours, date: r.localDate, score: r.missing ? undefined : r.values[score], rating: own?.get(r.t), missing: r.missing });
      const day = days.get(r.localDate);
      if (day) day.push(r);
      else days.set(r.localDate, [r]);
    }
    const clockChanges: PersonTrack['clockChanges'] = [];
    for (const [date, bins] of days) {
      const hours = dayHours(bins, nominalBinHours);
      const start = wallClock(bins[0]?.binStart ?? '');
      if (hours !== undefined && start !== undefined) clockChanges.push({ date, hours, start });
    }
    tracks.push({ person, points, clockChanges });
  }
  return tracks;
}
