import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readLexicon } from '../../src/io/load-lexicon.js';
import { lexiconHash } from '../../src/lexicon/lexicon-hash.js';
import { applyLexiconOverrides } from '../../src/terms/apply-lexicon-overrides.js';
import { diffLexicons } from '../../src/terms/diff-lexicons.js';
import { parseLexiconOverrides } from '../../src/terms/lexicon-overrides.js';

const dir = mkdtempSync(path.join(tmpdir(), 'lexichron-over-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const header = ['## lexichron overrides 1', '## base\tafinn-165', '## name\tafinn-lab', '## version\t2026.1', '## license\tCC0-1.0', '## source\tlab review of pilot diaries'];

describe('layered overrides of a bundled lexicon', () => {
  it('adds, reweights and removes terms of AFINN-165 without editing it, and records the base hash', async () => {
    const file = path.join(dir, 'lab.over.tsv');
    writeFileSync(file, [...header, 'change\tterm\tcategory\tweight', 'add\tbuzzing\tvalence\t2', 'reweight\tsick\tvalence\t0', 'remove\tlike\t', ''].join('\n'));
    const base = await readLexicon('afinn-165');
    const lex = await readLexicon(file);
    expect(lex.name).toBe('afinn-lab');
    expect(lex.terms.find((t) => t.term === 'buzzing')?.weight).toBe(2);
    expect(lex.terms.find((t) => t.term === 'sick')?.weight).toBe(0);
    expect(lex.terms.some((t) => t.term === 'like')).toBe(false);
    expect(lex.terms.length).toBe(base.terms.length);
    expect(lex.notes.at(-1)).toContain(`sha256 ${lexiconHash(base)}`);
    expect(lex.notes.at(-1)).toContain('1 added, 1 reweighted, 1 removed');
    const d = diffLexicons(base, lex);
    expect(d.changes.map((c) => [c.change, c.term])).toEqual([['added', 'buzzing'], ['removed', 'like'], ['reweighted', 'sick']]);
    expect(d.identical).toBe(false);
    expect(d.before.sha256).toBe(lexiconHash(base));
  });
  it('refuses to apply when the base changed since the pinned hash, saying what to do', async () => {
    const file = path.join(dir, 'pinned.over.tsv');
    writeFileSync(file, [...header, `## base-sha256\t${'0'.repeat(64)}`, 'change\tterm\tcategory\tweight', 'add\tbuzzing\tvalence\t2'].join('\n'));
    await expect(readLexicon(file)).rejects.toThrow(/the base changed since the overrides were written/);
  });
  it('names the line and the fix for each bad change', () => {
    const { overrides } = parseLexiconOverrides([...header, 'change\tterm\tcategory\tweight', 'add\tgood\tvalence\t1', 'reweight\tzzz\tvalence\t1', 'remove\tqqq\t', 'add\tbad\tvalence\t9', 'add\tbad\tmood\t1'].join('\n'));
    const base = { name: 'b', version: '1', license: 'x', source: 'y', language: 'en', scale: [-5, 5] as [number, number], scoring: 'rules' as const, negation: 'flip' as const, negators: [], window: 3, categories: [{ name: 'valence', aggregation: 'sum' as const, description: '' }], terms: [{ term: 'good', category: 'valence', weight: 3, status: 'accepted' as const, line: 9 }], notes: [] };
    const { problems } = applyLexiconOverrides(base, overrides!);
    expect(problems.map((p) => p.line)).toEqual([8, 9, 10, 11, 12]);
    expect(problems[0]!.message).toMatch(/already has it .* use reweight/);
    expect(problems[1]!.message).toMatch(/no such term .* use add/);
    expect(problems[3]!.message).toMatch(/outside the scale -5 to 5 of `b`; use a weight within it, or copy the lexicon and widen its `## scale` line/);
    expect(problems[4]!.message).toMatch(/category `mood` is not in `b`/);
  });
  it('rejects malformed override lines with their line numbers', () => {
    const { problems } = parseLexiconOverrides([...header, 'change\tterm\tcategory\tweight', 'replace\tx\tvalence\t1', 'add\tx\tvalence\tone', 'add\tw*\tvalence\t1', 'add\t\tvalence\t1'].join('\n'));
    expect(problems.map((p) => [p.line, p.message.split(';')[0]])).toEqual([
      [8, 'unknown change `replace`'],
      [9, '`add x` needs a numeric weight (dot as decimal mark), not `one`'],
      [10, 'wildcard `w*` is too short: it would match nearly every word'],
      [11, 'the term is empty'],
    ]);
  });
});

describe('diffLexicons', () => {
  it('reports identical content for the same list and status changes separately', async () => {
    const a = await readLexicon('daily-constructs');
    expect(diffLexicons(a, a)).toMatchObject({ identical: true, changes: [] });
    const b = { ...a, terms: a.terms.map((t) => (t.term === 'anxious' ? { ...t, status: 'rejected' as const } : t)) };
    expect(diffLexicons(a, b).changes).toEqual([{ change: 'status', term: 'anxious', category: 'worry', weightBefore: 1, weightAfter: 1, statusBefore: 'accepted', statusAfter: 'rejected' }]);
  });
});
