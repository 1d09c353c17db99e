import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseCsvRows } from '../../support/csv.js';

/** Environment variable that points the reference checks at another copy of the shared folder. */
export const SHARED_REFERENCE_DIR_VARIABLE = 'LEXICHRON_SHARED_REFERENCE';
/** Environment variable that, set to 1, skips the checks whose shared file is missing (never set in CI). */
export const SKIP_SHARED_REFERENCE_VARIABLE = 'LEXICHRON_SKIP_SHARED_REFERENCE';

const repositoryRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');

/**
 * The shared reference folder: `../shared/reference/` beside the repository, or the folder named
 * by LEXICHRON_SHARED_REFERENCE (e.g. when the repository is checked out elsewhere).
 */
export const sharedReferenceDir = path.resolve(repositoryRoot, process.env[SHARED_REFERENCE_DIR_VARIABLE] || '../shared/reference');

let noticePrinted = false;

/**
 * Path of a file in the shared reference folder. When the file is missing it throws, naming the
 * path it tried and how to fix it, so the test file fails; only with
 * LEXICHRON_SKIP_SHARED_REFERENCE=1 does it print a notice and return `undefined` (the caller then
 * skips its checks).
 */
export function sharedReferencePath(name: string): string | undefined {
  const file = path.join(sharedReferenceDir, name);
  if (existsSync(file)) return file;
  if (process.env[SKIP_SHARED_REFERENCE_VARIABLE] === '1') {
    if (!noticePrinted) {
      process.stderr.write(`NOTICE: ${SKIP_SHARED_REFERENCE_VARIABLE}=1: skipping the reference checks that need ${file} (missing). CI never sets this.\n`);
      noticePrinted = true;
    }
    return undefined;
  }
  throw new Error(
    `Cannot run the reference checks: ${file} is missing. Put the shared reference folder at ${sharedReferenceDir} ` +
      `(../shared/reference beside the repository; see its SOURCES.md), or set ${SHARED_REFERENCE_DIR_VARIABLE}=/path/to/shared/reference; ` +
      `${SKIP_SHARED_REFERENCE_VARIABLE}=1 skips these checks on a machine without it.`,
  );
}

/**
 * Reads a CSV of the shared reference folder as its header and rows of strings (papaparse, so
 * quoted headers such as "Subject" come out bare). Fails the test file when the file is missing
 * (see {@link sharedReferencePath}); `undefined` only when the checks were skipped on purpose.
 */
export function readSharedReferenceCsv(name: string): { header: string[]; rows: string[][] } | undefined {
  const file = sharedReferencePath(name);
  if (file === undefined) return undefined;
  const [header = [], ...rows] = parseCsvRows(readFileSync(file, 'utf8'));
  return { header, rows };
}

/** Reads a CSV of the shared reference folder into objects keyed by its header (see {@link readSharedReferenceCsv}). */
export function readSharedReferenceRecords(name: string): Record<string, string>[] | undefined {
  const data = readSharedReferenceCsv(name);
  return data?.rows.map((cells) => Object.fromEntries(data.header.map((h, i) => [h, cells[i] ?? ''])));
}
