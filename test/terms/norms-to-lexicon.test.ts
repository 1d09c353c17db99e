import { describe, expect, it } from 'vitest';
import { parseLexicon } from '../../src/lexicon/parse-lexicon.js';
import { serializeLexicon } from '../../src/lexicon/serialize-lexicon.js';
import { normsToLexicon, type NormsRecord } from '../../src/terms/norms-to-lexicon.js';

// An invented norms table (ratings 1-9) in the shape of published valence/arousal norms.
const rows = (table: string[][]): NormsRecord[] => table.map(([word, v, a], i) => ({ record: { Word: word!, V: v!, A: a! }, source: { file: 'norms.csv', line: i + 2 } }));
const base = { word: 'Word', ratings: [{ column: 'V', category: 'valence' }, { column: 'A', category: 'arousal' }], name: 'toy-norms', version: '1', license: 'CC0-1.0', source: 'invented for this test' };

describe('normsToLexicon', () => {
  it('makes one rating category per column with the scale taken from the data', () => {
    const r = normsToLexicon(rows([['calm', '7.5', '2.1'], ['panic', '1.9', '7.8'], ['table', '5', '']]), base);
    expect(r.problems).toEqual([]);
    const lex = r.lexicon!;
    expect(lex.categories).toEqual([{ name: 'valence', aggregation: 'rating', description: 'Mean `V` rating of the matched words' }, { name: 'arousal', aggregation: 'rating', description: 'Mean `A` rating of the matched words' }]);
    expect(lex.scale).toEqual([1.9, 7.8]);
    expect(lex.terms.filter((t) => t.category === 'arousal').map((t) => t.term)).toEqual(['calm', 'panic']);
    expect(parseLexicon(serializeLexicon(lex)).problems).toEqual([]);
  });
  it('refuses to convert without a license and a source', () => {
    const r = normsToLexicon(rows([['calm', '7', '2']]), { ...base, license: '', source: ' ' });
    expect(r.lexicon).toBeUndefined();
    expect(r.problems.map((p) => p.message.split(':')[0])).toEqual(['no license given', 'no source given']);
  });
  it('stops on a duplicate word with different ratings, naming both lines, unless told to keep the first or average', () => {
    const table = [['calm', '7', '2'], ['Calm', '8', '2']];
    expect(normsToLexicon(rows(table), base).problems).toEqual([{ line: 3, message: '`Calm` is listed again (first on line 2) with different ratings; remove one row, or pass --duplicates first|mean' }]);
    expect(normsToLexicon(rows(table), { ...base, duplicates: 'mean' }).lexicon!.terms[0]).toMatchObject({ term: 'calm', weight: 7.5 });
    expect(normsToLexicon(rows(table), { ...base, duplicates: 'first' }).lexicon!.terms[0]).toMatchObject({ weight: 7 });
  });
  it('reports a rating that is not a number, or outside the declared scale, with its line and leaves only that rating out', () => {
    const r = normsToLexicon(rows([['calm', '7,5', '2'], ['panic', '12', '8']]), { ...base, scale: [1, 9] });
    expect(r.diagnostics.map((d) => [d.code, d.source?.line])).toEqual([['not_a_number', 2], ['outside_scale', 3]]);
    expect(r.diagnostics[0]!.message).toMatch(/--decimal-comma/);
    expect(r.lexicon!.scale).toEqual([1, 9]);
    expect(normsToLexicon(rows([['calm', '7,5', '2']]), { ...base, decimalComma: true }).lexicon!.terms[0]!.weight).toBe(7.5);
  });
});
