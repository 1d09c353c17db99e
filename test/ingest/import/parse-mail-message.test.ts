import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { simpleParser } from 'mailparser';
import { describe, expect, it } from 'vitest';
import { parseAddressList } from '../../../src/ingest/import/parse-address-list.js';
import { parseMailDate } from '../../../src/ingest/import/parse-mail-date.js';
import { parseMailMessage } from '../../../src/ingest/import/parse-mail-message.js';
import { mailHeader, readMailHeaders } from '../../../src/ingest/import/read-mail-headers.js';

const fixtures = join(__dirname, '../../fixtures/import/rfc5322');
const load = (name: string, crlf = false): Buffer => {
  const text = readFileSync(join(fixtures, name), 'utf8');
  return Buffer.from(crlf ? text.replace(/\n/g, '\r\n') : text, 'utf8');
};
const context = (addresses: string[]) => ({ file: 'box.mbox', line: 1, person: 'P01', zone: 'Europe/Brussels', addresses: new Set(addresses) });

// Expected senders and instants: RFC 5322 Appendix A, each Date header converted to UTC by hand.
// The display name and mailbox of one sender in A.1.3 and A.5 are replaced by an invented name (Quillon); structure, dates and offsets are as in the RFC.
const APPENDIX_A: Array<[string, string, string, string, number, string]> = [
  ['A.1.1 (simple addressing)', 'a1-1.eml', 'jdoe@machine.example', '1997-11-21T15:55:06.000Z', -360, 'This is a message just to say hello.\nSo, "Hello".'],
  ['A.1.2 (different types of mailboxes)', 'a1-2.eml', 'john.q.public@example.com', '2003-07-01T08:52:37.000Z', 120, 'Hi everyone.'],
  ['A.1.3 (group addresses)', 'a1-3.eml', 'quillon@silly.example', '1969-02-14T03:02:54.000Z', -210, 'Testing.'],
  ['A.2 first message (reply messages)', 'a2-1.eml', 'jdoe@machine.example', '1997-11-21T15:55:06.000Z', -360, 'This is a message just to say hello.\nSo, "Hello".'],
  ['A.2 second message (reply)', 'a2-2.eml', 'mary@example.net', '1997-11-21T16:01:10.000Z', -360, 'This is a reply to your hello.'],
  ['A.2 third message (reply to the reply)', 'a2-3.eml', 'jdoe@machine.example', '1997-11-21T17:00:00.000Z', -360, 'This is a reply to your reply.'],
  ['A.3 (resent messages: From and Date, not Resent-From and Resent-Date)', 'a3.eml', 'jdoe@machine.example', '1997-11-21T15:55:06.000Z', -360, 'This is a message just to say hello.\nSo, "Hello".'],
  ['A.4 (trace fields)', 'a4.eml', 'jdoe@node.example', '1997-11-21T15:55:06.000Z', -360, 'This is a message just to say hello.\nSo, "Hello".'],
  ['A.5 (white space, comments and other oddities)', 'a5.eml', 'quillon@silly.test', '1969-02-14T03:02:00.000Z', -210, 'Testing.'],
  ['A.6.1 (obsolete addressing)', 'a6-1.eml', 'john.q.public@example.com', '2003-07-01T08:52:37.000Z', 120, 'Hi everyone.'],
  ['A.6.2 (obsolete dates: two-digit year, GMT)', 'a6-2.eml', 'jdoe@machine.example', '1997-11-21T09:55:06.000Z', 0, 'This is a message just to say hello.\nSo, "Hello".'],
  ['A.6.3 (obsolete white space and comments)', 'a6-3.eml', 'jdoe@machine.example', '1997-11-21T15:55:06.000Z', -360, 'This is a message just to say hello.\nSo, "Hello".'],
];

