import { createReadStream } from 'node:fs';
import Papa from 'papaparse';

/**
 * The records of a CSV file written by lexichron (RFC 4180, `\n` line ends) as their exact text,
 * without the line end: papaparse finds where each record ends (a line break inside a quoted
 * field stays inside its record). Streamed; for copying records byte for byte.
 */
export async function* readCsvRecords(path: string): AsyncGenerator<string> {
  const stream = createReadStream(path, { encoding: 'utf8', highWaterMark: 1 << 20 });
  let pending = '';
  for await (const chunk of stream as AsyncIterable<string>) {
    const { records, rest } = completeRecords(pending + chunk, false);
    pending = rest;
    yield* records;
  }
  yield* completeRecords(pending, true).records;
}

/**
 * The whole records at the start of `text` (all of it when `final`: a last record without a line
 * end, or an unclosed quoted field read to the end), and the text after them.
 */
function completeRecords(text: string, final: boolean): { records: string[]; rest: string } {
  const records: string[] = [];
  let done = 0;
  let stopped = false;
  Papa.parse<string[]>(text, {
    delimiter: ',',
    newline: '\n',
    step(result) {
      if (stopped) return;
      const cursor = result.meta.cursor;
      const raw = text.slice(done, cursor);
      if (raw === '') return;
      const ended = raw.endsWith('\n') && !result.errors.some((e) => e.code === 'MissingQuotes');
      if (!ended && !final) {
        stopped = true;
        return;
      }
      done = cursor;
      records.push(ended ? raw.slice(0, -1) : raw);
    },
  });
  return { records, rest: text.slice(done) };
}
