import { describe, expect, it } from 'vitest';
import { compileLexicon } from '../../src/lexicon/compile-lexicon.js';
import { parseLexicon } from '../../src/lexicon/parse-lexicon.js';
import { createRedactor } from '../../src/privacy/create-redactor.js';
import { random } from '../../src/stats/random.js';
import { termAuditFiles } from '../../src/terms/term-audit-files.js';
import { termAuditor, type AuditEntry } from '../../src/terms/term-auditor.js';

const lex = (() => {
  const text = ['## lexichron lexicon 1', '## name\tworry-test', '## version\t1', '## license\tCC0-1.0', '## source\twritten for this test', '## language\ten', '## negation\tdrop', '## category\tworry\tcount',
    'term\tcategory\tweight', 'worr*\tworry\t1', 'nervous\tworry\t1', 'tense\tworry\t1', 'dread\tworry\t1', 'regards\tworry\t1', 'afraid\tworry\t1'].join('\n');
  const { lexicon, problems } = parseLexicon(text);
  if (!lexicon) throw new Error(JSON.stringify(problems));
  return compileLexicon(lexicon);
})();

// An invented corpus: "regards" comes from one person's e-mail signature on every entry.
const corpus: AuditEntry[] = [
  { id: 'e1', person: 'ann', text: 'Worried about the hive. Kind regards, Ann ann@example.org', bin: 'd1' },
  { id: 'e2', person: 'ann', text: 'Calm day. Kind regards, Ann ann@example.org', bin: 'd1' },
  { id: 'e3', person: 'ann', text: 'Nervous and tense. Kind regards, Ann ann@example.org', bin: 'd2' },
  { id: 'e4', person: 'ann', text: 'Not worried today. Kind regards, Ann ann@example.org', bin: 'd2' },
  { id: 'e5', person: 'bob', text: 'I worry and worry; nervous all week', bin: 'd1' },
  { id: 'e6', person: 'bob', text: 'tense evening, some dread', bin: 'd2' },
  { id: 'e7', person: 'cem', text: 'Worries again, tense shoulders', bin: 'd1' },
  { id: 'e8', person: 'cem', text: 'a lovely quiet day', bin: 'd2' },
];

function run(over: 'entries' | 'bins' = 'entries') {
  const auditor = termAuditor(lex, { random: random(7), redact: createRedactor({ names: ['Ann'] }), kwic: 2, context: 3, over });
  for (const e of corpus) auditor.add(e);
  return auditor.finish();
}

describe('termAuditor', () => {
  const audit = run();
  const term = (t: string) => audit.terms.find((x) => x.term === t)!;
  it('counts scored hits per term, their share and rank, leaving out the negated hit that `drop` removes', () => {
    // worr*: worried (e1), worry ×2 (e5), worries (e7); "Not worried" (e4) is negated and dropped.
    expect(term('worr*')).toMatchObject({ hits: 4, entries: 3, persons: 3, negated: 1, rank: 2 }); // tie with regards, broken alphabetically
    expect(term('regards')).toMatchObject({ hits: 4, entries: 4, persons: 1, topPersonShare: 1, rank: 1 });
    expect(term('tense').hits).toBe(3);
    const total = audit.terms.reduce((s, t) => s + t.hits, 0);
    expect(total).toBe(4 + 4 + 3 + 2 + 1);
    expect(term('regards').share).toBeCloseTo(4 / 14, 12);
  });
  it('flags terms over the share limit (0.2, common practice, or 1.5 / 6 terms = 0.25 here), carried by fewer than 3 persons, or never matched', () => {
    expect(term('regards').flags).toEqual(['over_share', 'few_persons']);
    expect(term('worr*').flags).toEqual(['over_share']);
    // 3 of 14 hits = 0.21: above 0.2 but within 1.5 × an equal share of a six-term list.
    expect(term('tense').flags).toEqual([]);
    expect(term('dread').flags).toEqual(['few_persons']);
    expect(term('afraid').flags).toEqual(['no_hits']);
  });
  it('lists the corpus words each wildcard matched', () => {
    expect(term('worr*').matchedWords).toEqual([{ word: 'worry', hits: 2 }, { word: 'worried', hits: 1 }, { word: 'worries', hits: 1 }]);
  });
  it('keeps keyword-in-context samples with e-mail addresses and listed names redacted', () => {
    const samples = term('regards').kwic;
    expect(samples.length).toBe(2);
    for (const s of samples) {
      expect(s.match).toBe('regards');
      expect(s.right).toBe(', [name] [email]');
      expect(s.left).toMatch(/Kind$/);
    }
  });
  it('recomputes scores without the most frequent terms and correlates them with the full scores', () => {
    const c = audit.categories[0]!;
    expect(c.dropTopK.map((d) => [d.k, d.droppedTerms])).toEqual([[1, ['regards']], [2, ['regards', 'worr*']], [3, ['regards', 'worr*', 'tense']]]);
    expect(c.dropTopK[0]!.n).toBe(8);
    expect(c.dropTopK[0]!.r).toBeGreaterThan(-1);
    expect(c.dropTopK[0]!.r).toBeLessThan(1);
  });
  it('computes alpha and split-half over entries and over person-bins', () => {
    expect(audit.categories[0]!.reliability).toMatchObject({ over: 'entries', items: 5, rows: 8 });
    expect(audit.categories[0]!.reliability.alpha).toBeDefined();
    const bins = run('bins');
    expect(bins.categories[0]!.reliability).toMatchObject({ over: 'bins', items: 5, rows: 6 });
  });
  it('writes byte-identical files for the same corpus and seed, with top-terms.csv in the documented columns', () => {
    const a = termAuditFiles(audit);
    expect(termAuditFiles(run())).toEqual(a);
    const top = a['top-terms.csv']!.split('\n');
    expect(top[0]).toBe('lexicon,lexicon_sha256,category,rank,term,hits,share,entries,persons,flags');
    expect(top[1]).toBe(`worry-test,${lex.ref.sha256},worry,1,regards,4,0.2857142857,4,1,over_share;few_persons`);
    expect(top.length).toBe(2 + 5);
  });
  it('warns in words when no term matched anything', () => {
    const auditor = termAuditor(lex, { random: random(1) });
    auditor.add({ id: 'x', person: 'p', text: 'nothing here at all' });
    expect(auditor.finish().warnings[0]).toMatch(/^none of the 6 accepted terms matched any of the 1 entries; check that the corpus text column/);
  });
});
