import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { openWordNet } from '../../src/io/open-wordnet.js';
import { parseLexicon } from '../../src/lexicon/parse-lexicon.js';
import { serializeLexicon } from '../../src/lexicon/serialize-lexicon.js';
import { buildSeedLexicon } from '../../src/terms/build-seed-lexicon.js';
import { parseSeedFile } from '../../src/terms/parse-seed-file.js';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');

describe('the bundled basic-emotions lexicon (Ekman 1992 categories, WordNet 3.1 terms)', () => {
  it('is rebuilt byte for byte from its committed seed file', () => {
    const { seeds, problems } = parseSeedFile(readFileSync(path.join(root, 'lexicons/seeds/basic-emotions.seeds.tsv'), 'utf8'));
    expect(problems).toEqual([]);
    const wn = openWordNet();
    const built = serializeLexicon(buildSeedLexicon(seeds!, wn));
    wn.close();
    expect(built).toBe(readFileSync(path.join(root, 'lexicons/basic-emotions.lex.tsv'), 'utf8'));
  });
  it('is a valid lexicon with the six categories, says it is derived and unvalidated, and names the WordNet license', () => {
    const { lexicon } = parseLexicon(readFileSync(path.join(root, 'lexicons/basic-emotions.lex.tsv'), 'utf8'));
    expect(lexicon?.categories.map((c) => c.name)).toEqual(['anger', 'disgust', 'fear', 'happiness', 'sadness', 'surprise']);
    expect(lexicon?.license).toMatch(/WordNet 3\.1 License/);
    expect(lexicon?.notes.join(' ')).toMatch(/DERIVED AND UNVALIDATED/);
    for (const c of lexicon!.categories) expect(lexicon!.terms.filter((t) => t.category === c.name).length).toBeGreaterThanOrEqual(10);
    expect(lexicon!.terms.some((t) => t.term === 'furious' && t.category === 'anger')).toBe(true);
  });
  it('names the line of a malformed seed', () => {
    const { problems } = parseSeedFile('## lexichron seeds 1\n## name\tx\n## version\t1\n## source\ts\ncategory\tseeds\tdescription\nfear\tafraid/q\t\n');
    expect(problems).toEqual([{ line: 6, message: 'seed `afraid/q` is not `word` or `word/pos` with pos one of n, v, a, r' }, { line: 6, message: 'each line needs a category name and at least one seed' }]);
  });
});
