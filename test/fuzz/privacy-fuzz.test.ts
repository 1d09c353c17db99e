// Privacy fuzz suite (issue 18, Checks): seeded exports of every format with one byte-level fault
// each (test/fuzz/privacy-fuzz-generator.ts), read by every importer and reader, asserting
//   1. no other person's marker text is ever kept (entries file of `import`);
//   2. read = kept + rejected + dropped, as the sidecar records it and as the files hold it
//      (one entries line per kept entry, one rejects row per rejected unit);
//   3. no input text in any rejects file or diagnostic message, nor in an error that stops a run.
// Cases per reader: LEXICHRON_FUZZ_CASES (default 20; `npm run fuzz` runs 2000).
// One fault per case: with several faults in one message header (a lost line break *and* a damaged
// date) another sender's line can be indistinguishable from the participant's text.
import { readFileSync } from 'node:fs';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { LexichronError } from '../../src/errors.js';
import { parseSeriesCsv } from '../../src/dynamics/parse-series-csv.js';
import { readEntries } from '../../src/ingest/read-entries.js';
import { readRecords } from '../../src/ingest/read-records.js';
import { ratingValues } from '../../src/validate/rating-values.js';
import { buildZoneTable } from '../../src/ingest/zone-table.js';
import { runImport } from '../../src/io/run-import.js';
import type { ImportSourceSpec } from '../../src/io/open-import-source.js';
import { collect, tempFolder } from '../support/temp-files.js';
import { chatLinesCase, chatTableCase, diaryCase, entriesCase, mboxCase, numericTableCase, type FuzzCase } from './privacy-fuzz-generator.js';
import { tableFile } from '../../src/io/table-file.js';

const CASES = Number(process.env.LEXICHRON_FUZZ_CASES ?? 20);
/** Time allowed per test: generous, growing with the case count (a slow shared machine runs an mbox case in about 25 ms). */
const TIMEOUT = Math.max(60_000, CASES * 150);
const tmp = tempFolder('lexichron-fuzz-');
const zones = buildZoneTable([], 'zones', 'Europe/Brussels');

function describeCase(c: FuzzCase): string {
  return `seed ${c.seed} (${c.fault})`;
}

/** Imports one case and checks the three properties; returns what happened, for the tally. */
async function importCase(format: ImportSourceSpec['format'], c: FuzzCase, extra: Partial<ImportSourceSpec>): Promise<'imported' | 'refused'> {
  const name = `${format}-${c.seed}`;
  const path = tmp.write(`${name}.in`, c.bytes);
  const out = tmp.path(`${name}.jsonl`);
  const source: ImportSourceSpec = { format, path, person: 'P01', zone: 'Europe/Brussels', ...extra };
  let result;
  try {
    result = await runImport({ source, steps: {}, out, redactMessages: (t) => t });
  } catch (error) {
    // a whole file refused (no separator, undecidable date order, no sender field): exit 2 or 3, never an internal error
    expect(error, describeCase(c)).toBeInstanceOf(LexichronError);
    expect((error as Error).message, describeCase(c)).not.toMatch(/secret/i);
    return 'refused';
  }
  const entries = readFileSync(result.entriesPath, 'utf8');
  const rejects = readFileSync(result.rejectsPath, 'utf8');
  const r = result.reconciliation;
  const rejected = Object.values(r.rejected).reduce((a, b) => a + b, 0);
  const dropped = Object.values(r.dropped).reduce((a, b) => a + b, 0);
  expect(entries, describeCase(c)).not.toMatch(/tpsecret/);
  expect(rejects, describeCase(c)).not.toMatch(/secret/i);
  expect(r.read, describeCase(c)).toBe(r.kept + rejected + dropped);
  expect(entries.split('\n').filter((l) => l !== '').length, describeCase(c)).toBe(r.kept);
  expect(Papa.parse(rejects, { delimiter: ',', skipEmptyLines: true }).data.length - 1, describeCase(c)).toBe(rejected);
  const meta = JSON.parse(readFileSync(result.metaPath, 'utf8')) as { reconciliation: typeof r };
  expect(meta.reconciliation).toEqual(r);
  return 'imported';
}

const seeds = Array.from({ length: CASES }, (_, k) => 1800 + k);

