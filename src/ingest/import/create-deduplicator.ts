import { createHash } from 'node:crypto';

/** Options of duplicate detection. */
export interface DedupeOptions {
  /** Jaccard similarity of word shingles at or above which an entry is a near duplicate (default 0.8). */
  threshold?: number;
  /** Words per shingle (default 3). */
  shingleWords?: number;
  /** Entries with fewer words are never called duplicates (default 5): short phrases ("ok", "good night") recur genuinely. */
  minWords?: number;
}

/** The verdict on one entry. */
export type DuplicateVerdict = 'unique' | 'duplicate_exact' | 'duplicate_near';

const SIGNATURE = 32;
const BANDS = 8;
const ROWS = SIGNATURE / BANDS;

/** Text as compared: Unicode NFKC, lower case, every run of non-letters/digits one space. */
export function normalizeForDuplicates(text: string): string {
  return text.normalize('NFKC').toLowerCase().replace(/[^\p{L}\p{N}]+/gu, ' ').trim();
}

/** 32-bit FNV-1a of a string. */
function fnv1a(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return h >>> 0;
}

/** The 32-bit finalizer of MurmurHash3, used to derive SIGNATURE hash functions from one. */
function mix(x: number, seed: number): number {
  let h = (x ^ Math.imul(seed, 0x9e3779b1)) >>> 0;
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return h >>> 0;
}

function shingles(words: readonly string[], k: number): Uint32Array {
  const set = new Set<number>();
  if (words.length <= k) set.add(fnv1a(words.join(' ')));
  else for (let i = 0; i + k <= words.length; i++) set.add(fnv1a(words.slice(i, i + k).join(' ')));
  return Uint32Array.from([...set].sort((a, b) => a - b));
}

function jaccard(a: Uint32Array, b: Uint32Array): number {
  let i = 0;
  let j = 0;
  let both = 0;
  while (i < a.length && j < b.length) {
    if (a[i] === b[j]) {
      both++;
      i++;
      j++;
    } else if ((a[i] as number) < (b[j] as number)) i++;
    else j++;
  }
  return both / (a.length + b.length - both);
}

/**
 * Creates a duplicate detector for the entries of one import, seen in order; the first of a set
 * of duplicates is kept. Within each person:
 * - exact duplicates: the same normalizeForDuplicates text (compared by SHA-256);
 * - near duplicates: Jaccard similarity of the sets of `shingleWords`-word shingles at or above
 *   `threshold` (Broder 1997, "On the resemblance and containment of documents"). Candidates are
 *   found with MinHash signatures of 32 values in 8 bands of 4 (locality-sensitive hashing; a pair
 *   at similarity 0.8 becomes a candidate with probability 1 − (1 − 0.8⁴)⁸ ≈ 0.98), then the exact
 *   Jaccard similarity decides. The 0.8 default is common practice, not a published constant.
 * Memory grows with the number of distinct entries kept (their shingle sets), not with their text.
 */
export function createDeduplicator(options: DedupeOptions = {}): (person: string, text: string) => DuplicateVerdict {
  const threshold = options.threshold ?? 0.8;
  const k = options.shingleWords ?? 3;
  const minWords = options.minWords ?? 5;
  const exact = new Map<string, Set<string>>();
  const stored = new Map<string, Uint32Array[]>();
  const buckets = new Map<string, Map<string, number[]>>();
  return (person, text) => {
    const normal = normalizeForDuplicates(text);
    const words = normal === '' ? [] : normal.split(' ');
    if (words.length < minWords) return 'unique';
    const digest = createHash('sha256').update(normal).digest('base64');
    let seen = exact.get(person);
    if (!seen) exact.set(person, (seen = new Set()));
    if (seen.has(digest)) return 'duplicate_exact';
    seen.add(digest);
    const set = shingles(words, k);
    const signature = new Uint32Array(SIGNATURE).fill(0xffffffff);
    for (const s of set) for (let h = 0; h < SIGNATURE; h++) signature[h] = Math.min(signature[h] as number, mix(s, h + 1));
    let personStore = stored.get(person);
    if (!personStore) stored.set(person, (personStore = []));
    let personBuckets = buckets.get(person);
    if (!personBuckets) buckets.set(person, (personBuckets = new Map()));
    const keys: string[] = [];
    const candidates = new Set<number>();
    for (let b = 0; b < BANDS; b++) {
      const key = `${b}:${Array.from(signature.subarray(b * ROWS, (b + 1) * ROWS)).join(',')}`;
      keys.push(key);
      for (const c of personBuckets.get(key) ?? []) candidates.add(c);
    }
    for (const c of candidates) if (jaccard(set, personStore[c] as Uint32Array) >= threshold) return 'duplicate_near';
    const index = personStore.length;
    personStore.push(set);
    for (const key of keys) {
      const list = personBuckets.get(key);
      if (list) list.push(index);
      else personBuckets.set(key, [index]);
    }
    return 'unique';
  };
}
