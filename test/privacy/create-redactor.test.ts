import { describe, expect, it } from 'vitest';
import { createRedactor } from '../../src/privacy/create-redactor.js';

const redact = createRedactor({ names: ['Ann Lee', 'Bob', 'Zoë'] });

describe('createRedactor replaces phone numbers in ITU-T E.164 and common national formats', () => {
  const phones: Array<[string, string]> = [
    ['E.164 compact, United States', '+12025550143'],
    ['E.164 grouped, United Kingdom', '+44 20 7946 0958'],
    ['E.164 grouped, France', '+33 6 12 34 56 78'],
    ['E.164 with a parenthesised trunk zero, Germany', '+49 (0)30 12345678'],
    ['E.164 with hyphens, Japan', '+81-3-1234-5678'],
    ['E.164 with dots, Belgium', '+32.2.123.45.67'],
    ['E.164 at its 15-digit maximum', '+881 2345 6789 0123'],
    ['international prefix 00 instead of +', '0049 30 1234567'],
    ['North American (NANP) with parentheses', '(202) 555-0143'],
    ['North American with hyphens and country code', '1-202-555-0143'],
    ['North American with dots', '202.555.0143'],
    ['United Kingdom national', '020 7946 0958'],
    ['France national in pairs', '06 12 34 56 78'],
    ['Netherlands national with a hyphen', '06-12345678'],
    ['Germany national with a slash', '030/1234567'],
    ['Australia mobile', '0412 345 678'],
  ];
  for (const [what, phone] of phones) {
    it(`replaces ${what}: ${phone}`, () => {
      expect(redact(`Call me on ${phone}, thanks.`)).toBe('Call me on [phone], thanks.');
    });
  }
  it('finds a phone number after an unrelated number ("room 12 020 7946 0958")', () => {
    expect(redact('room 12 020 7946 0958')).toBe('room 12 [phone]');
  });
  const notPhones = [
    'We met on 01.02.2021 at 10:30.',
    'Since 2019-12-31 nothing changed.',
    'It cost 1.234.567 in total.',
    'In 2019 and 2020 I ran 5000 km.',
    'Order 123456 arrived.',
    'A 16-digit run +1234567890123456 exceeds the E.164 maximum of 15 digits.',
  ];
  for (const text of notPhones) {
    it(`leaves non-phone numbers alone: ${JSON.stringify(text)}`, () => expect(redact(text)).toBe(text));
  }
});

describe('createRedactor replaces e-mail addresses in the forms of RFC 5322 section 3.4', () => {
  const emails: Array<[string, string, string]> = [
    ['a dot-atom local part', 'write to john.q.public@example.com today', 'write to [email] today'],
    ['atext specials in the local part (section 3.2.3)', "mail a!#$%&'*+/=?^_`{|}~-b@example.org now", 'mail [email] now'],
    ['a quoted local part with a space (section 3.4.1)', 'to "john q"@example.com please', 'to [email] please'],
    ['a quoted local part with an escaped quote', 'to "a\\"b"@example.com please', 'to [email] please'],
    ['a quoted display name with an angle address (section 3.4, Appendix A.1.2)', 'from "Joe Q. Public" <john.q.public@example.com> yesterday', 'from [email] yesterday'],
    ['an angle address after an unquoted display name (the name is left to the names list)', 'from Mary Smith <mary@x.test>', 'from Mary Smith [email]'],
    ['a domain literal (section 3.4.1)', 'at jdoe@[192.0.2.1] now', 'at [email] now'],
    ['an obsolete route (section 4.4, Appendix A.6.1)', 'to <@node.test:mary@example.net>', 'to [email]'],
    ['an internationalised address (RFC 6531)', 'écris à zoë.müller@exemple.fr', 'écris à [email]'],
    ['an address ending a sentence', 'It is ann@example.org.', 'It is [email].'],
  ];
  for (const [what, text, expected] of emails) {
    it(`replaces ${what}`, () => expect(redact(text)).toBe(expected));
  }
});

