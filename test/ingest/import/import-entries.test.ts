import { describe, expect, it } from 'vitest';
import { createDeduplicator } from '../../../src/ingest/import/create-deduplicator.js';
import { entryLine } from '../../../src/ingest/import/entry-line.js';
import { importEntries, tallyImportItem } from '../../../src/ingest/import/import-entries.js';
import { emptyImportReconciliation, type ImportItem } from '../../../src/ingest/import/import-item.js';
import type { RawEntry } from '../../../src/types.js';
import { collect } from '../../support/temp-files.js';

const T0 = Date.UTC(2025, 2, 3, 8, 0);
let n = 0;
const entry = (minutes: number, text: string, person = 'P01'): ImportItem => {
  n++;
  const e: RawEntry = { id: `chat.txt:${n}`, person, instant: T0 + minutes * 60000, zone: 'Europe/Brussels', offsetMinutes: 60, text, source: { file: 'chat.txt', line: n } };
  return { kind: 'entry', entry: e };
};
async function* from(items: ImportItem[]): AsyncGenerator<ImportItem> {
  yield* items;
}

describe('createDeduplicator', () => {
  it('finds exact duplicates after normalising case, punctuation and spacing', () => {
    const seen = createDeduplicator();
    expect(seen('P01', 'I feel great today, thanks for asking!')).toBe('unique');
    expect(seen('P01', 'i feel GREAT today thanks for asking')).toBe('duplicate_exact');
    expect(seen('P02', 'I feel great today, thanks for asking!')).toBe('unique');
  });
  it('finds a near duplicate at word-shingle Jaccard ≥ 0.8 and not a merely similar text', () => {
    const seen = createDeduplicator();
    const long = 'the meeting went well and everyone agreed on the plan for the spring project with the new team members joining next week';
    expect(seen('P01', long)).toBe('unique');
    expect(seen('P01', `${long} as well`)).toBe('duplicate_near'); // 21 of 23 shingles shared: J = 21/23 ≈ 0.91
    expect(seen('P01', 'the meeting went badly and nobody agreed on anything, so the spring project is delayed again')).toBe('unique');
  });
  it('never calls short messages duplicates (fewer than 5 words by default)', () => {
    const seen = createDeduplicator();
    expect(seen('P01', 'ok thanks')).toBe('unique');
    expect(seen('P01', 'ok thanks')).toBe('unique');
  });
});

describe('importEntries runs duplicates, bursts and redaction and keeps the reconciliation balanced', () => {
  it('merges a burst of messages within N minutes, drops duplicates, redacts, and read = kept + rejected + dropped', async () => {
    const reject: ImportItem = { kind: 'reject', diagnostic: { code: 'chat_bad_date', message: 'x', source: { file: 'chat.txt', line: 99 }, stage: 'ingest' } };
    const items = [
      entry(0, 'Morning! Mail me at ann@example.org'),
      entry(2, 'Coffee first.'),
      entry(4, 'Then work.'),
      { kind: 'drop', reason: 'third_party', source: { file: 'chat.txt', line: 50 } } as ImportItem,
      entry(30, 'Forwarding the whole long story about the trip to the mountains again'),
      entry(60, 'Forwarding the whole long story about the trip to the mountains again'),
      reject,
    ];
    const out = await collect(importEntries(from(items), { mergeBurstMinutes: 5, dedupe: {}, redact: (t) => t.replace(/\S+@\S+/g, '[email]') }));
    const r = emptyImportReconciliation();
    for (const item of out) tallyImportItem(r, item);
    expect(out.filter((i) => i.kind === 'entry').map((i) => i.kind === 'entry' && i.entry.text)).toEqual([
      'Morning! Mail me at [email]\nCoffee first.\nThen work.',
      'Forwarding the whole long story about the trip to the mountains again',
    ]);
    expect(r).toEqual({ read: 7, kept: 2, rejected: { chat_bad_date: 1 }, dropped: { merged_burst: 2, third_party: 1, duplicate_exact: 1 }, notes: {} });
  });
});

