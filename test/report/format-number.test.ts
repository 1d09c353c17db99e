import { describe, expect, it } from 'vitest';
import { formatNumber, integerText } from '../../src/report/format-number.js';

describe('integerText', () => {
  it("equals JavaScript's own String() on integers inside and at the edges of its table (reference: ECMAScript Number::toString)", () => {
    for (let v = -1100; v <= 1100; v++) expect(integerText(v)).toBe(String(v));
    for (const v of [-1025, -1024, 1023, 1024, 123456789, -987654321]) expect(integerText(v)).toBe(String(v));
    expect(integerText(-0)).toBe('0');
  });
});

describe('formatNumber', () => {
  it('prints integers as String() does, fractions to 10 significant digits without trailing zeros, and nothing for missing values', () => {
    expect([0, -0, 7, -3, 1023, 1024, -1024, -1025, 2 ** 40].map((v) => formatNumber(v))).toEqual(['0', '0', '7', '-3', '1023', '1024', '-1024', '-1025', '1099511627776']);
    // 0.1 + 0.2 is 0.30000000000000004 in binary64 (IEEE 754); to 10 significant digits 0.3.
    expect(formatNumber(0.1 + 0.2)).toBe('0.3');
    expect(formatNumber(2 / 3)).toBe('0.6666666667');
    expect([NaN, Infinity, undefined, null].map((v) => formatNumber(v))).toEqual(['', '', '', '']);
  });
});
