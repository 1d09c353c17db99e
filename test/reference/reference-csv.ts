import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const here = path.dirname(fileURLToPath(import.meta.url));

/** Reads a committed reference CSV under test/reference/ (no quoted fields) as objects keyed by header. */
export function readReferenceCsv(relative: string): Record<string, string>[] {
  const lines = readFileSync(path.join(here, relative), 'utf8').trim().split(/\r?\n/);
  const header = (lines[0] as string).split(',');
  return lines.slice(1).map((line) => {
    const fields = line.split(',');
    return Object.fromEntries(header.map((h, i) => [h, fields[i] ?? '']));
  });
}
