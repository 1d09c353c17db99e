/**
 * A hash table from short strings to values whose look-ups take a range of a longer text and its
 * hash, so a text can be looked up piece by piece without cutting a substring for each piece
 * (most look-ups find the piece, and then no string is made at all). Open addressing with
 * linear probing over a power-of-two slot array kept at most half full; `limit` entries at most
 * (the caller decides what to do when `full()`).
 */
export class PieceTable<T> {
  /** Entry index + 1 per slot (0: empty). */
  private readonly slots: Int32Array;
  private readonly mask: number;
  private readonly hashes: Int32Array;
  private readonly keys: string[] = [];
  private readonly values: T[] = [];

  constructor(readonly limit: number) {
    let size = 16;
    while (size < 2 * limit) size *= 2;
    this.slots = new Int32Array(size);
    this.mask = size - 1;
    this.hashes = new Int32Array(limit);
  }

  get size(): number {
    return this.keys.length;
  }

  full(): boolean {
    return this.keys.length >= this.limit;
  }

  /** The value stored for `text.slice(start, end)` (whose hashOfRange is `hash`), or undefined. */
  find(text: string, start: number, end: number, hash: number): T | undefined {
    const { slots, mask, hashes, keys } = this;
    const length = end - start;
    for (let slot = hash & mask; ; slot = (slot + 1) & mask) {
      const entry = slots[slot] as number;
      if (entry === 0) return undefined;
      const key = keys[entry - 1] as string;
      if (hashes[entry - 1] === hash && key.length === length && sameText(key, text, start)) return this.values[entry - 1];
    }
  }

  /** Stores `value` for `key` (not already in the table; `hash` = hashOfRange of the key). Throws when full. */
  add(key: string, hash: number, value: T): void {
    if (this.full()) throw new Error(`PieceTable: more than ${this.limit} entries; check full() before add()`);
    const { slots, mask } = this;
    let slot = hash & mask;
    while (slots[slot] !== 0) slot = (slot + 1) & mask;
    this.keys.push(key);
    this.values.push(value);
    this.hashes[this.keys.length - 1] = hash;
    slots[slot] = this.keys.length;
  }
}

/** Whether `text` holds `key` at `start` (the caller has checked it fits). */
function sameText(key: string, text: string, start: number): boolean {
  for (let k = 0; k < key.length; k++) if (key.charCodeAt(k) !== text.charCodeAt(start + k)) return false;
  return true;
}

/** FNV-1a offset basis and prime (32-bit), the hash PieceTable expects (see hashStep). */
export const HASH_START = 0x811c9dc5 | 0;
const FNV_PRIME = 0x01000193;

/** One step of the 32-bit FNV-1a hash over UTF-16 code units: the hash of a range after code unit `c`. */
export function hashStep(hash: number, c: number): number {
  return Math.imul(hash ^ c, FNV_PRIME);
}

/** The hash of `text.slice(start, end)`, as PieceTable expects it. */
export function hashOfRange(text: string, start = 0, end = text.length): number {
  let h = HASH_START;
  for (let k = start; k < end; k++) h = hashStep(h, text.charCodeAt(k));
  return h;
}
