import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { loadLexicons } from '../../src/io/load-lexicon.js';
import { scoreColumns } from '../../src/score/score-columns.js';
import { mergeVaderColumns, scoreTexts } from '../../src/score/score-text.js';

describe('scoreTexts by parts (how the reading thread and the workers share a batch)', () => {
  it('the `rules` part with the `vader` part merged in equals `all`, on the demo messages', async () => {
    const lexicons = await loadLexicons(['afinn-165', 'vader', 'daily-constructs']);
    const columns = scoreColumns(lexicons).length;
    const rows = Papa.parse<{ text: string }>(readFileSync(resolve(__dirname, '../../demo-data/messages.csv'), 'utf8'), { header: true, skipEmptyLines: true }).data;
    const texts = rows.slice(0, 1500).map((r) => r.text);
    const all = scoreTexts(texts, lexicons, columns);
    const rules = scoreTexts(texts, lexicons, columns, 'rules');
    const vader = scoreTexts(texts, lexicons, columns, 'vader');
    // Before merging, the rules part leaves the VADER columns unscored (0) and the vader part everything else.
    const vaderColumn = scoreColumns(lexicons).findIndex((c) => c.name === 'vader.compound');
    expect(rules.values[vaderColumn]).toBe(0);
    expect(vader.words.every((w) => w === 0)).toBe(true);
    mergeVaderColumns(rules, vader, lexicons);
    expect(rules).toEqual(all);
    expect(all.values.some((v, k) => k % columns === vaderColumn && v !== 0 && !Number.isNaN(v))).toBe(true);
  });
});
