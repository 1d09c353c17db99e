import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Command } from 'commander';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { registerTerms } from '../../src/cli/terms.js';
import { LexichronError } from '../../src/errors.js';

const dir = mkdtempSync(path.join(tmpdir(), 'lexichron-terms-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const file = (name: string, text: string): string => {
  const p = path.join(dir, name);
  writeFileSync(p, text);
  return p;
};

/** Runs `lexichron terms …` in-process; returns stderr, stdout and the thrown error, if any. */
async function terms(...args: string[]): Promise<{ err: string; out: string; error?: LexichronError }> {
  const program = new Command('lexichron').exitOverride();
  registerTerms(program);
  let err = '';
  let out = '';
  const e = vi.spyOn(process.stderr, 'write').mockImplementation((s) => ((err += String(s)), true));
  const o = vi.spyOn(process.stdout, 'write').mockImplementation((s) => ((out += String(s)), true));
  try {
    await program.parseAsync(['terms', ...args], { from: 'user' });
    return { err, out };
  } catch (error) {
    if (error instanceof LexichronError) return { err, out, error };
    throw error;
  } finally {
    e.mockRestore();
    o.mockRestore();
  }
}

const head = ['## lexichron lexicon 1', '## name\tmine', '## version\t1', '## license\tCC0-1.0', '## source\tmine', '## language\ten', '## category\tworry\tcount', 'term\tcategory\tweight'];

describe('lexichron terms: bad input gets messages that name the line and the fix', () => {
  it('lists malformed lines, duplicates with different weights and over-broad wildcards of a list, each with its line', async () => {
    const lex = file('bad.lex.tsv', [...head, 'worry\tworry\t1\textra\tfield', 'nervous\tworry\t1', 'nervous\tworry\t2', '*\tworry\t1', 'a*\tworry\t1', 'tense\tworry\tlots'].join('\n'));
    const corpus = file('c.txt', 'worried\n');
    const { error } = await terms('audit', lex, '--corpus', corpus, '--out', path.join(dir, 'a0'));
    expect(error?.kind).toBe('usage');
    const msg = error!.message;
    expect(msg).toContain('line 9: the row has 5 fields but the header has 3; separate columns with one tab');
    expect(msg).toContain('line 11: `nervous` is listed twice in category `worry` with different weights (1 on line 10, 2 here); keep one');
    expect(msg).toContain('line 12: wildcard `*` is too short: it would match nearly every word; give at least 3 letters before *');
    expect(msg).toContain('line 13: wildcard `a*` is too short');
    expect(msg).toContain('line 14: weight `lots` of `tense` is not a number');
  });
  it('stops with exit kind "input" on an empty corpus and says what to check', async () => {
    const lex = file('ok.lex.tsv', [...head, 'worr*\tworry\t1', 'nervous\tworry\t1'].join('\n'));
    const corpus = file('empty.csv', 'person,text\n');
    const { error } = await terms('audit', lex, '--corpus', corpus, '--out', path.join(dir, 'a1'));
    expect(error?.kind).toBe('input');
    expect(error?.message).toBe('The corpus `empty.csv` has no entries with text. The file has no rows. Check the file, --columns text=COLUMN and --format.');
  });
  it('names the first rejected row when every corpus row lacks text', async () => {
    const lex = path.join(dir, 'ok.lex.tsv');
    const corpus = file('blank.csv', 'person,text\nann,\nbob,  \n');
    const { error } = await terms('audit', lex, '--corpus', corpus, '--out', path.join(dir, 'a2'));
    expect(error?.message).toMatch(/2 rows were rejected, the first on line 2: the `text` field is empty/);
  });
  it('warns when a corpus gives no hits, naming the language and text column to check, and still writes the audit', async () => {
    const lex = path.join(dir, 'ok.lex.tsv');
    const corpus = file('calm.csv', 'person,text\nann,a calm day\nbob,quiet evening\n');
    const out = path.join(dir, 'a3');
    const { err, error } = await terms('audit', lex, '--corpus', corpus, '--out', out);
    expect(error).toBeUndefined();
    expect(err).toContain('warning: none of the 2 accepted terms matched any of the 2 entries; check that the corpus text column is the right one');
    expect(readFileSync(path.join(out, 'term-hits.csv'), 'utf8')).toBe('category,term,wildcard,hits,share,rank,entries,persons,top_person_share,negated,flags\nworry,nervous,0,0,,1,0,0,,0,no_hits\nworry,worr*,1,0,,2,0,0,,0,no_hits\n');
  });
  it('tells which column is missing from a corpus', async () => {
    const corpus = file('cols.csv', 'person,body\nann,worried\n');
    const { error } = await terms('audit', path.join(dir, 'ok.lex.tsv'), '--corpus', corpus, '--out', path.join(dir, 'a4'));
    expect(error?.message).toBe('Cannot read `cols.csv`: no text column `text`; the header has `person`, `body`. Name the text column with --columns text=COLUMN.');
  });
  it('refuses to write a lexicon from norms without a license and a source', async () => {
    const norms = file('norms.csv', 'Word,V\ncalm,7\n');
    const out = path.join(dir, 'norms.lex.tsv');
    const { error } = await terms('from-norms', norms, '--word', 'Word', '--rating', 'valence=V', '--name', 'n', '--out', out);
    expect(error?.message).toMatch(/^Not writing `.*norms\.lex\.tsv`: --license and --source missing/);
    expect(existsSync(out)).toBe(false);
    const ok = await terms('from-norms', norms, '--word', 'Word', '--rating', 'valence=V', '--name', 'n', '--out', out, '--license', 'CC0-1.0', '--source', 'invented', '--scale', '1,9');
    expect(ok.error).toBeUndefined();
    expect(readFileSync(out, 'utf8')).toContain('calm\tvalence\t7');
  });
  it('writes a draft lexicon with the seeds accepted and suggestions pending, and a reasons file', async () => {
    const corpus = file('diary.txt', Array.from({ length: 4 }, () => 'worry keeps me up at midnight').join('\n') + '\nmidnight snack\nlovely garden\n');
    const out = path.join(dir, 'draft.lex.tsv');
    const { error } = await terms('suggest', '--seed', 'worry', '--corpus', corpus, '--no-wordnet', '--min-pmi', '0.1', '--out', out, '--name', 'mine');
    expect(error).toBeUndefined();
    const text = readFileSync(out, 'utf8');
    // The category is named from --name (issue 21 item 8).
    expect(text).toContain('## category\tmine\tcount');
    expect(text).toContain('worry\tmine\t1\taccepted');
    expect(text).toContain('midnight\tmine\t1\tpending');
    expect(readFileSync(`${out}.reasons.csv`, 'utf8').split('\n')[0]).toBe('rank,term,corpus_entries,pmi,reasons');
  });
  it('prints added, removed and reweighted terms and both hashes for diff', async () => {
    const a = path.join(dir, 'ok.lex.tsv');
    const b = file('ok2.lex.tsv', [...head.slice(0, 6), '## scale\t0\t3', ...head.slice(6), 'worr*\tworry\t2', 'tense\tworry\t1'].join('\n'));
    const { out, error } = await terms('diff', a, b);
    expect(error?.message).toBeUndefined();
    expect(out).toMatch(/^before: mine 1  sha256 [0-9a-f]{64}  \(2 terms\)\nafter:  mine 1  sha256 [0-9a-f]{64}  \(2 terms\)\n1 added, 1 removed, 1 reweighted, 0 status changed\n/);
    expect(out).toContain('  reweighted worry\tworr*\t1 → 2\n');
  });
});
