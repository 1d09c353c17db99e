import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { lexiconHash } from '../../src/lexicon/lexicon-hash.js';
import type { Lexicon } from '../../src/lexicon/lexicon-types.js';
import { parseLexicon } from '../../src/lexicon/parse-lexicon.js';
import { serializeLexicon } from '../../src/lexicon/serialize-lexicon.js';

/** A lexicon file from lines; tabs written as `|` to keep the cases readable. */
function file(...lines: string[]): string {
  return lines.map((l) => l.replaceAll('|', '\t')).join('\n') + '\n';
}

const HEAD = [
  '## lexichron lexicon 1',
  '## name|moods',
  '## version|1.0.0',
  '## license|CC0-1.0',
  '## source|written for this test',
  '## language|en',
  '## scale|-3|3',
  '## negation|flip',
  '## window|2',
  '## category|valence|rating|mean valence',
  '## category|worry|count',
  'term|category|weight|status',
];

function problems(...rows: string[]): Array<{ line: number; message: string }> {
  const result = parseLexicon(file(...HEAD, ...rows));
  expect(result.lexicon).toBeUndefined();
  return result.problems;
}

describe('parseLexicon reads a valid lexicon', () => {
  it('returns metadata, categories and terms with their lines', () => {
    const { lexicon, problems: found } = parseLexicon(file(...HEAD, 'glad|valence|2.5', 'worr*|worry|1|', 'on edge|worry|1|pending', '🙂|valence|1'));
    expect(found).toEqual([]);
    expect(lexicon).toMatchObject({
      name: 'moods',
      version: '1.0.0',
      license: 'CC0-1.0',
      language: 'en',
      scale: [-3, 3],
      scoring: 'rules',
      negation: 'flip',
      window: 2,
      categories: [
        { name: 'valence', aggregation: 'rating', description: 'mean valence' },
        { name: 'worry', aggregation: 'count', description: '' },
      ],
      terms: [
        { term: 'glad', category: 'valence', weight: 2.5, status: 'accepted', line: 13 },
        { term: 'worr*', category: 'worry', weight: 1, status: 'accepted', line: 14 },
        { term: 'on edge', category: 'worry', weight: 1, status: 'pending', line: 15 },
        { term: '🙂', category: 'valence', weight: 1, status: 'accepted', line: 16 },
      ],
    });
  });

  it('takes a missing weight as 1 and lists the default negators when none are given', () => {
    const { lexicon } = parseLexicon(file(...HEAD, 'tense|worry|'));
    expect(lexicon?.terms[0]?.weight).toBe(1);
    expect(lexicon?.negators).toContain('not');
  });

  it('reads every bundled lexicon without a problem', () => {
    for (const name of ['afinn-165', 'vader', 'daily-constructs']) {
      const { lexicon, problems: found } = parseLexicon(readFileSync(resolve(__dirname, `../../lexicons/${name}.lex.tsv`), 'utf8'));
      expect(found, name).toEqual([]);
      expect(lexicon?.name).toBe(name);
    }
  });
});

