import { readFile } from 'node:fs/promises';
import { dirname, join, relative, resolve, sep } from 'node:path';
import Papa from 'papaparse';
import type { TableFile } from '../ingest/read-records.js';
import { csvRow } from '../report/csv.js';
import { lexichronColumnNames } from '../report/lexichron-column-names.js';
import { tableFile } from './table-file.js';

/** How many folders up from a file its output folder's datapackage.json is looked for (out/validation/x.csv → out/). */
const PACKAGE_LEVELS = 2;

/** The parsed datapackage.json of the folder that describes `path`, and the file's path relative to it; undefined when none does. */
async function describingPackage(path: string): Promise<{ pkg: unknown; file: string } | undefined> {
  let dir = dirname(resolve(path));
  for (let level = 0; level <= PACKAGE_LEVELS; level++) {
    let pkg: unknown;
    try {
      pkg = JSON.parse(await readFile(join(dir, 'datapackage.json'), 'utf8'));
    } catch {
      pkg = undefined; // no package here (or not readable as JSON): look one folder up
    }
    const file = relative(dir, resolve(path)).split(sep).join('/');
    const resources = (pkg as { resources?: unknown } | undefined)?.resources;
    if (Array.isArray(resources) && resources.some((r) => typeof (r as { path?: unknown })?.path === 'string' && (r as { path: string }).path.replace(/^\.\//, '') === file)) return { pkg, file };
    const up = dirname(dir);
    if (up === dir) break;
    dir = up;
  }
  return undefined;
}

/** `bytes` with its first line replaced by `header(old names)`; unchanged when the names are. */
function withHeader(bytes: Buffer, header: (names: string[]) => string[]): { bytes: Buffer; changed: boolean } {
  const end = bytes.indexOf(0x0a);
  const lineEnd = end < 0 ? bytes.length : end;
  const line = bytes.subarray(0, lineEnd).toString('utf8').replace(/\r$/, '');
  const old = Papa.parse<string[]>(line, { header: false }).data[0] ?? [];
  const fresh = header(old);
  if (fresh.every((n, k) => n === old[k])) return { bytes, changed: false };
  const cr = bytes[lineEnd - 1] === 0x0d ? '\r' : '';
  return { bytes: Buffer.concat([Buffer.from(csvRow(fresh) + cr, 'utf8'), bytes.subarray(lineEnd)]), changed: true };
}

/**
 * One of lexichron's own CSV outputs (scores, long series, events, aligned pairs, …) as a table
 * file whose header holds the names lexichron writes by default, whatever names the folder was
 * written with: when the output folder's datapackage.json (beside the file or up to two folders
 * up) records that the columns were renamed (`--names syntactic`), the header line is read back
 * through lexichronColumnNames (`afinn_165_valence` → `afinn-165.valence`); the rows are passed on
 * byte for byte. Without such a record it is the plain tableFile. Every command that reads
 * lexichron's own outputs opens them through this function.
 */
export async function ownTableFile(path: string): Promise<TableFile> {
  const plain = tableFile(path);
  const described = await describingPackage(path);
  if (!described) return plain;
  const header = (names: string[]): string[] => lexichronColumnNames(described.pkg, described.file, names);
  return {
    path,
    check: plain.check,
    bytes: async () => withHeader(await plain.bytes(), header).bytes,
    chunks: async function* () {
      let head: Buffer | undefined = Buffer.alloc(0);
      for await (const chunk of plain.chunks()) {
        if (head === undefined) {
          yield chunk;
          continue;
        }
        head = Buffer.concat([head, chunk]);
        if (head.indexOf(0x0a) < 0) continue;
        yield withHeader(head, header).bytes;
        head = undefined;
      }
      if (head !== undefined && head.length > 0) yield withHeader(head, header).bytes;
    },
  };
}
