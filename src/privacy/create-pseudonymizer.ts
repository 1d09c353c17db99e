import { createHmac } from 'node:crypto';
import { pseudonymizePerson } from './pseudonymize-person.js';

/** Everything a keyed run writes instead of identifying values. */
export interface Pseudonymizer {
  /** The pseudonym of a raw person id (pseudonymizePerson; computed once per id). */
  person(id: string): string;
  /** A keyed entry id: `e` and 16 hex digits of HMAC-SHA256 over `entry`, NUL and the raw id (never equal to a person's pseudonym). */
  entryId(id: string): string;
  /**
   * The key's check value: `k` and 8 hex digits of HMAC-SHA256(key, "lexichron key check"). Written
   * beside entries pseudonymized at import (`pseudonym_key`), so that a later `score` or `run` leaves
   * them as they are with the same key and tells another key apart; it reveals nothing of the key.
   */
  keyCheck: string;
}

/**
 * Creates the pseudonymizer of a key (RFC 2104 HMAC with SHA-256). Person pseudonyms, entry ids and
 * the key check are keyed digests over separate inputs, so none can be mistaken for another.
 */
export function createPseudonymizer(key: Uint8Array): Pseudonymizer {
  const persons = new Map<string, string>();
  const keyCheck = `k${createHmac('sha256', key).update('lexichron key check', 'utf8').digest('hex').slice(0, 8)}`;
  return {
    person(id) {
      let p = persons.get(id);
      if (p === undefined) persons.set(id, (p = pseudonymizePerson(id, key)));
      return p;
    },
    entryId: (id) => `e${createHmac('sha256', key).update(`entry\u0000${id}`, 'utf8').digest('hex').slice(0, 16)}`,
    keyCheck,
  };
}
