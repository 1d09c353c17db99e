import { readFile } from 'node:fs/promises';
import { usageError } from '../errors.js';
import { MIN_PSEUDONYM_KEY_BYTES } from '../privacy/pseudonymize-person.js';

/** Name of the environment variable that may hold the pseudonymization key. */
export const PSEUDONYM_KEY_ENV = 'LEXICHRON_PSEUDONYM_KEY';

/**
 * Reads the pseudonymization key: from `file` when given (its content, surrounding white space
 * removed), else from `envValue` (the value of LEXICHRON_PSEUDONYM_KEY, passed in by the caller).
 * Returns undefined when neither is set. The key is only held in memory, never written out.
 */
export async function readPseudonymKey(file: string | undefined, envValue: string | undefined): Promise<Uint8Array | undefined> {
  let text: string | undefined;
  let origin: string;
  if (file !== undefined) {
    origin = `the key file \`${file}\``;
    try {
      text = await readFile(file, 'utf8');
    } catch (error) {
      throw usageError(`Cannot read ${origin}: ${(error as Error).message}; check --pseudonym-key-file.`);
    }
  } else {
    origin = `the environment variable ${PSEUDONYM_KEY_ENV}`;
    text = envValue;
  }
  if (text === undefined || (file === undefined && text.trim() === '')) return undefined;
  const key = Buffer.from(text.trim(), 'utf8');
  if (key.length < MIN_PSEUDONYM_KEY_BYTES) {
    throw usageError(`Cannot use ${origin} as a pseudonymization key: it holds ${key.length} bytes; use at least ${MIN_PSEUDONYM_KEY_BYTES} random characters (32 or more is better).`);
  }
  return new Uint8Array(key);
}
