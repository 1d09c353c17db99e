import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { readCsvRecords } from '../../src/io/read-csv-records.js';
import { csvRow } from '../../src/report/csv.js';
import { collect, tempFolder } from '../support/temp-files.js';

const tmp = tempFolder('lexichron-csv-records-');

describe('readCsvRecords', () => {
  it('gives each record written by csvRow back byte for byte, line breaks and quotes inside fields included (RFC 4180, checked with papaparse)', async () => {
    let a = 3;
    const rnd = (): number => {
      a = (a * 16807) % 2147483647;
      return a / 2147483647;
    };
    const pieces = ['plain', 'two\nlines', 'a "quoted" word', 'comma, here', '', '"', '\n', 'é🐝', 'end\r'];
    const records = Array.from({ length: 400 }, () => csvRow(Array.from({ length: 1 + Math.floor(rnd() * 4) }, () => Array.from({ length: Math.floor(rnd() * 3) }, () => pieces[Math.floor(rnd() * pieces.length)]).join(''))));
    // A file larger than one read chunk, so records cross chunk boundaries.
    const big = Array.from({ length: 30_000 }, (_, i) => csvRow([`row ${i}`, 'x'.repeat(40), 'say "hi"\nthere']));
    const path = tmp.write('records.csv', [...records, ...big].join('\n') + '\n');
    const back = await collect(readCsvRecords(path));
    expect(back).toEqual([...records, ...big]);
    const parsed = Papa.parse<string[]>(records.join('\n'), { newline: '\n' }).data;
    expect(parsed).toHaveLength(records.length);
  });

  it('reads a quote inside an unquoted field as a character, as papaparse does, so the next records stay apart', async () => {
    // RFC 4180 section 2 rule 5 keeps quotes out of unquoted fields; a hand-edited file may still
    // hold one (5" screen). Counting quotes would join every line after it into one record.
    const path = tmp.write('stray-quote.csv', 'id,text\n1,5" screen\n2,"x\ny"\n3,z\n');
    expect(await collect(readCsvRecords(path))).toEqual(['id,text', '1,5" screen', '2,"x\ny"', '3,z']);
  });
  it('gives nothing for an empty file', async () => {
    expect(await collect(readCsvRecords(tmp.write('empty.csv', '')))).toEqual([]);
  });
});
