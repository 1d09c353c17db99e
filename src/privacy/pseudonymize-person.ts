import { createHmac } from 'node:crypto';
import { usageError } from '../errors.js';

/** Shortest accepted key, in bytes (128 bits, the security level the HMAC construction needs against guessing). */
export const MIN_PSEUDONYM_KEY_BYTES = 16;

/**
 * The pseudonym of a person id: `p` followed by the first 16 hex digits (64 bits) of
 * HMAC-SHA256(key, id) (RFC 2104 HMAC with SHA-256, FIPS 180-4), computed over the UTF-8 bytes of the
 * id after trimming. The same key and id always give the same pseudonym, so files pseudonymized
 * separately still join; without the key the id cannot be recovered or confirmed by guessing ids,
 * which a plain unkeyed hash would allow. 64 bits make a collision among 100,000 people about 3 × 10⁻¹⁰ likely.
 *
 * The key is never written to any output; keep it apart from the data (it links pseudonyms back to ids).
 */
export function pseudonymizePerson(person: string, key: Uint8Array): string {
  if (key.length < MIN_PSEUDONYM_KEY_BYTES) {
    throw usageError(`Cannot pseudonymize with a key of ${key.length} bytes; use at least ${MIN_PSEUDONYM_KEY_BYTES} random bytes (e.g. 32 characters from a password generator).`);
  }
  return `p${createHmac('sha256', key).update(person.trim(), 'utf8').digest('hex').slice(0, 16)}`;
}