describe('createRedactor replaces URLs, handles and names', () => {
  it('replaces URLs with and without a scheme and keeps sentence punctuation', () => {
    expect(redact('See https://example.org/a?b=c#d, or www.example.com/x.')).toBe('See [url], or [url].');
  });
  it('replaces @handles but not the @ of an address or a lone @', () => {
    expect(redact('thanks @ann_lee and @Bob.Smith! meet @ 5')).toBe('thanks [handle] and [handle]! meet @ 5');
  });
  it('replaces listed names as whole words ignoring case, longest first, and not inside other words', () => {
    expect(redact('ann lee met BOB, Bobby and Zoë.')).toBe('[name] met [name], Bobby and [name].');
  });
  it('can switch kinds off', () => {
    expect(createRedactor({ urls: false, emails: false })('x@y.org https://a.b')).toBe('x@y.org https://a.b');
  });
});

describe('createRedactor replaces every listed name whole, however it is typed', () => {
  it('replaces "Jan de Vries" whole when "Jan" is on the same list, in either order, and never leaves "de Vries" behind', () => {
    for (const names of [['Jan', 'Jan de Vries'], ['Jan de Vries', 'Jan']]) {
      expect(createRedactor({ names })('Jan de Vries and Jan came; later jan de vries left.')).toBe('[name] and [name] came; later [name] left.');
    }
  });
  it('matches a name across runs of white space and line breaks', () => {
    expect(createRedactor({ names: ['Jan de Vries'] })('met Jan  de\nVries and Jan\u00a0de\tVries')).toBe('met [name] and [name]');
  });
  it('matches curly and straight apostrophes alike (U+2019 RIGHT SINGLE QUOTATION MARK, U+02BC MODIFIER LETTER APOSTROPHE)', () => {
    expect(createRedactor({ names: ["O'Brien"] })('O\u2019Brien, O\u02bcBrien and O\'Brien')).toBe('[name], [name] and [name]');
    expect(createRedactor({ names: ['O\u2019Brien'] })("O'Brien")).toBe('[name]');
  });
  it('matches with or without accents, precomposed or decomposed (Unicode NFD)', () => {
    expect(createRedactor({ names: ['Zoë', 'Jose'] })('Zoe, ZOË, Zoe\u0308 and José')).toBe('[name], [name], [name] and [name]');
  });
  it('still leaves a name inside a longer word alone', () => {
    expect(createRedactor({ names: ['Jan'] })('January with Jane')).toBe('January with Jane');
  });
});

describe('createRedactor takes time linear in the text\'s length', () => {
  // Each input made the former backtracking patterns take quadratic time (a 100,000-character token: 45 s).
  // Speed itself is measured by `npm run bench` (scripts/bench-redact.mjs); this only bounds it generously.
  const size = 1_000_000;
  const pathological: Array<[string, string]> = [
    ['one long word', 'a'.repeat(size)],
    ['dotted atoms with no @', 'a.'.repeat(size / 2)],
    ['a domain of a million labels', `x@${'a.'.repeat(size / 2)}`],
    ['hyphens', 'a-'.repeat(size / 2)],
    ['digits and spaces', '1 '.repeat(size / 2)],
    ['plus signs and digits', '+1'.repeat(size / 2)],
    ['digits and dots', '1.'.repeat(size / 2)],
    ['address specials', '!#'.repeat(size / 2)],
    ['@ signs', 'a@'.repeat(size / 2)],
  ];
  it('redacts each of 9 pathological 1 MB texts in under 10 s (a generous bound; the bench shows well under a second)', () => {
    const redact = createRedactor({ names: ['Jan de Vries', 'Ann'] });
    for (const [what, text] of pathological) {
      const started = performance.now();
      redact(text);
      expect(performance.now() - started, what).toBeLessThan(10_000);
    }
  }, 120_000);
  it('still finds addresses, phones and names at the end of a long text', () => {
    const redact = createRedactor({ names: ['Ann Lee'] });
    const text = `${'word '.repeat(20000)}mail ann@example.org or call +44 20 7946 0958, Ann  Lee.`;
    expect(redact(text)).toMatch(/ word mail \[email\] or call \[phone\], \[name\]\.$/);
  });
});
