import { describe, expect, it } from 'vitest';
import { detached, GenerationalTable, HASH_START, hashOfRange, hashStep, PieceTable } from '../../src/fast/piece-table.js';

describe('hashOfRange', () => {
  it('is 32-bit FNV-1a (reference: FNV test vectors of draft-eastlake-fnv, IETF; values recalled from memory and recomputed with a separate Python loop)', () => {
    // FNV-1a 32: "" → 0x811c9dc5, "a" → 0xe40c292c, "foobar" → 0xbf9cf968 (ASCII: one code unit per byte).
    expect(hashOfRange('') >>> 0).toBe(0x811c9dc5);
    expect(hashOfRange('a') >>> 0).toBe(0xe40c292c);
    expect(hashOfRange('foobar') >>> 0).toBe(0xbf9cf968);
  });

  it('hashes a range of a longer text as the text of that range alone', () => {
    const text = 'say foobar twice: foobar';
    expect(hashOfRange(text, 4, 10)).toBe(hashOfRange('foobar'));
    expect(hashOfRange(text, 18)).toBe(hashOfRange('foobar'));
    let h = HASH_START;
    for (const c of 'foo') h = hashStep(h, c.charCodeAt(0));
    expect(h).toBe(hashOfRange('foobar', 0, 3));
  });
});

describe('PieceTable', () => {
  it('finds a key by a range of another text, and nothing for a range that differs', () => {
    const table = new PieceTable<number>(8);
    table.add('calm', hashOfRange('calm'), 1);
    table.add('calmer', hashOfRange('calmer'), 2);
    const text = 'calmer, calm, clam';
    expect(table.find(text, 0, 6, hashOfRange(text, 0, 6))).toBe(2);
    expect(table.find(text, 8, 12, hashOfRange(text, 8, 12))).toBe(1);
    expect(table.find(text, 0, 4, hashOfRange(text, 0, 4))).toBe(1);
    expect(table.find(text, 14, 18, hashOfRange(text, 14, 18))).toBeUndefined();
    expect(table.find(text, 0, 5, hashOfRange(text, 0, 5))).toBeUndefined();
  });

  it('keeps keys apart when their hashes collide (all hashes forced equal)', () => {
    const table = new PieceTable<string>(100);
    const words = Array.from({ length: 100 }, (_, k) => `w${k}`);
    for (const w of words) table.add(w, 7, w.toUpperCase());
    for (const w of words) expect(table.find(`..${w}..`, 2, 2 + w.length, 7)).toBe(w.toUpperCase());
    expect(table.find('w100', 0, 4, 7)).toBeUndefined();
    expect(table.size).toBe(100);
  });

  it('compares short keys by their copied code units and long keys as strings, and never confuses the two (all hashes forced equal)', () => {
    // Keys of 1 to 40 code units, across the length (16) from which a key is compared as a
    // string; some with two-byte code units: é in every position, an emoji's surrogate pair at
    // the end (a lone low surrogate for length 1).
    const table = new PieceTable<number>(200);
    const keys: string[] = [];
    for (let n = 1; n <= 40; n++) {
      keys.push('q'.repeat(n), 'é'.repeat(n), `${'z'.repeat(n)}😀`.slice(-n), `${'y'.repeat(n - 1)}.`);
    }
    keys.forEach((key, k) => table.add(key, 7, k));
    expect(table.size).toBe(keys.length);
    keys.forEach((key, k) => {
      const text = `« ${key} »`;
      expect(table.find(text, 2, 2 + key.length, 7)).toBe(k);
      expect(table.foundKey).toBe(key);
    });
    // Ranges of the same hash that hold no key: one code unit off at the start, the middle or
    // the end, a key without its last code unit, and a key with one more.
    for (const key of keys) {
      const n = key.length;
      for (const at of [0, n >> 1, n - 1]) {
        // Another character, and one that differs only in the high byte of its code unit.
        for (const c of ['x', String.fromCharCode(key.charCodeAt(at) ^ 0x100)]) {
          const changed = `${key.slice(0, at)}${c}${key.slice(at + 1)}`;
          if (!keys.includes(changed)) expect(table.find(changed, 0, n, 7)).toBeUndefined();
        }
      }
      if (n > 1 && !keys.includes(key.slice(0, n - 1))) expect(table.find(key, 0, n - 1, 7)).toBeUndefined();
      if (!keys.includes(`${key}q`)) expect(table.find(`${key}q`, 0, n + 1, 7)).toBeUndefined();
    }
    expect(table.find('', 0, 0, 7)).toBeUndefined();
  });

  it('holds at most `limit` entries and says so before refusing one', () => {
    const table = new PieceTable<number>(3);
    for (const [k, w] of ['a', 'b', 'c'].entries()) {
      expect(table.full()).toBe(false);
      table.add(w, hashOfRange(w), k);
    }
    expect(table.full()).toBe(true);
    expect(() => table.add('d', hashOfRange('d'), 3)).toThrow(/check full\(\) before add\(\)/);
  });
});

describe('GenerationalTable', () => {
  it('keeps entries met in the last generation, drops the rest, and makes each entry once while it is kept', () => {
    const made: string[] = [];
    const table = new GenerationalTable<string>(2);
    const get = (word: string): string => {
      const text = `<${word}>`;
      return table.get(text, 1, 1 + word.length, hashOfRange(word), (key) => {
        made.push(key);
        return key.toUpperCase();
      });
    };
    expect(['a', 'b', 'a', 'b'].map(get)).toEqual(['A', 'B', 'A', 'B']);
    expect(made).toEqual(['a', 'b']);
    get('c'); // young {a, b} full: it becomes old, c starts a new young
    get('a'); // found in old, moved back to young {c, a}
    expect(made).toEqual(['a', 'b', 'c']);
    get('d'); // young {c, a} full: old {a, b} is dropped
    get('b'); // b was only in the dropped generation: made again
    get('a'); // a moved into the kept generation: still there
    expect(made).toEqual(['a', 'b', 'c', 'd', 'b']);
  });
});

describe('GenerationalTable with long keys', () => {
  it('does not keep keys longer than maxKeyLength: they are made each time', () => {
    let made = 0;
    const table = new GenerationalTable<number>(10, 4);
    const make = (key: string): number => {
      made++;
      return key.length;
    };
    const text = 'abcd abcde';
    for (let k = 0; k < 3; k++) {
      expect(table.get(text, 0, 4, hashOfRange(text, 0, 4), make)).toBe(4);
      expect(table.get(text, 5, 10, hashOfRange(text, 5, 10), make)).toBe(5);
    }
    expect(made).toBe(1 + 3); // `abcd` once, `abcde` (5 > 4 characters) every time
  });
});

describe('detached', () => {
  it('gives a string equal to its argument, short or long', () => {
    const text = 'a long diary entry about a long day at the allotment';
    for (const [a, b] of [[0, 1], [2, 6], [2, 40], [0, text.length]] as const) expect(detached(text.slice(a, b))).toBe(text.slice(a, b));
    expect(detached('')).toBe('');
  });
});
