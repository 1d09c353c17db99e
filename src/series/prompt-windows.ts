import { localDayOf } from './local-day.js';

/** A self-report prompt as the study window needs it. */
export interface Prompt {
  person: string;
  /** Epoch milliseconds, UTC. */
  instant: number;
  zone: string;
}

/**
 * Each person's study window from their self-report prompts: the local day (in the prompt's zone,
 * days starting `dayStart` minutes after midnight) of their first prompt to that of their last,
 * inclusive, as day numbers. Persons without prompts are absent.
 */
export function promptWindows(prompts: Iterable<Prompt>, dayStart: number): Map<string, { from: number; to: number }> {
  const windows = new Map<string, { from: number; to: number }>();
  for (const p of prompts) {
    const { day } = localDayOf(p.instant, p.zone, dayStart);
    const w = windows.get(p.person);
    if (!w) windows.set(p.person, { from: day, to: day });
    else {
      if (day < w.from) w.from = day;
      if (day > w.to) w.to = day;
    }
  }
  return windows;
}
