import { randomInteger, type RandomSource } from '../stats/random.js';

/** A fixed-size uniform sample of a stream, kept by {@link reservoirAdd}. */
export interface Reservoir<T> {
  size: number;
  seen: number;
  items: T[];
}

/** An empty reservoir holding at most `size` items. */
export function reservoir<T>(size: number): Reservoir<T> {
  return { size, seen: 0, items: [] };
}

/**
 * Offers one item to a reservoir (Algorithm R; Vitter 1985, "Random sampling with a reservoir",
 * ACM TOMS 11(1)): the first `size` items are kept, later item i (1-based) replaces a random kept
 * item with probability size/i, so every item of the stream is kept with equal probability.
 * `make` is called only when the item is kept (so callers build snippets lazily).
 */
export function reservoirAdd<T>(r: Reservoir<T>, make: () => T, random: RandomSource): void {
  r.seen++;
  if (r.size <= 0) return;
  if (r.items.length < r.size) {
    r.items.push(make());
    return;
  }
  const j = randomInteger(random, r.seen);
  if (j < r.size) r.items[j] = make();
}
