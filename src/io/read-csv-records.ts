import { createReadStream } from 'node:fs';

/**
 * The records of a CSV file written by lexichron (RFC 4180, `\n` line ends) as their exact text,
 * without the line end: a line break inside a quoted field stays inside its record (a record
 * ends at a `\n` after an even number of `"`). Streamed; for copying records byte for byte.
 */
export async function* readCsvRecords(path: string): AsyncGenerator<string> {
  const stream = createReadStream(path, { encoding: 'utf8', highWaterMark: 1 << 20 });
  let rest = '';
  let pending = '';
  let quotes = 0;
  for await (const chunk of stream as AsyncIterable<string>) {
    const text = rest + chunk;
    let start = 0;
    for (let nl = text.indexOf('\n'); nl >= 0; nl = text.indexOf('\n', start)) {
      const line = text.slice(start, nl);
      start = nl + 1;
      for (let i = line.indexOf('"'); i >= 0; i = line.indexOf('"', i + 1)) quotes++;
      if (quotes % 2 === 1) {
        pending += `${line}\n`;
        continue;
      }
      yield pending + line;
      pending = '';
      quotes = 0;
    }
    rest = text.slice(start);
  }
  if (rest !== '' || pending !== '') yield pending + rest;
}
