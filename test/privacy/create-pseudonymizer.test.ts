import { describe, expect, it } from 'vitest';
import { createPseudonymizer } from '../../src/privacy/create-pseudonymizer.js';

const key = new TextEncoder().encode('a key of at least sixteen bytes');

describe('createPseudonymizer', () => {
  it('derives person pseudonyms, entry ids and the key check as keyed HMAC-SHA256 digests over separate inputs (RFC 2104)', () => {
    // Expected values from Python's hmac module, an independent implementation:
    // python3 -c "import hmac,hashlib; k=b'a key of at least sixteen bytes'; print(hmac.new(k, b'entry\x00chat.txt:1', hashlib.sha256).hexdigest())"
    const p = createPseudonymizer(key);
    expect(p.person('P01')).toBe('pa7f545ee62340954');
    expect(p.entryId('chat.txt:1')).toBe('e780e94c0dd8413f4');
    expect(p.keyCheck).toBe('k532e93e9');
  });

  it('never gives an entry id the form of a person pseudonym, and another key gives another key check', () => {
    const p = createPseudonymizer(key);
    const other = createPseudonymizer(new TextEncoder().encode('another key of sixteen bytes or more'));
    expect(p.entryId('P01')).toMatch(/^e[0-9a-f]{16}$/);
    expect(p.entryId('P01')).not.toBe(p.person('P01'));
    expect(other.keyCheck).not.toBe(p.keyCheck);
    expect(other.person('P01')).not.toBe(p.person('P01'));
  });
});
