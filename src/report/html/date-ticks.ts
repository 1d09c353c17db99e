import type { Tick } from './axis-bottom.js';
import { formatDate } from './format-date.js';

const DAY = 86_400_000;

/**
 * Ticks at local midnights between two wall-clock epochs, every 1, 2, 7, 14 or 28 days so that
 * at most `maxTicks` appear; labelled `29 Mar`.
 */
export function dateTicks(min: number, max: number, maxTicks = 8): Tick[] {
  const days = Math.max(1, (max - min) / DAY);
  const step = [1, 2, 7, 14, 28, 56].find((s) => days / s <= maxTicks) ?? Math.ceil(days / maxTicks);
  const first = Math.ceil(min / DAY) * DAY;
  const ticks: Tick[] = [];
  for (let v = first; v <= max; v += step * DAY) ticks.push({ value: v, label: formatDate(v) });
  return ticks;
}