describe('entryLine writes the entries contract of docs/architecture.md', () => {
  it('writes id, person, time (RFC 3339 with offset), zone and text in that order', () => {
    const e = entry(15, 'Hi "there"');
    expect(entryLine((e as { entry: RawEntry }).entry)).toBe(`{"id":"chat.txt:${n}","person":"P01","time":"2025-03-03T09:15:00+01:00","zone":"Europe/Brussels","text":"Hi \\"there\\""}`);
  });
});

describe('importEntries keeps the notes of kept entries', () => {
  it('passes an entry\'s notes through, with and without burst merging', async () => {
    const noted = (minutes: number): ImportItem => {
      const item = entry(minutes, 'Ã§a va');
      return { ...item, notes: ['mojibake'] } as ImportItem;
    };
    for (const options of [{}, { mergeBurstMinutes: 5 }]) {
      const r = emptyImportReconciliation();
      for (const item of await collect(importEntries(from([noted(0), noted(60)]), options))) tallyImportItem(r, item);
      expect(r.notes).toEqual({ mojibake: 2 });
    }
  });
});

describe('createDeduplicator (fuzzed against brute force)', () => {
  it('calls an entry a near duplicate only when an earlier kept entry of the person is at least that similar, and finds planted near copies (Broder 1997 shingle Jaccard)', async () => {
    const { createDeduplicator, normalizeForDuplicates } = await import('../../../src/ingest/import/create-deduplicator.js');
    let a = 5;
    const rnd = (): number => {
      a = (a + 0x6d2b79f5) | 0;
      let t = Math.imul(a ^ (a >>> 15), 1 | a);
      t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
      return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
    };
    const vocab = Array.from({ length: 200 }, (_, i) => `word${i}`);
    const shingleSet = (text: string): Set<string> => {
      const w = normalizeForDuplicates(text).split(' ');
      const out = new Set<string>();
      if (w.length <= 3) out.add(w.join(' '));
      else for (let i = 0; i + 3 <= w.length; i++) out.add(w.slice(i, i + 3).join(' '));
      return out;
    };
    const jaccard = (x: Set<string>, y: Set<string>): number => {
      let both = 0;
      for (const s of x) if (y.has(s)) both++;
      return both / (x.size + y.size - both);
    };
    const dedupe = createDeduplicator({ threshold: 0.8 });
    const kept = new Map<string, Array<Set<string>>>();
    let planted = 0;
    let found = 0;
    for (let i = 0; i < 1500; i++) {
      const person = `p${i % 3}`;
      const mine = kept.get(person) ?? [];
      let text: string;
      let copy = false;
      if (i > 10 && rnd() < 0.3) {
        // A 40-word text, then the same with its last word changed: Jaccard 37/39 ≈ 0.95.
        const base = Array.from({ length: 40 }, (_, j) => vocab[(i * 13 + j * 3) % vocab.length] as string);
        const first = dedupe(person, base.join(' '));
        if (first === 'unique') mine.push(shingleSet(base.join(' ')));
        base[39] = `changed${i}`;
        text = base.join(' ');
        copy = first === 'unique';
        if (copy) planted++;
      } else text = Array.from({ length: 5 + Math.floor(rnd() * 20) }, () => vocab[Math.floor(rnd() * vocab.length)]).join(' ');
      const verdict = dedupe(person, text);
      const set = shingleSet(text);
      if (verdict === 'duplicate_near') {
        expect(Math.max(...mine.map((m) => jaccard(set, m)))).toBeGreaterThanOrEqual(0.8);
        if (copy) found++;
      }
      if (verdict === 'unique' && normalizeForDuplicates(text).split(' ').length >= 5) mine.push(set);
      kept.set(person, mine);
    }
    expect(planted).toBeGreaterThan(50);
    // A pair at Jaccard ≈ 0.95 is a candidate with probability 1 − (1 − 0.95⁴)⁸ > 0.9999.
    expect(found).toBe(planted);
  });
});
