import type { RawEntry } from '../../types.js';

/** A burst merger: `push` returns the finished burst (if the new entry starts a new one); `flush` returns the last. */
export interface BurstMerger {
  push(entry: RawEntry): { done?: RawEntry; merged: boolean };
  flush(): RawEntry | undefined;
}

/**
 * Merges bursts of messages: an entry of the same person that follows the previous one by at most
 * `minutes` (and not before it) joins that entry's burst, so a run of quick chat messages becomes
 * one entry. The merged entry keeps the first message's id, time and source; texts are joined with
 * line breaks. Entries must come in time order per person for bursts to form (chat exports do).
 */
export function createBurstMerger(minutes: number): BurstMerger {
  const gapMs = minutes * 60_000;
  let current: RawEntry | undefined;
  let last = 0;
  return {
    push(entry) {
      if (current && current.person === entry.person && entry.instant >= last && entry.instant - last <= gapMs) {
        current = { ...current, text: `${current.text}\n${entry.text}` };
        last = entry.instant;
        return { merged: true };
      }
      const done = current;
      current = entry;
      last = entry.instant;
      return done ? { done, merged: false } : { merged: false };
    },
    flush() {
      const done = current;
      current = undefined;
      return done;
    },
  };
}
