import { describe, expect, it } from 'vitest';
import { pseudonymizePerson } from '../../src/privacy/pseudonymize-person.js';
import { keptText } from '../../src/privacy/kept-text.js';

describe('pseudonymizePerson', () => {
  it('is the first 64 bits of HMAC-SHA256 as in RFC 4231 test case 1 (key 0x0b × 20, data "Hi There")', () => {
    // RFC 4231 section 4.2: HMAC-SHA-256 = b0344c61d8db38535ca8afceaf0bf12b881dc200c9833da726e9376c2e32cff7
    expect(pseudonymizePerson('Hi There', new Uint8Array(20).fill(0x0b))).toBe('pb0344c61d8db3853');
  });
  it('gives the same pseudonym for the same key and id, and another for another key', () => {
    const key = new TextEncoder().encode('a key of at least sixteen bytes');
    const other = new TextEncoder().encode('another key of sixteen bytes or more');
    expect(pseudonymizePerson('P01', key)).toBe(pseudonymizePerson(' P01 ', key));
    expect(pseudonymizePerson('P01', key)).not.toBe(pseudonymizePerson('P01', other));
    expect(pseudonymizePerson('P01', key)).toMatch(/^p[0-9a-f]{16}$/);
  });
  it('refuses a key shorter than 16 bytes', () => {
    expect(() => pseudonymizePerson('P01', new TextEncoder().encode('Jefe'))).toThrow(/at least 16 random bytes/);
  });
});

describe('keptText', () => {
  it('keeps no text at all under the aggregates-only policy and redacted text otherwise', () => {
    const redact = (t: string) => t.replace('Ann', '[name]');
    expect(keptText('Ann was here', { aggregatesOnly: true, redact })).toBeUndefined();
    expect(keptText('Ann was here', { aggregatesOnly: false, redact })).toBe('[name] was here');
  });
});
