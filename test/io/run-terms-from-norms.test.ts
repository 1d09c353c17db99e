import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runTermsFromNorms } from '../../src/io/run-terms-from-norms.js';
import { tempFolder } from '../support/temp-files.js';

// Invented norms (common practice: a toy table), read as `lexichron terms from-norms` reads them.
const tmp = tempFolder('lexichron-norms-');
const base = { word: 'word', ratings: [{ column: 'valence', category: 'valence' }], name: 'toy', version: '1', license: 'CC0-1.0', source: 'invented for this test' };

describe('runTermsFromNorms', () => {
  it('writes the lexicon and returns the rows it questioned', async () => {
    const file = tmp.write('norms.csv', 'word,valence\nsunny,7.5\ngloomy,2.5\nblank,\n');
    const out = join(tmp.dir, 'toy.lex.tsv');
    const result = await runTermsFromNorms({ ...base, file, out });
    expect(result.lexicon?.terms.map((t) => t.term).sort()).toEqual(['gloomy', 'sunny']);
    expect(result.problems).toEqual([]);
    expect(readFileSync(out, 'utf8')).toContain('sunny');
  });
  it('returns the problems and writes nothing when no lexicon can be made', async () => {
    const file = tmp.write('twice.csv', 'word,valence\nsunny,7.5\nsunny,2.5\n');
    const out = join(tmp.dir, 'twice.lex.tsv');
    const result = await runTermsFromNorms({ ...base, file, out });
    expect(result.lexicon).toBeUndefined();
    expect(result.problems.length).toBeGreaterThan(0);
    expect(existsSync(out)).toBe(false);
  });
  it('stops with the header when a named column is missing, and says which', async () => {
    const file = tmp.write('other.csv', 'term,score\nsunny,7.5\n');
    await expect(runTermsFromNorms({ ...base, file, out: join(tmp.dir, 'x.lex.tsv') })).rejects.toThrow(/no column `word`, `valence`; the header has `term`, `score`/);
  });
});
