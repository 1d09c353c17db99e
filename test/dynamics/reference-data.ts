import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const here = path.dirname(fileURLToPath(import.meta.url));

/** Folder of the shared reference data (../shared/reference from the repository root). */
export const referenceDir = path.resolve(here, '../../../shared/reference');

/**
 * Reads a CSV of the shared reference data into rows of strings keyed by header. Returns
 * undefined when the file is missing outside CI, and throws (so the test fails loudly) in CI.
 */
export function readReferenceCsv(name: string): Record<string, string>[] | undefined {
  const file = path.join(referenceDir, name);
  if (!existsSync(file)) {
    if (process.env.CI === 'true') throw new Error(`Reference file ${file} is missing; CI needs ../shared/reference (see SOURCES.md).`);
    return undefined;
  }
  return parseCsv(readFileSync(file, 'utf8'));
}

/** Minimal CSV reader for the plain numeric reference files (no quoting). */
export function parseCsv(text: string): Record<string, string>[] {
  const lines = text.split(/\r?\n/).filter((line) => line.length > 0);
  const header = (lines[0] ?? '').split(',');
  return lines.slice(1).map((line) => {
    const cells = line.split(',');
    return Object.fromEntries(header.map((h, i) => [h, cells[i] ?? '']));
  });
}

/** A full lagValid array for a gap-free series of `n` bins. */
export function allValid(n: number): boolean[] {
  return Array.from({ length: n }, (_, t) => t > 0);
}
