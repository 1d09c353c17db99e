import { INPUT_KEYS, SERIES_KEYS, TIME_KEYS, TOP_KEYS } from './study-keys.js';

/** Keys written as on the command line (flattened) that a study file nests under `time`. */
const TIME_ALIASES: Record<string, string> = { timeFormat: 'format', dateFormat: 'format', epochUnit: 'epoch', timeWindow: 'window' };

/**
 * Where a key that an object of the study file does not use belongs, in words (for the message of
 * `$.ratings.timeFormat` and the like), or undefined when it belongs nowhere. `owner` is the JSON
 * path of the object whose `time` the key may belong in (`$.ratings`).
 */
export function keyHome(key: string, owner: string): string | undefined {
  const time = TIME_ALIASES[key] ?? (TIME_KEYS.includes(key) ? key : undefined);
  if (time) return `it belongs in "time": {"${time}": …} (${owner}.time.${time})`;
  if (key === 'zones' || key === 'timeZone') return `time zones are the study's, shared by text and ratings: give them at the top ($.${key})`;
  const kinds = Object.entries(INPUT_KEYS).filter(([kind, keys]) => kind !== 'table' && keys.includes(key)).map(([kind]) => kind);
  if (kinds.length > 0) return `it belongs to ${kinds.join(', ')} inputs ($.inputs[N].${key})`;
  if (SERIES_KEYS.includes(key)) return `it belongs to the series settings ($.series.${key})`;
  if (TOP_KEYS.includes(key)) return `it belongs at the top of the study file ($.${key})`;
  return undefined;
}
