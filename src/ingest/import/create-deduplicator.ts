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

/** Shingle sets packed in one array: set i is `values[ends[i − 1] … ends[i])`. */
interface PackedSets {
  values: Uint32Array;
  used: number;
  ends: number[];
}

/** Appends a set; returns its number. */
function addPackedSet(store: PackedSets, set: Uint32Array): number {
  if (store.used + set.length > store.values.length) {
    const grown = new Uint32Array(Math.max(store.values.length * 2, store.used + set.length));
    grown.set(store.values.subarray(0, store.used));
    store.values = grown;
  }
  store.values.set(set, store.used);
  store.used += set.length;
  store.ends.push(store.used);
  return store.ends.length - 1;
}

/** Set number `i` (a view, not a copy). */
function packedSet(store: PackedSets, i: number): Uint32Array {
  return store.values.subarray(i === 0 ? 0 : (store.ends[i - 1] as number), store.ends[i] as number);
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
 * Memory grows with the number of distinct entries kept (a digest, packed shingle hashes and eight
 * numeric band keys each: about 0.5 KB, never their text).
 */
export function createDeduplicator(options: DedupeOptions = {}): (person: string, text: string) => DuplicateVerdict {
  const threshold = options.threshold ?? 0.8;
  const k = options.shingleWords ?? 3;
  const minWords = options.minWords ?? 5;
  const exact = new Map<string, Set<string>>();
  // Per person: every kept entry's sorted shingle hashes, packed one after another in one growing
  // array (`ends[i]` is where entry i's end), and the band buckets under a 32-bit hash of band
  // number and band values (a bucket holds one entry number, or an array when several share it).
  // A hash collision only adds a candidate, which the exact Jaccard similarity then rejects, so
  // verdicts are those of full keys; the state is a few hundred bytes per kept entry, no text.
  const stored = new Map<string, PackedSets>();
  const buckets = new Map<string, Map<number, number | number[]>>();
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
    if (!personStore) stored.set(person, (personStore = { values: new Uint32Array(256), used: 0, ends: [] }));
    let personBuckets = buckets.get(person);
    if (!personBuckets) buckets.set(person, (personBuckets = new Map()));
    const keys: number[] = [];
    const candidates = new Set<number>();
    for (let b = 0; b < BANDS; b++) {
      let key = mix(b, 0x5bd1e995);
      for (let r = 0; r < ROWS; r++) key = mix((key ^ (signature[b * ROWS + r] as number)) >>> 0, r + 1);
      keys.push(key);
      const bucket = personBuckets.get(key);
      if (typeof bucket === 'number') candidates.add(bucket);
      else if (bucket) for (const c of bucket) candidates.add(c);
    }
    for (const c of candidates) if (jaccard(set, packedSet(personStore, c)) >= threshold) return 'duplicate_near';
    const index = addPackedSet(personStore, set);
    for (const key of keys) {
      const bucket = personBuckets.get(key);
      if (bucket === undefined) personBuckets.set(key, index);
      else if (typeof bucket === 'number') {
        if (bucket !== index) personBuckets.set(key, [bucket, index]);
      } else if (bucket[bucket.length - 1] !== index) bucket.push(index);
    }
    return 'unique';
  };
}
