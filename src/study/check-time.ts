import { EPOCH_UNITS } from '../ingest/parse-instant.js';
import type { StudyProblem } from './parse-study.js';
import { TIME_KEYS } from './study-keys.js';
import { unknownKeys } from './unknown-keys.js';

/** Checks a `time` object (the study's, one input's or the ratings'); problems carry `path`. */
export function checkTime(time: Record<string, unknown>, path: string, problems: StudyProblem[]): void {
  const need = (ok: boolean, p: string, message: string): void => {
    if (!ok) problems.push({ path: p, message });
  };
  unknownKeys(time, TIME_KEYS, path, problems);
  const policies = ['reject', 'earlier', 'later'];
  need(time.format === undefined || (typeof time.format === 'string' && time.format.trim() !== ''), `${path}.format`, 'expected a luxon format such as "MM/dd/yyyy h:mm a"');
  need(time.epoch === undefined || (EPOCH_UNITS as readonly unknown[]).includes(time.epoch), `${path}.epoch`, `expected ${EPOCH_UNITS.join(', ')}`);
  need(time.window === undefined || typeof time.window === 'string', `${path}.window`, 'expected a string FROM/TO such as "1990-01-01/2030-12-31" (a side left empty keeps its default)');
  need(time.dstGap === undefined || policies.includes(time.dstGap as string), `${path}.dstGap`, 'expected reject, earlier or later');
  need(time.dstOverlap === undefined || policies.includes(time.dstOverlap as string), `${path}.dstOverlap`, 'expected reject, earlier or later');
}