describe('parseLexicon reports every problem with its line', () => {
  it('quotes at most 60 characters of a value, so a 5 MB line gives a short message (issue 18 item 5)', () => {
    const [problem] = problems(`glad|valence|${'9x'.repeat(2_500_000)}`);
    expect(problem?.message).toBe(`weight \`${'9x'.repeat(30)}…\` of \`glad\` is not a number; write it with a dot as decimal mark, e.g. 1.5`);
  });
  it('reports a term listed twice in a category with the line of the first', () => {
    expect(problems('glad|valence|2', 'Glad|valence|2')).toEqual([{ line: 14, message: '`Glad` is listed twice in category `valence` (first on line 13); remove one' }]);
  });

  it('reports the same term with different weights', () => {
    expect(problems('glad|valence|2', 'glad|valence|3')).toEqual([
      { line: 14, message: '`glad` is listed twice in category `valence` with different weights (2 on line 13, 3 here); keep one' },
    ]);
  });

  it('reports a weight that is not a number', () => {
    expect(problems('glad|valence|2,5', 'calm|valence|high')).toEqual([
      { line: 13, message: 'weight `2,5` of `glad` is not a number; write it with a dot as decimal mark, e.g. 1.5' },
      { line: 14, message: 'weight `high` of `calm` is not a number; write it with a dot as decimal mark, e.g. 1.5' },
    ]);
  });

  it('reports a weight outside the declared scale', () => {
    expect(problems('ecstatic|valence|4')).toEqual([{ line: 13, message: 'weight 4 of `ecstatic` is outside the scale -3 to 3' }]);
  });

  it('reports a category that was not declared', () => {
    expect(problems('tired|fatigue|1')).toEqual([{ line: 13, message: '`tired` names category `fatigue`, which is not declared; declare it with `## category` or fix the name' }]);
  });

  it('reports a wildcard stem shorter than three letters', () => {
    expect(problems('wo*|worry|1')).toEqual([{ line: 13, message: 'wildcard `wo*` is too short: it would match nearly every word; give at least 3 letters before *' }]);
  });

  it('reports a lone * as a too-short wildcard', () => {
    expect(problems('*|worry|1')).toEqual([{ line: 13, message: 'wildcard `*` is too short: it would match nearly every word; give at least 3 letters before *' }]);
  });

  it('reports a wildcard that does not end a single word', () => {
    expect(problems('wor*ied|worry|1', 'worr* about|worry|1')).toEqual([
      { line: 13, message: '`wor*ied`: a wildcard may only end a single word, as in `worr*`' },
      { line: 14, message: '`worr* about`: a wildcard may only end a single word, as in `worr*`' },
    ]);
  });

  it('reports a status other than accepted, pending or rejected', () => {
    expect(problems('glad|valence|2|maybe')).toEqual([{ line: 13, message: 'status `maybe` of `glad` is not one of accepted, pending, rejected' }]);
  });

  it('reports missing required metadata', () => {
    const text = file(...HEAD.filter((l) => !l.startsWith('## license') && !l.startsWith('## source')), 'glad|valence|2');
    expect(parseLexicon(text).problems).toEqual([
      { line: 1, message: 'required metadata `## license` is missing or empty' },
      { line: 1, message: 'required metadata `## source` is missing or empty' },
    ]);
  });

  it('reports unknown metadata keys, aggregations, negation rules and windows', () => {
    const text = file(
      '## lexichron lexicon 1',
      '## name|x',
      '## version|1',
      '## license|CC0-1.0',
      '## source|test',
      '## language|en',
      '## colour|blue',
      '## negation|invert',
      '## window|99',
      '## category|valence|median',
      'term|category|weight',
    );
    expect(parseLexicon(text).problems.map((p) => [p.line, p.message.split(';')[0]])).toEqual([
      [7, 'unknown metadata key `colour`'],
      [10, 'unknown aggregation `median` for category `valence`'],
      [1, 'unknown negation rule `invert`'],
      [1, '`## window` must be a whole number of tokens from 0 to 20, not `99`'],
      [1, 'no category is declared'],
    ]);
  });

  it('reports a missing signature line and stops', () => {
    expect(parseLexicon('term\tcategory\tweight\n').problems).toEqual([{ line: 1, message: 'the first line must be `## lexichron lexicon 1`; this does not look like a lexichron lexicon file' }]);
  });

  it('reports a row with more fields than the header', () => {
    expect(problems('glad|valence|2|accepted|extra')).toEqual([{ line: 13, message: 'the row has 5 fields but the header has 4; separate columns with one tab' }]);
  });

  it('reports all problems of a file at once', () => {
    // Row-level problems come first (line 14), then the checks across rows (lines 13 and 15).
    expect(problems('glad|valence|9', 'wo*|worry|1', 'tired|fatigue|1').map((p) => p.line)).toEqual([14, 13, 15]);
  });
});

describe('serializeLexicon and lexiconHash', () => {
  const { lexicon } = parseLexicon(file(...HEAD, 'glad|valence|2.5', 'worr*|worry|1', 'on edge|worry|1|pending', '🙂|valence|1', 'not good|valence|-2'));
  const base = lexicon as Lexicon;
  const withoutLines = (l: Lexicon) => ({ ...l, terms: l.terms.map(({ line: _line, ...t }) => t) });

  it('round-trips: parsing the serialized text gives the same lexicon (line numbers aside)', () => {
    const again = parseLexicon(serializeLexicon(base));
    expect(again.problems).toEqual([]);
    expect(withoutLines(again.lexicon as Lexicon)).toEqual(withoutLines(base));
    expect(serializeLexicon(again.lexicon as Lexicon)).toBe(serializeLexicon(base));
  });

  it('round-trips each bundled lexicon', () => {
    for (const name of ['afinn-165', 'vader', 'daily-constructs']) {
      const parsed = parseLexicon(readFileSync(resolve(__dirname, `../../lexicons/${name}.lex.tsv`), 'utf8')).lexicon as Lexicon;
      const again = parseLexicon(serializeLexicon(parsed)).lexicon as Lexicon;
      expect(withoutLines(again), name).toEqual(withoutLines(parsed));
      expect(lexiconHash(again)).toBe(lexiconHash(parsed));
    }
  });

  it('keeps the content hash when rows are reordered', () => {
    const reordered = { ...base, terms: [...base.terms].reverse() };
    expect(lexiconHash(reordered)).toBe(lexiconHash(base));
    expect(lexiconHash(base)).toMatch(/^[0-9a-f]{64}$/);
  });

  it('changes the content hash when one weight changes', () => {
    const changed = { ...base, terms: base.terms.map((t) => (t.term === 'glad' ? { ...t, weight: 2 } : t)) };
    expect(lexiconHash(changed)).not.toBe(lexiconHash(base));
  });

  it('changes the content hash when a status or the negation rule changes', () => {
    expect(lexiconHash({ ...base, negation: 'drop' })).not.toBe(lexiconHash(base));
    expect(lexiconHash({ ...base, terms: base.terms.map((t) => ({ ...t, status: 'accepted' as const })) })).not.toBe(lexiconHash(base));
  });
});
