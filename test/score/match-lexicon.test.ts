import { describe, expect, it } from 'vitest';
import { compileLexicon, type CompiledLexicon } from '../../src/lexicon/compile-lexicon.js';
import type { Lexicon } from '../../src/lexicon/lexicon-types.js';
import { parseLexicon } from '../../src/lexicon/parse-lexicon.js';
import { matchLexicon } from '../../src/score/match-lexicon.js';
import { scoreColumns } from '../../src/score/score-columns.js';
import { scoreEntry } from '../../src/score/score-entry.js';
import { clearTokenMemo } from '../../src/fast/tokenize-english.js';
import { tokenize } from '../../src/text/tokenize.js';
import { tokenizeSegmenter } from '../../src/text/tokenize-segmenter.js';
import type { RawEntry } from '../../src/types.js';

/** Builds a compiled lexicon from rows `term|category|weight`, with `|` standing for tabs. */
function lexicon(meta: Record<string, string>, categories: string[], rows: string[]): CompiledLexicon {
  const lines = [
    '## lexichron lexicon 1',
    '## name\ttest',
    '## version\t1',
    '## license\tCC0-1.0',
    '## source\tthis test',
    '## language\ten',
    ...Object.entries(meta).map(([k, v]) => `## ${k}\t${v.replaceAll('|', '\t')}`),
    ...categories.map((c) => `## category\t${c.replaceAll('|', '\t')}`),
    'term\tcategory\tweight',
    ...rows.map((r) => r.replaceAll('|', '\t')),
  ];
  const { lexicon: lex, problems } = parseLexicon(lines.join('\n'));
  if (!lex) throw new Error(JSON.stringify(problems));
  return compileLexicon(lex as Lexicon);
}

function match(lex: CompiledLexicon, text: string) {
  const hits: string[] = [];
  const m = matchLexicon(tokenize(text), lex, (hit, _start, _length, negated) => hits.push(negated ? `¬${hit.pattern}` : hit.pattern));
  return { sums: [...m.sums], counts: [...m.counts], negated: m.negated, hits };
}

const entry = (text: string): RawEntry => ({ id: 'e1', person: 'p1', instant: 0, zone: 'UTC', offsetMinutes: 0, text, source: { file: 'x.csv', line: 2 } });

describe('matchLexicon takes the longest pattern first and counts each token once', () => {
  const worry = lexicon({ scale: '1|1', negation: 'ignore', window: '0' }, ['worry|count'], ['worn|worry|1', 'worn out|worry|1', 'worr*|worry|1', 'worried sick|worry|1', 'worry|worry|1']);

  it('prefers the phrase `worn out` to the word `worn`', () => {
    expect(match(worry, 'I am worn out').hits).toEqual(['worn out']);
  });

  it('counts a phrase that overlaps a wildcard once', () => {
    // `worried sick` and `worr*` both cover `worried`: one hit.
    expect(match(worry, 'worried sick again')).toMatchObject({ counts: [1], hits: ['worried sick'] });
  });

  it('prefers an exact word to a wildcard', () => {
    expect(match(worry, 'worry').hits).toEqual(['worry']);
    expect(match(worry, 'worrying').hits).toEqual(['worr*']);
  });

  it('takes the wildcard with the longest stem', () => {
    const lex = lexicon({ scale: '1|1' }, ['a|count', 'b|count'], ['exhaust*|a|1', 'exhau*|b|1']);
    expect(match(lex, 'exhausting').hits).toEqual(['exhaust*']);
    expect(match(lex, 'exhaling')).toMatchObject({ hits: [] });
  });

  it('matches emoji, emoticons and a word in several categories', () => {
    const lex = lexicon({ scale: '-3|3' }, ['valence|sum', 'calm|count'], ['😴|valence|-1', '👍🏽|valence|2', ':)|valence|2', 'calm|valence|2', 'calm|calm|1']);
    expect(match(lex, 'calm 😴 :) 👍🏽')).toMatchObject({ sums: [5, 1], counts: [4, 1] });
    // The plain thumbs-up is a different grapheme cluster from the one with a skin tone.
    expect(match(lex, '👍').counts).toEqual([0, 0]);
  });

  it('matches a contraction in a lexicon term as the text writes it, with or without apostrophe', () => {
    const lex = lexicon({ scale: '-5|5' }, ['valence|sum'], ["can't stand|valence|-3"]);
    expect(match(lex, "I can't stand it").sums).toEqual([-3]);
    expect(match(lex, 'I cant stand it').sums).toEqual([-3]);
    expect(match(lex, 'I cannot stand it').sums).toEqual([-3]);
  });
});

describe('matchLexicon answers by token id and by text alike', () => {
  const lex = lexicon({ scale: '-5|5', negation: 'flip', window: '3' }, ['valence|sum'], ['happy|valence|2', 'worn out|valence|-2', 'glo*|valence|-1']);

  it('gives the same sums for tokens made before the memo was emptied (their ids are stale) as for fresh tokens', () => {
    const text = 'happy, not happy, worn out and gloomy glowing';
    const before = tokenize(text);
    const fresh = matchLexicon(before, lex);
    clearTokenMemo(); // ids of `before` belong to the previous generation now
    const stale = matchLexicon(before, lex);
    const after = matchLexicon(tokenize(text), lex);
    expect([...fresh.sums]).toEqual([2 - 2 - 2 - 1 - 1]);
    expect([...stale.sums]).toEqual([...fresh.sums]);
    expect([...after.sums]).toEqual([...fresh.sums]);
    expect(after.negated).toBe(1);
  });

  it('matches tokens without ids (other languages: Intl.Segmenter) by their text', () => {
    const t = tokenizeSegmenter('happy and gloomy', 'en');
    expect(t.ids).toBeUndefined();
    expect([...matchLexicon(t, lex).sums]).toEqual([1]);
  });
});

