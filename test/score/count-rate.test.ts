import { describe, expect, it } from 'vitest';
import { compileLexicon } from '../../src/lexicon/compile-lexicon.js';
import { parseLexicon } from '../../src/lexicon/parse-lexicon.js';
import { scoreColumns } from '../../src/score/score-columns.js';
import { scoreEntry } from '../../src/score/score-entry.js';
import { scoreTexts } from '../../src/fast/score-texts.js';
import { scoreRowFiller, scoreRowText } from '../../src/fast/score-row-filler.js';

// An invented two-category lexicon: one count, one sum.
const TSV = ['## lexichron lexicon 1', '## name\tstudy-words', '## version\t1', '## license\tCC0-1.0', '## source\tinvented for this test', '## language\ten', '## scale\t-3\t3', '## negation\tignore', '## category\tworry\tcount\tWorry words', '## category\ttone\tsum\tTone', 'term\tcategory\tweight\tstatus', 'worried\tworry\t1\t', 'tense\tworry\t1\t', 'glad\ttone\t2\t', ''].join('\n');

function lexicon() {
  const { lexicon: lex, problems } = parseLexicon(TSV);
  if (!lex) throw new Error(JSON.stringify(problems));
  return compileLexicon(lex);
}

const entry = { id: 'e1', person: 'p', instant: Date.parse('2026-05-01T10:00:00Z'), zone: 'UTC', offsetMinutes: 0, text: 'worried and tense but glad', source: { file: 'x', line: 2 } };

describe('count categories name their rate', () => {
  it('the column name ends in the unit: per100w by default; sum categories keep their name', () => {
    expect(scoreColumns([lexicon()]).map((c) => c.name)).toEqual(['study-words.worry_per100w', 'study-words.tone']);
    expect(scoreColumns([lexicon()], 'per1000w').map((c) => c.name)).toEqual(['study-words.worry_per1000w', 'study-words.tone']);
    expect(scoreColumns([lexicon()], 'prop').map((c) => c.name)).toEqual(['study-words.worry_prop', 'study-words.tone']);
  });

  it('2 worry words of 5: 40 per 100 words, 400 per 1,000 words, proportion 0.4 (worked by hand)', () => {
    const lex = lexicon();
    expect(scoreEntry(entry, [lex]).scores['study-words.worry_per100w']).toBeCloseTo(40, 12);
    for (const [rate, value] of [['per100w', '40'], ['per1000w', '400'], ['prop', '0.4']] as const) {
      const columns = scoreColumns([lex], rate);
      const line = scoreRowText(scoreRowFiller(columns, [lex], false), entry, scoreTexts([entry.text], [lex], columns.length), 0);
      expect(line.split(',')[6], rate).toBe(value);
      expect(line.split(',')[7], `${rate}: the sum column is unchanged`).toBe('2');
    }
  });
});
