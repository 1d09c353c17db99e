import { usageError } from '../errors.js';

/**
 * Parses a prompt-window length such as `90m`, `3h` or `1d` into minutes; throws a usage error
 * naming `option` (the flag or study key) when it is not a positive duration.
 */
export function windowMinutes(text: string, option = '--window'): number {
  const m = /^\s*(\d+)\s*(m|min|h|d)\s*$/i.exec(text);
  if (!m || Number(m[1]) <= 0) throw usageError(`${option} \`${text}\` is not a positive duration; write e.g. 90m, 3h or 1d.`);
  const unit = (m[2] as string).toLowerCase();
  return Number(m[1]) * (unit === 'h' ? 60 : unit === 'd' ? 1440 : 1);
}
