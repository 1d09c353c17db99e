import { dayStartInstant } from './local-day.js';
import type { SeriesState } from './series-types.js';

/**
 * The instant local day `day` starts in `zone` under the state's day start (`dayStartInstant`),
 * remembered per zone and day in the state (each zone's memo is emptied past 100,000 days).
 */
export function dayStartAt(state: SeriesState, day: number, zone: string): number {
  let days = state.dayStarts.get(zone);
  if (!days) state.dayStarts.set(zone, (days = new Map()));
  let at = days.get(day);
  if (at === undefined) {
    at = dayStartInstant(day, zone, state.options.dayStart);
    if (days.size > 100_000) days.clear();
    days.set(day, at);
  }
  return at;
}