describe('parseMailMessage reads the example messages of RFC 5322 Appendix A (transcribed in test/fixtures/import/rfc5322)', () => {
  for (const [section, file, sender, utc, offset, text] of APPENDIX_A) {
    for (const crlf of [false, true]) {
      it(`RFC 5322 Appendix ${section} parses to sender ${sender} at ${utc} with offset ${offset} min${crlf ? ' (CRLF line ends)' : ''}`, async () => {
        const item = await parseMailMessage(load(file, crlf), context([sender]));
        expect(item.kind).toBe('entry');
        if (item.kind !== 'entry') return;
        expect(new Date(item.entry.instant).toISOString()).toBe(utc);
        expect(item.entry.offsetMinutes).toBe(offset);
        expect(item.entry.text).toBe(text);
        expect(item.entry).toMatchObject({ id: 'box.mbox:1', person: 'P01', zone: 'Europe/Brussels' });
      });
    }
  }

  it('drops an RFC 5322 Appendix A.2 reply as third-party data when the participant is its recipient, not its sender', async () => {
    const item = await parseMailMessage(load('a2-2.eml'), context(['jdoe@machine.example']));
    expect(item).toEqual({ kind: 'drop', reason: 'third_party', source: { file: 'box.mbox', line: 1 } });
  });
});

describe('parseAddressList reads the address fields of RFC 5322 Appendix A', () => {
  const field = (file: string, name: string) => mailHeader(readMailHeaders(load(file)), name) as string;
  it('reads the To and Cc mailboxes of Appendix A.1.2, with the quoted display name unescaped', () => {
    expect(parseAddressList(field('a1-2.eml', 'to')).map((m) => m.address)).toEqual(['mary@x.test', 'jdoe@example.org', 'one@y.test']);
    expect(parseAddressList(field('a1-2.eml', 'cc'))).toEqual([
      { name: '', address: 'boss@nil.test' },
      { name: 'Giant; "Big" Box', address: 'sysservices@example.net' },
    ]);
  });
  it('reads the group members of Appendix A.1.3 and nothing from the empty group', () => {
    expect(parseAddressList(field('a1-3.eml', 'to')).map((m) => m.address)).toEqual(['c@a.test', 'joe@where.test', 'jdoe@one.test']);
    expect(parseAddressList(field('a1-3.eml', 'cc'))).toEqual([]);
  });
  it('reads Appendix A.5 with comments inside addresses and groups', () => {
    expect(parseAddressList(field('a5.eml', 'from'))).toEqual([{ name: 'Quillon', address: 'quillon@silly.test' }]);
    expect(parseAddressList(field('a5.eml', 'to')).map((m) => m.address)).toEqual(['c@public.example', 'joe@example.org', 'jdoe@one.test']);
    expect(parseAddressList(field('a5.eml', 'cc'))).toEqual([]);
  });
  it('reads the obsolete route and the spaced dots of Appendix A.6.1', () => {
    expect(parseAddressList(field('a6-1.eml', 'to')).map((m) => m.address)).toEqual(['mary@example.net', 'jdoe@test.example']);
  });
});

describe('parseMailDate follows RFC 5322 sections 3.3 and 4.3', () => {
  it('reads three-digit years as 1900 + year (RFC 5322 section 4.3)', () => {
    const r = parseMailDate('Fri, 21 Nov 097 09:55:06 -0600');
    expect(r.ok && new Date(r.instant).toISOString()).toBe('1997-11-21T15:55:06.000Z');
  });
  it('reads two-digit years below 50 as 20xx (RFC 5322 section 4.3)', () => {
    const r = parseMailDate('3 Feb 25 10:00 +0100');
    expect(r.ok && new Date(r.instant).toISOString()).toBe('2025-02-03T09:00:00.000Z');
  });
  it('reads the obsolete zone EDT as -0400 and a military zone as -0000 (RFC 5322 section 4.3)', () => {
    const edt = parseMailDate('Mon, 7 Jul 2025 12:00:00 EDT');
    expect(edt.ok && [new Date(edt.instant).toISOString(), edt.offsetMinutes]).toEqual(['2025-07-07T16:00:00.000Z', -240]);
    const mil = parseMailDate('Mon, 7 Jul 2025 12:00:00 Q');
    expect(mil.ok && mil.offsetMinutes).toBe(0);
  });
  it('rejects 31 February with the reason', () => {
    expect(parseMailDate('Sat, 31 Feb 2024 10:00:00 +0000')).toMatchObject({ ok: false, code: 'mail_bad_date', message: expect.stringContaining('day 31 does not exist') });
  });
  it('rejects a date in another shape with the expected form in the message', () => {
    expect(parseMailDate('yesterday evening')).toMatchObject({ ok: false, message: expect.stringContaining('Fri, 21 Nov 1997 09:55:06 -0600') });
  });
});

