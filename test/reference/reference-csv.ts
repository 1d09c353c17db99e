import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { readCsv } from '../support/csv.js';

const here = path.dirname(fileURLToPath(import.meta.url));

/** Reads a committed reference CSV under test/reference/ as objects keyed by header (papaparse, see test/support/csv.ts). */
export function readReferenceCsv(relative: string): Record<string, string>[] {
  return readCsv(path.join(here, relative));
}