describe(`privacy fuzz: ${CASES} damaged exports per importer`, () => {
  it('chat-lines: other senders\' text is never kept; counts reconcile; no text in rejects', async () => {
    for (const seed of seeds) await importCase('chat-lines', chatLinesCase(seed), { senders: ['Ann Lee'], dateOrder: 'dmy' });
  }, TIMEOUT);
  it('chat-lines with the date order settled from the damaged file itself', async () => {
    for (const seed of seeds.slice(0, Math.ceil(CASES / 3))) await importCase('chat-lines', chatLinesCase(seed + 50_000), { senders: ['Ann Lee'] });
  }, TIMEOUT);
  it('mbox: other senders\' text is never kept; counts reconcile; no text in rejects', async () => {
    for (const seed of seeds) await importCase('mbox', mboxCase(seed), { addresses: ['ann@example.org'] });
  }, TIMEOUT);
  it('chat-table (CSV and JSON Lines): other senders\' text is never kept; counts reconcile; no text in rejects', async () => {
    for (const seed of seeds) {
      await importCase('chat-table', chatTableCase(seed, 'csv'), { senders: ['Ann'] });
    }
    for (const seed of seeds) {
      const c = chatTableCase(seed, 'jsonl');
      const path = tmp.write(`table-${seed}.jsonl`, c.bytes);
      // the chat-table importer takes its format from the extension
      await importCase('chat-table', c, { senders: ['Ann'], path });
    }
  }, TIMEOUT);
  it('diary: counts reconcile; no text in rejects', async () => {
    for (const seed of seeds) await importCase('diary', diaryCase(seed), {});
  }, TIMEOUT);
});

describe(`privacy fuzz: ${CASES} damaged tables per entries reader`, () => {
  for (const format of ['csv', 'jsonl'] as const) {
    it(`readEntries (${format}): every row is an entry or a reject with a reason, and no reject holds text`, async () => {
      for (const seed of seeds) {
        const c = entriesCase(seed, format);
        const path = tmp.write(`entries-${seed}.${format}`, c.bytes);
        let items;
        try {
          items = await collect(readEntries(tableFile(path), { zones }));
        } catch (error) {
          expect(error, describeCase(c)).toBeInstanceOf(LexichronError);
          expect((error as Error).message, describeCase(c)).not.toMatch(/secret/i);
          continue;
        }
        const rejects = items.filter((i) => i.kind === 'reject');
        expect(JSON.stringify(rejects), describeCase(c)).not.toMatch(/secret/i);
        if (format === 'jsonl') {
          // JSON Lines: one item per non-blank line (LF, CR and CRLF end lines, as node:readline reads them)
          const text = c.bytes.toString('utf8').replace(/^\uFEFF/, '');
          expect(items.length, describeCase(c)).toBe(text.split(/\r\n|\r|\n/).filter((l) => l.trim() !== '').length);
        }
      }
    }, TIMEOUT);
  }
});

describe(`privacy fuzz: ${CASES} damaged self-report and series tables`, () => {
  it('self-reports (readRecords, ratingValues): a text in a rating column is described, never repeated', async () => {
    for (const seed of seeds) {
      const c = numericTableCase(seed, 'ratings');
      const path = tmp.write(`ratings-${seed}.csv`, c.bytes);
      try {
        for await (const item of readRecords(tableFile(path))) {
          if (item.kind === 'reject') expect(item.diagnostic.message, describeCase(c)).not.toMatch(/secret/i);
          if (item.kind !== 'record') continue;
          const { diagnostics } = ratingValues(item.record, ['mood', 'stress'], new Map(), item.source);
          expect(JSON.stringify(diagnostics), describeCase(c)).not.toMatch(/secret/i);
        }
      } catch (error) {
        expect(error, describeCase(c)).toBeInstanceOf(LexichronError);
        expect((error as Error).message, describeCase(c)).not.toMatch(/secret/i);
      }
    }
  }, TIMEOUT);
  it('long series (parseSeriesCsv): a bad bin index or value is described, never repeated', () => {
    for (const seed of seeds) {
      const c = numericTableCase(seed, 'series');
      try {
        expect(JSON.stringify(parseSeriesCsv(c.bytes.toString('utf8')).diagnostics), describeCase(c)).not.toMatch(/secret/i);
      } catch (error) {
        expect(error, describeCase(c)).toBeInstanceOf(LexichronError);
        expect((error as Error).message, describeCase(c)).not.toMatch(/secret/i);
      }
    }
  }, TIMEOUT);
});