describe('encoded words decode as the examples of RFC 2047 section 8 say', () => {
  const message = (headers: string) => Buffer.from(`${headers}\nDate: Fri, 21 Nov 1997 09:55:06 -0600\n\nBody.\n`, 'latin1');
  it('decodes the RFC 2047 section 8 mailbox examples (Keith Moore, Keld Jørn Simonsen, André Pirard) and keeps the addresses', async () => {
    const raw = message('From: =?US-ASCII?Q?Keith_Moore?= <moore@cs.utk.edu>\nTo: =?ISO-8859-1?Q?Keld_J=F8rn_Simonsen?= <keld@dkuug.dk>\nCC: =?ISO-8859-1?Q?Andr=E9?= Pirard <PIRARD@vm1.ulg.ac.be>');
    const parsed = await simpleParser(raw);
    expect(parsed.from?.value[0]).toMatchObject({ name: 'Keith Moore', address: 'moore@cs.utk.edu' });
    expect(!Array.isArray(parsed.to) && parsed.to?.value[0]).toMatchObject({ name: 'Keld Jørn Simonsen', address: 'keld@dkuug.dk' });
    expect(!Array.isArray(parsed.cc) && parsed.cc?.value[0]).toMatchObject({ name: 'André Pirard' });
    const block = readMailHeaders(raw);
    expect(parseAddressList(mailHeader(block, 'from') as string).map((m) => m.address)).toEqual(['moore@cs.utk.edu']);
    expect(parseAddressList(mailHeader(block, 'cc') as string).map((m) => m.address)).toEqual(['PIRARD@vm1.ulg.ac.be']);
  });
  it('decodes the RFC 2047 section 8 subject split over two charsets and two lines', async () => {
    const parsed = await simpleParser(message('From: a@b.example\nSubject: =?ISO-8859-1?B?SWYgeW91IGNhbiByZWFkIHRoaXMgeW8=?=\n    =?ISO-8859-2?B?dSB1bmRlcnN0YW5kIHRoZSBleGFtcGxlLg==?='));
    expect(parsed.subject).toBe('If you can read this you understand the example.');
  });
  it('decodes the RFC 2047 section 8 names Olle Järnefors and Patrik Fältström', async () => {
    const a = await simpleParser(message('From: =?ISO-8859-1?Q?Olle_J=E4rnefors?= <ojarnef@admin.kth.se>'));
    const b = await simpleParser(message('From: =?ISO-8859-1?Q?Patrik_F=E4ltstr=F6m?= <paf@nada.kth.se>'));
    expect(a.from?.value[0]?.name).toBe('Olle Järnefors');
    expect(b.from?.value[0]?.name).toBe('Patrik Fältström');
  });
  // RFC 2047 section 8, the table of encoded text and how it displays (white space between adjacent encoded words is ignored)
  const table: Array<[string, string]> = [
    ['=?ISO-8859-1?Q?a?=', 'a'],
    ['=?ISO-8859-1?Q?a?= b', 'a b'],
    ['=?ISO-8859-1?Q?a?= =?ISO-8859-1?Q?b?=', 'ab'],
    ['=?ISO-8859-1?Q?a?=  =?ISO-8859-1?Q?b?=', 'ab'],
    ['=?ISO-8859-1?Q?a?=\n    =?ISO-8859-1?Q?b?=', 'ab'],
    ['=?ISO-8859-1?Q?a_b?=', 'a b'],
    ['=?ISO-8859-1?Q?a?= =?ISO-8859-2?Q?_b?=', 'a b'],
  ];
  for (const [encoded, shown] of table) {
    it(`displays ${JSON.stringify(encoded)} as ${JSON.stringify(shown)} (RFC 2047 section 8)`, async () => {
      const parsed = await simpleParser(message(`From: a@b.example\nSubject: ${encoded}`));
      expect(parsed.subject).toBe(shown);
    });
  }
});
