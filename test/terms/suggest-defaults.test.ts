import { afterAll, describe, expect, it } from 'vitest';
import { openWordNet } from '../../src/io/open-wordnet.js';
import { compileLexicon } from '../../src/lexicon/compile-lexicon.js';
import { parseLexicon } from '../../src/lexicon/parse-lexicon.js';
import { random } from '../../src/stats/random.js';
import { logLikelihoodRatio } from '../../src/terms/log-likelihood-ratio.js';
import { suggestTerms } from '../../src/terms/suggest-terms.js';
import { termAuditor } from '../../src/terms/term-auditor.js';

describe('association strength: the log-likelihood ratio G² (Dunning 1993)', () => {
  it('matches G² = 2 Σ O·ln(O/E) over the 2×2 table, worked by hand for 30 of 40 entries with the seeds, N = 1000, seeds in 100', () => {
    // Table: [30, 10; 70, 890]; expected [4, 36; 96, 864] (row × column / N).
    const byHand = 2 * (30 * Math.log(30 / 4) + 10 * Math.log(10 / 36) + 70 * Math.log(70 / 96) + 890 * Math.log(890 / 864));
    expect(logLikelihoodRatio(30, 40, 100, 1000)).toBeCloseTo(byHand, 10);
    expect(byHand).toBeCloseTo(103.83, 2); // the same formula evaluated by python3's math.log
  });

  it('is 0 for a word seen less often with the seeds than chance predicts (only positive association counts)', () => {
    expect(logLikelihoodRatio(1, 100, 100, 1000)).toBe(0);
  });
});

describe('terms suggest defaults (issue 21 item 8)', () => {
  // Invented counts: "kitchen" turns up in 3 entries, all with a seed (chance: a high PMI from a
  // tiny count); "nervous" in 30 of its 40 entries.
  const corpus = { entries: 1000, seedEntries: 100, words: new Map([['kitchen', { entries: 3, withSeed: 3 }], ['afternoon', { entries: 4, withSeed: 3 }], ['nervous', { entries: 40, withSeed: 30 }], ['tense', { entries: 25, withSeed: 15 }]]) };

  it('ranks a strong, frequent co-occurrence above a chance one with a higher PMI', () => {
    const list = suggestTerms({ seeds: ['worry'], corpus }).map((s) => s.term);
    expect(list.indexOf('nervous')).toBeLessThan(list.indexOf('kitchen'));
    expect(list.indexOf('tense')).toBeLessThan(list.indexOf('afternoon'));
    expect(list[0]).toBe('nervous');
  });

  const wordnet = openWordNet();
  afterAll(() => wordnet.close());

  it('follows only the first WordNet sense of each part of speech unless more are asked for (WordNet 3.1)', () => {
    const senses = (opts: Parameters<typeof suggestTerms>[0]) => new Set(suggestTerms(opts).flatMap((s) => s.reasons.flatMap((r) => (r.kind === 'wordnet' ? [r.sense] : []))));
    expect([...senses({ seeds: ['blue'], wordnet })]).toEqual([1]);
    expect(senses({ seeds: ['blue'], wordnet, wordnetOptions: { maxSenses: 3 } }).has(3)).toBe(true);
  });
});

describe('over_share scales with the size of the list', () => {
  const lexicon = (terms: string[]) => {
    const text = ['## lexichron lexicon 1', '## name\tshare-test', '## version\t1', '## license\tCC0-1.0', '## source\tinvented for this test', '## language\ten', '## negation\tignore', '## category\tcalm\tcount', 'term\tcategory\tweight', ...terms.map((t) => `${t}\tcalm\t1`)].join('\n');
    const { lexicon: lex, problems } = parseLexicon(text);
    if (!lex) throw new Error(JSON.stringify(problems));
    return compileLexicon(lex);
  };

  it('a three-term list used evenly flags no term (each holds a third of the hits)', () => {
    const auditor = termAuditor(lexicon(['calm', 'quiet', 'still']), { random: random(1) });
    for (let i = 0; i < 9; i++) auditor.add({ id: `e${i}`, person: `p${i % 3}`, text: ['calm day', 'quiet day', 'still day'][i % 3] as string });
    expect(auditor.finish().terms.filter((t) => t.flags.includes('over_share'))).toEqual([]);
  });

  it('a ten-term list where one term holds half the hits flags that term', () => {
    const terms = ['calm', 'quiet', 'still', 'serene', 'peaceful', 'relaxed', 'tranquil', 'placid', 'restful', 'mellow'];
    const auditor = termAuditor(lexicon(terms), { random: random(1) });
    const texts = [...Array(9).fill('calm day'), ...terms.slice(1).map((t) => `${t} day`)];
    texts.forEach((text, i) => auditor.add({ id: `e${i}`, person: `p${i % 4}`, text }));
    expect(auditor.finish().terms.filter((t) => t.flags.includes('over_share')).map((t) => t.term)).toEqual(['calm']);
  });
});
