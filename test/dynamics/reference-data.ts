import { readSharedReferenceRecords, sharedReferenceDir } from '../reference/shared/read-shared-reference.js';

/** Folder of the shared reference data (../shared/reference from the repository root). */
export const referenceDir = sharedReferenceDir;

/**
 * Reads a CSV of the shared reference data into rows of strings keyed by header. Throws (so the
 * test file fails, naming the path it tried) when the file is missing; returns undefined only
 * when LEXICHRON_SKIP_SHARED_REFERENCE=1 skips the checks (see test/reference/shared/read-shared-reference.ts).
 */
export function readReferenceCsv(name: string): Record<string, string>[] | undefined {
  return readSharedReferenceRecords(name);
}

/** A full lagValid array for a gap-free series of `n` bins. */
export function allValid(n: number): boolean[] {
  return Array.from({ length: n }, (_, t) => t > 0);
}
