import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

/** The shared reference folder `../shared/reference/` beside the repository. */
export const sharedReferenceDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../../../shared/reference');

/**
 * Reads a CSV from the shared reference folder as rows of strings (no quoted commas in these
 * files; surrounding double quotes are stripped). Returns `undefined` when the file is missing
 * outside CI; throws in CI (CI=true) so a missing reference fails loudly.
 */
export function readSharedReferenceCsv(name: string): { header: string[]; rows: string[][] } | undefined {
  const file = path.join(sharedReferenceDir, name);
  if (!existsSync(file)) {
    if (process.env.CI === 'true') throw new Error(`Reference file ${file} is missing; see ../shared/reference/SOURCES.md`);
    return undefined;
  }
  const lines = readFileSync(file, 'utf8').trim().split(/\r?\n/);
  const split = (line: string): string[] => line.split(',').map((f) => f.replace(/^"|"$/g, ''));
  return { header: split(lines[0] as string), rows: lines.slice(1).map(split) };
}