describe('matchLexicon negation', () => {
  const rows = ['happy|valence|3', 'sad|valence|-2'];

  it('flips a negated weight to (low + high) − w: −3 on a symmetric scale', () => {
    const lex = lexicon({ scale: '-5|5', negation: 'flip', window: '3' }, ['valence|sum'], rows);
    expect(match(lex, 'not happy')).toMatchObject({ sums: [-3], counts: [1], negated: 1, hits: ['¬happy'] });
    expect(match(lex, "I don't feel sad")).toMatchObject({ sums: [2], negated: 1 });
  });

  it('flips on a 1–9 rating scale around its midpoint: 7 becomes 3', () => {
    const lex = lexicon({ scale: '1|9', negation: 'flip', window: '3' }, ['valence|rating'], ['happy|valence|7']);
    expect(match(lex, 'never happy').sums).toEqual([3]);
  });

  it('drops a negated hit under `drop` but still counts it as negated', () => {
    const lex = lexicon({ scale: '-5|5', negation: 'drop', window: '3' }, ['valence|sum'], rows);
    expect(match(lex, 'not happy, but sad')).toMatchObject({ sums: [-2], counts: [1], negated: 1 });
  });

  it('scores a negated hit as written under `ignore` and still counts it as negated', () => {
    const lex = lexicon({ scale: '-5|5', negation: 'ignore', window: '3' }, ['valence|sum'], rows);
    expect(match(lex, 'not happy')).toMatchObject({ sums: [3], negated: 1 });
  });

  it('drops a negated hit from a count category under `flip` (a negated worry word is no worry)', () => {
    const lex = lexicon({ scale: '1|1', negation: 'flip', window: '3' }, ['worry|count'], ['worried|worry|1']);
    expect(match(lex, 'not worried at all')).toMatchObject({ counts: [0], negated: 1 });
  });

  it('looks back `window` tokens: 3 reaches `not` in `not at all happy`, 2 does not', () => {
    const three = lexicon({ scale: '-5|5', negation: 'flip', window: '3' }, ['valence|sum'], rows);
    const two = lexicon({ scale: '-5|5', negation: 'flip', window: '2' }, ['valence|sum'], rows);
    expect(match(three, 'not at all happy').sums).toEqual([-3]);
    expect(match(two, 'not at all happy').sums).toEqual([3]);
  });

  it('stops the window at punctuation', () => {
    const lex = lexicon({ scale: '-5|5', negation: 'flip', window: '3' }, ['valence|sum'], rows);
    expect(match(lex, 'Not really. Happy though')).toMatchObject({ sums: [3], negated: 0 });
    expect(match(lex, 'no, happy')).toMatchObject({ sums: [3], negated: 0 });
  });

  it('uses the lexicon\'s own negator list', () => {
    const lex = lexicon({ scale: '-5|5', negation: 'flip', window: '1', negators: 'hardly' }, ['valence|sum'], rows);
    expect(match(lex, 'hardly happy').sums).toEqual([-3]);
    expect(match(lex, 'not happy').sums).toEqual([3]);
  });
});

describe('scoreEntry aggregates per category', () => {
  const lex = lexicon({ scale: '-3|3', negation: 'ignore', window: '0' }, ['valence|rating', 'worry|count', 'total|sum'], ['glad|valence|2', 'grim|valence|-3', 'worr*|worry|1', 'glad|total|2', 'grim|total|-3']);

  it('gives a rating category the mean weight of matched terms', () => {
    const s = scoreEntry(entry('glad but grim, glad'), [lex]);
    expect(s.scores['test.valence']).toBeCloseTo(1 / 3, 12);
    expect(s.matched['test.valence']).toBe(3);
    expect(s.scores['test.total']).toBe(1);
  });

  it('leaves a rating category empty (undefined, not 0) when nothing matched, while a sum is 0', () => {
    const s = scoreEntry(entry('an ordinary day at the hives'), [lex]);
    expect(s.scores['test.valence']).toBeUndefined();
    expect(s.matched['test.valence']).toBe(0);
    expect(s.scores['test.total']).toBe(0);
    expect(s.scores['test.worry_per100w']).toBe(0);
  });

  it('divides a count category by the word tokens of the entry, per 100 words', () => {
    // 8 words (the emoji and the full stop are not words), 2 worry hits: 100 × 2 / 8 = 25.
    const s = scoreEntry(entry('I worried and kept worrying about the bees 🐝.'), [lex]);
    expect(s.nWords).toBe(8);
    expect(s.scores['test.worry_per100w']).toBe(25);
  });

  it('leaves a count category empty for an entry with no words', () => {
    expect(scoreEntry(entry('🐝🐝 !!'), [lex]).scores['test.worry_per100w']).toBeUndefined();
  });

  it('keeps the text only when asked', () => {
    expect(scoreEntry(entry('glad'), [lex]).text).toBeUndefined();
    expect(scoreEntry(entry('glad'), [lex], true).text).toBe('glad');
  });

  it('names score columns <lexicon>.<category> with their aggregation', () => {
    expect(scoreColumns([lex]).map((c) => [c.name, c.aggregation])).toEqual([
      ['test.valence', 'rating'],
      ['test.worry_per100w', 'count'],
      ['test.total', 'sum'],
    ]);
  });
});
