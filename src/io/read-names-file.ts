import { readFile } from 'node:fs/promises';
import { usageError } from '../errors.js';

/** Reads a names file for redaction: one name per line, `#` starts a comment line. */
export async function readNamesFile(path: string | undefined): Promise<string[]> {
  if (path === undefined) return [];
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (error) {
    throw usageError(`Cannot read the names file \`${path}\`: ${(error as Error).message}; pass a text file with one name per line to --redact-names.`);
  }
  return text.split(/\r?\n/).map((l) => l.trim()).filter((l) => l !== '' && !l.startsWith('#'));
}
