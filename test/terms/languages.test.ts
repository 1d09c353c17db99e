import { describe, expect, it } from 'vitest';
import { compileLexicon } from '../../src/lexicon/compile-lexicon.js';
import { parseLexicon } from '../../src/lexicon/parse-lexicon.js';
import { matchLexicon } from '../../src/score/match-lexicon.js';
import { random } from '../../src/stats/random.js';
import { termAuditor } from '../../src/terms/term-auditor.js';
import { tokenize } from '../../src/text/tokenize.js';

function lexicon(language: string, rows: string[]): ReturnType<typeof compileLexicon> {
  const text = ['## lexichron lexicon 1', '## name\tt', '## version\t1', '## license\tCC0-1.0', '## source\twritten for this test', `## language\t${language}`, '## category\tworry\tcount', 'term\tcategory\tweight', ...rows.map((r) => `${r}\tworry\t1`)].join('\n');
  const { lexicon: lex, problems } = parseLexicon(text);
  if (!lex) throw new Error(JSON.stringify(problems));
  return compileLexicon(lex);
}

function hits(text: string, lex: ReturnType<typeof compileLexicon>): string[] {
  const found: string[] = [];
  matchLexicon(tokenize(text, lex.language), lex, (hit) => found.push(hit.pattern));
  return found;
}

// Small lists of our own, tokenized with Intl.Segmenter (ICU word boundaries built into Node 20).
describe('term lists in other languages (Intl.Segmenter word granularity)', () => {
  const dutch = lexicon('nl', ['bezorgd', 'ongerust', 'zorgen', 'piekeren', 'bang', 'zenuwacht*', 'niet slapen']);
  it('matches a Dutch list, with a wildcard and a two-word phrase, case-insensitively', () => {
    expect(hits('Ik ben zó bezorgd en Ongerust, ik kon niet slapen. Zenuwachtig voor morgen!', dutch)).toEqual(['bezorgd', 'ongerust', 'niet slapen', 'zenuwacht*']);
    expect(tokenize('Ik ben zó bezorgd', 'nl').nWords).toBe(4);
  });
  it('does not match a Dutch stem inside a longer word without a wildcard', () => {
    expect(hits('Bangalore is ver weg; ik ben niet bang.', dutch)).toEqual(['bang']);
  });
  const japanese = lexicon('ja', ['不安', '心配', '孤独', '寂しい', '嬉しい', '眠れない']);
  it('matches Japanese terms in text written without spaces', () => {
    expect(hits('今日はとても不安で心配だった。', japanese)).toEqual(['不安', '心配']);
    expect(hits('寂しいです。孤独を感じる', japanese)).toEqual(['寂しい', '孤独']);
  });
  it('matches a Japanese term that the segmenter splits into pieces as a phrase of the same pieces', () => {
    // ICU splits 眠れない into 眠|れ|ない; the term is split the same way at compile time.
    expect(tokenize('眠れない', 'ja').norm.length).toBeGreaterThan(1);
    expect(hits('怖くて眠れない夜', japanese)).toEqual(['眠れない']);
  });
  it('cuts Japanese keyword-in-context samples without adding spaces', () => {
    const auditor = termAuditor(japanese, { random: random(1), context: 3 });
    auditor.add({ id: 'a', person: 'p', text: '今日はとても不安で心配だった。' });
    const audit = auditor.finish();
    const anx = audit.terms.find((t) => t.term === '不安')!;
    expect(anx.kwic[0]).toMatchObject({ left: '今日はとても', match: '不安', right: 'で心配だ' });
  });
});
