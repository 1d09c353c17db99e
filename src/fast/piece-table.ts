/**
 * Code units per entry in a PieceTable's records: a key's length, then the key itself when it is
 * shorter than this (nearly every piece of running text).
 */
const RECORD = 16;

/**
 * A hash table from short strings to values whose look-ups take a range of a longer text and its
 * hash, so a text can be looked up piece by piece without cutting a substring for each piece
 * (most look-ups find the piece, and then no string is made at all). Open addressing with
 * linear probing over a power-of-two slot array kept at most half full; `limit` entries at most
 * (the caller decides what to do when `full()`).
 *
 * Laid out for few cache misses per look-up, which is what a look-up costs: a slot holds the
 * key's hash beside the entry's number, and a short key is compared with a copy of its code
 * units in `records` (a typed array, entries in the order they were added, so the common pieces,
 * met first, sit together) rather than with the key string, which lives wherever the heap put it.
 * Measured on the 3.3 million pieces of the bench corpus, looked up in a loop of their own in a
 * warm table: comparing with the key strings took 0.5 s more than trusting the hash would have,
 * comparing with the records 0.1 s more. Within a scoring run, where the tokenizer's other work
 * competes for the cache, the gain is smaller: tokenizing the corpus's first 50,000 messages
 * took 15% fewer first-level data-cache misses (valgrind's cachegrind) and as many instructions.
 */
export class PieceTable<T> {
  /** Per slot: the key's hash, then entry index + 1 (0: empty). */
  private readonly slots: Int32Array;
  private readonly mask: number;
  private readonly keys: string[] = [];
  private readonly values: T[] = [];
  /** Per entry, RECORD code units: the key's length and code units when it is shorter than RECORD, else RECORD (compared as a string). */
  private readonly records: Uint16Array;
  /** The entry the last successful find() returned. */
  private found = -1;

  constructor(readonly limit: number) {
    let size = 16;
    while (size < 2 * limit) size *= 2;
    this.slots = new Int32Array(2 * size);
    this.mask = size - 1;
    this.records = new Uint16Array(RECORD * limit);
  }

  get size(): number {
    return this.keys.length;
  }

  full(): boolean {
    return this.keys.length >= this.limit;
  }

  /** The key of the entry the last successful find() returned. */
  get foundKey(): string {
    return this.keys[this.found] as string;
  }

  /** The value stored for `text.slice(start, end)` (whose hashOfRange is `hash`), or undefined. */
  find(text: string, start: number, end: number, hash: number): T | undefined {
    const { slots, mask, records } = this;
    const length = end - start;
    for (let slot = hash & mask; ; slot = (slot + 1) & mask) {
      const entry = (slots[2 * slot + 1] as number) - 1;
      if (entry < 0) return undefined;
      if (slots[2 * slot] !== hash) continue;
      if (length < RECORD) {
        const r = RECORD * entry;
        if (records[r] !== length) continue;
        // Without an early exit: the hashes are equal, so the keys almost always are too.
        let diff = 0;
        for (let k = 0; k < length; k++) diff |= (records[r + 1 + k] as number) ^ text.charCodeAt(start + k);
        if (diff !== 0) continue;
      } else {
        const key = this.keys[entry] as string;
        if (key.length !== length || !sameText(key, text, start)) continue;
      }
      this.found = entry;
      return this.values[entry] as T;
    }
  }

  /** Stores `value` for `key` (not already in the table; `hash` = hashOfRange of the key). Throws when full. */
  add(key: string, hash: number, value: T): void {
    if (this.full()) throw new Error(`PieceTable: more than ${this.limit} entries; check full() before add()`);
    const { slots, mask, records } = this;
    let slot = hash & mask;
    while (slots[2 * slot + 1] !== 0) slot = (slot + 1) & mask;
    const entry = this.keys.length;
    this.keys.push(key);
    this.values.push(value);
    const r = RECORD * entry;
    if (key.length < RECORD) {
      records[r] = key.length;
      for (let k = 0; k < key.length; k++) records[r + 1 + k] = key.charCodeAt(k);
    } else {
      records[r] = RECORD; // never the length of a key compared by its record
    }
    slots[2 * slot] = hash;
    slots[2 * slot + 1] = entry + 1;
  }
}

/**
 * Two PieceTables as generations, for a bounded memo: new entries go to `young`; when it is full
 * it becomes `old` (the previous `old` is dropped) and an entry found in `old` moves back to
 * `young`. Entries in use stay, entries not met for a generation go, and memory stays bounded (at
 * most twice `limit` entries) without emptying the memo of common entries all at once. Keys
 * longer than `maxKeyLength` are not kept (`make` runs each time), so memory is bounded in
 * characters too, whatever the input (a 10 MB field without a space is one piece).
 */
export class GenerationalTable<T> {
  private young: PieceTable<T>;
  private old: PieceTable<T>;

  constructor(
    readonly limit: number,
    readonly maxKeyLength = 256,
  ) {
    this.young = new PieceTable(limit);
    this.old = new PieceTable(limit);
  }

  /** The value for `text.slice(start, end)` (hash: its hashOfRange), or `make(key)` stored for next time. */
  get(text: string, start: number, end: number, hash: number, make: (key: string) => T): T {
    if (end - start <= this.maxKeyLength) {
      const hit = this.young.find(text, start, end, hash);
      if (hit !== undefined) return hit;
    }
    return this.getElsewhere(text, start, end, hash, make);
  }

  /** get() for a key not in `young` (kept apart so that get's common path is small enough for V8 to inline into a caller's loop). */
  private getElsewhere(text: string, start: number, end: number, hash: number, make: (key: string) => T): T {
    if (end - start > this.maxKeyLength) return make(text.slice(start, end));
    let value = this.old.find(text, start, end, hash);
    let key: string;
    if (value === undefined) {
      key = detached(text.slice(start, end));
      value = make(key);
    } else {
      key = this.old.foundKey;
    }
    if (this.young.full()) {
      this.old = this.young;
      this.young = new PieceTable(this.limit);
    }
    this.young.add(key, hash, value);
    return value;
  }
}

/**
 * A copy of `s` that holds its own characters. V8 makes a substring of 13 or more characters a
 * view into the string it was cut from, so a memo keyed by such substrings would keep every
 * input text (or the whole chunk of a file that a reader cut the texts from) alive as long as
 * the key: measured, 300 MB more at the peak for 1.2 million messages. Concatenating and
 * cutting again makes V8 copy the characters into a new string first (as of Node 20; harmless
 * where it does not).
 */
export function detached(s: string): string {
  return s.length < 13 ? s : ` ${s}`.slice(1);
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
