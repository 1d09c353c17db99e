import { describe, expect, it } from 'vitest';
import type { ImportItem } from '../../../src/ingest/import/import-item.js';
import { readMbox } from '../../../src/ingest/import/read-mbox.js';
import { splitByteLines } from '../../../src/ingest/import/split-byte-lines.js';
import { isMboxSeparator, splitMbox } from '../../../src/ingest/import/split-mbox.js';
import { stripMailQuotes } from '../../../src/ingest/import/strip-mail-quotes.js';
import { collect } from '../../support/temp-files.js';

async function* chunks(...parts: Array<string | Buffer>): AsyncGenerator<Buffer> {
  for (const p of parts) yield Buffer.isBuffer(p) ? p : Buffer.from(p, 'utf8');
}
const OPTIONS = { file: 'mail.mbox', person: 'P01', zone: 'Europe/Brussels', addresses: ['Ann@Example.org'] };
const read = (...parts: Array<string | Buffer>): Promise<ImportItem[]> => collect(readMbox(splitByteLines(chunks(...parts)), OPTIONS));
const texts = (items: ImportItem[]) => items.flatMap((i) => (i.kind === 'entry' ? [i.entry.text] : []));
const codes = (items: ImportItem[]) => items.flatMap((i) => (i.kind === 'reject' ? [i.diagnostic.code] : i.kind === 'drop' ? [`drop:${i.reason}`] : []));

const message = (from: string, date: string | undefined, body: string, extra = '') =>
  `From ${from} Mon Mar  3 09:00:00 2025\nFrom: ${from}\n${date === undefined ? '' : `Date: ${date}\n`}Subject: hi\n${extra}\n${body}\n\n`;

describe('splitMbox splits RFC 4155 mbox files', () => {
  it('recognises separator lines with an envelope sender and an asctime date, and not body lines', () => {
    expect(isMboxSeparator(Buffer.from('From ann@example.org Thu Nov 21 09:55:06 1997'))).toBe(true);
    expect(isMboxSeparator(Buffer.from('From - Fri Jul 13 10:21:33 2018'))).toBe(true);
    expect(isMboxSeparator(Buffer.from('From 1701234567890@xxx Wed Nov 29 10:23:45 +0000 2023'))).toBe(true);
    expect(isMboxSeparator(Buffer.from('From here on, I will write more often.'))).toBe(false);
    expect(isMboxSeparator(Buffer.from('>From ann@example.org Thu Nov 21 09:55:06 1997'))).toBe(false);
  });

  it('unescapes >From lines of the mboxrd convention (RFC 4155 section 2) and keeps deeper quoting minus one >', async () => {
    const parts = await collect(splitMbox(splitByteLines(chunks('From a@b.example Thu Nov 21 09:55:06 1997\nSubject: x\n\n>From the start\n>>From deeper\n> quoted\n'))));
    expect(parts).toHaveLength(1);
    expect(parts[0]?.kind === 'message' && parts[0].raw.toString()).toBe('Subject: x\n\nFrom the start\n>From deeper\n> quoted\n');
  });

  it('streams: the first message comes out before the input has produced the third', async () => {
    const produced: number[] = [];
    async function* lazy(): AsyncGenerator<Buffer> {
      for (let i = 1; i <= 5; i++) {
        produced.push(i);
        yield Buffer.from(message('ann@example.org', 'Mon, 3 Mar 2025 09:00:00 +0100', `message ${i}`));
      }
    }
    const iterator = splitMbox(splitByteLines(lazy()))[Symbol.asyncIterator]();
    const first = await iterator.next();
    expect(first.value).toMatchObject({ kind: 'message', line: 1 });
    expect(Math.max(...produced)).toBe(2);
    await iterator.return?.(undefined);
  });

  it('splits at separators even across chunk boundaries and counts lines from 1', async () => {
    const text = message('ann@example.org', 'Mon, 3 Mar 2025 09:00:00 +0100', 'one') + message('bob@example.org', 'Mon, 3 Mar 2025 09:05:00 +0100', 'two');
    const parts = await collect(splitMbox(splitByteLines(chunks(text.slice(0, 7), text.slice(7, 90), text.slice(90)))));
    expect(parts.map((p) => p.line)).toEqual([1, 8]);
  });
});

describe('readMbox keeps the participant\'s own messages only', () => {
  it('keeps messages From the participant (address compared without case) and drops everyone else\'s as third_party', async () => {
    const items = await read(
      message('Ann <ANN@example.org>', 'Mon, 3 Mar 2025 09:00:00 +0100', 'I am glad.'),
      message('Bob <bob@example.org>', 'Mon, 3 Mar 2025 09:05:00 +0100', 'Secret words of Bob.'),
    );
    expect(texts(items)).toEqual(['I am glad.']);
    expect(codes(items)).toEqual(['drop:third_party']);
    expect(JSON.stringify(items)).not.toContain('Bob.');
    const entry = items[0];
    expect(entry?.kind === 'entry' && [entry.entry.id, new Date(entry.entry.instant).toISOString(), entry.entry.offsetMinutes]).toEqual(['mail.mbox:1', '2025-03-03T08:00:00.000Z', 60]);
  });

  it('leaves out a message whose From (RFC 5322 section 3.6.2) also names someone else, or that has two From fields, since whose words are whose cannot be told', async () => {
    const shared = message('ann@example.org', 'Mon, 3 Mar 2025 09:00:00 +0100', 'SECRET of Bob and Ann').replace('From: ann@example.org', 'From: Ann <ann@example.org>, Bob <bob@example.org>');
    const twice = message('ann@example.org', 'Mon, 3 Mar 2025 09:00:00 +0100', 'SECRET of Bob').replace('From: ann@example.org', 'From: ann@example.org\nFrom: bob@example.org');
    const items = await read(shared, twice, message('ann@example.org', 'Mon, 3 Mar 2025 10:00:00 +0100', 'my own words'));
    expect(texts(items)).toEqual(['my own words']);
    expect(codes(items)).toEqual(['mail_shared_from', 'mail_shared_from']);
    expect(JSON.stringify(items)).not.toMatch(/SECRET/);
  });
  it('leaves out the next message when a damaged separator line glues it onto the participant\'s message', async () => {
    const bob = message('bob@example.org', 'Mon, 3 Mar 2025 09:30:00 +0100', 'SECRET of Bob').replace(/^From /, 'Fxom ');
    const items = await read(message('ann@example.org', 'Mon, 3 Mar 2025 09:00:00 +0100', 'my own words'), bob);
    expect(texts(items)).toEqual(['my own words']);
    expect(JSON.stringify(items)).not.toMatch(/SECRET/);
  });
  it('leaves out the next message when its separator line lost its line break (privacy fuzz seed 3105)', async () => {
    const cleo = message('cleo@example.net', 'Mon, 3 Mar 2025 09:30:00 +0100', 'SECRET of Cleo').replace('2025\nFrom: cleo', '2025From: cleo');
    const items = await read(message('ann@example.org', 'Mon, 3 Mar 2025 09:00:00 +0100', 'my own words'), cleo);
    expect(texts(items)).toEqual(['my own words']);
    expect(JSON.stringify(items)).not.toMatch(/SECRET|cleo/);
  });
  it('decodes quoted-printable (RFC 2045 section 6.7) and base64 (section 6.8) bodies in their charsets', async () => {
    const qp = message('ann@example.org', 'Mon, 3 Mar 2025 09:00:00 +0100', 'Caf=E9 au lait, tr=E8s bien =\nmerci.', 'MIME-Version: 1.0\nContent-Type: text/plain; charset=ISO-8859-1\nContent-Transfer-Encoding: quoted-printable\n');
    const b64 = message('ann@example.org', 'Mon, 3 Mar 2025 10:00:00 +0100', Buffer.from('Grüße aus Köln', 'utf8').toString('base64'), 'MIME-Version: 1.0\nContent-Type: text/plain; charset=utf-8\nContent-Transfer-Encoding: base64\n');
    expect(texts(await read(qp, b64))).toEqual(['Café au lait, très bien merci.', 'Grüße aus Köln']);
  });

  it('prefers text/plain in multipart/alternative and falls back to the text of an HTML-only message', async () => {
    const alt = message('ann@example.org', 'Mon, 3 Mar 2025 09:00:00 +0100', '--XX\nContent-Type: text/plain; charset=utf-8\n\nPlain words.\n--XX\nContent-Type: text/html; charset=utf-8\n\n<p>HTML words.</p>\n--XX--', 'MIME-Version: 1.0\nContent-Type: multipart/alternative; boundary="XX"\n');
    const html = message('ann@example.org', 'Mon, 3 Mar 2025 10:00:00 +0100', '<html><body><p>Only <b>HTML</b> here.</p><blockquote>quoted from Bob</blockquote></body></html>', 'MIME-Version: 1.0\nContent-Type: text/html; charset=utf-8\n');
    const out = texts(await read(alt, html));
    expect(out[0]).toBe('Plain words.');
    expect(out[1]).toContain('Only HTML here.');
    expect(out[1]).not.toContain('<p>');
    expect(out[1]).not.toContain('quoted from Bob');
  });

  it('reads an HTML-only body inside a multipart container (RFC 2046 multipart/alternative, or multipart/mixed with an attachment) as text, without the quoted reply', async () => {
    const html = '<div>Walked home, felt calm.</div><div><br></div><div class="quote">On Mon, 3 Mar 2025 at 08:30, Bob &lt;bob@example.org&gt; wrote:<blockquote>Horrible news from Bob.</blockquote></div>';
    const alt = message('ann@example.org', 'Mon, 3 Mar 2025 09:00:00 +0100', `--XX\nContent-Type: text/html; charset=utf-8\n\n${html}\n--XX--`, 'MIME-Version: 1.0\nContent-Type: multipart/alternative; boundary="XX"\n');
    const mixed = message(
      'ann@example.org',
      'Mon, 3 Mar 2025 10:00:00 +0100',
      `--YY\nContent-Type: text/html; charset=utf-8\nContent-Transfer-Encoding: quoted-printable\n\n<p>Photo of the lake, so happy=\n today.</p>\n--YY\nContent-Type: image/png; name="lake.png"\nContent-Disposition: attachment; filename="lake.png"\nContent-Transfer-Encoding: base64\n\niVBORw0KGgo=\n--YY--`,
      'MIME-Version: 1.0\nContent-Type: multipart/mixed; boundary="YY"\n',
    );
    const items = await read(alt, mixed);
    expect(codes(items)).toEqual([]);
    expect(texts(items)).toEqual(['Walked home, felt calm.', 'Photo of the lake, so happy today.']);
  });

  it('rejects an HTML body that cannot be rendered as text (nested deeper than mailparser renders) as mail_unreadable, not as mail_empty', async () => {
    const deep = `${'<div>'.repeat(1100)}Deep words.${'</div>'.repeat(1100)}`;
    const single = message('ann@example.org', 'Mon, 3 Mar 2025 09:00:00 +0100', deep, 'MIME-Version: 1.0\nContent-Type: text/html; charset=utf-8\n');
    const mixed = message('ann@example.org', 'Mon, 3 Mar 2025 10:00:00 +0100', `--YY\nContent-Type: text/html; charset=utf-8\n\n${deep}\n--YY--`, 'MIME-Version: 1.0\nContent-Type: multipart/mixed; boundary="YY"\n');
    const items = await read(single, mixed);
    expect(codes(items)).toEqual(['mail_unreadable', 'mail_unreadable']);
    expect(items[0]?.kind === 'reject' && items[0].diagnostic.message).toMatch(/HTML body cannot be turned into text \(HTML nested deeper than 1000 levels\)/);
  });

  it('strips the reply attribution, > quotes, a forwarded block and the signature', async () => {
    const body = 'Thanks, that cheered me up!\n\nOn Mon, 3 Mar 2025 at 08:00, Bob <bob@example.org> wrote:\n> Here is a joke.\n> Bye\n\n-- \nAnn\nPhone 555';
    const fwd = 'See below.\n\n---------- Forwarded message ---------\nFrom: Odalys <c@example.org>\nDate: Sun, 2 Mar 2025\n\nOdalys\'s private news.';
    expect(texts(await read(message('ann@example.org', 'Mon, 3 Mar 2025 09:00:00 +0100', body), message('ann@example.org', 'Mon, 3 Mar 2025 09:10:00 +0100', fwd)))).toEqual(['Thanks, that cheered me up!', 'See below.']);
  });

  it('rejects a message without Date (mail_no_date) and one with an unreadable Date (mail_bad_date)', async () => {
    const items = await read(message('ann@example.org', undefined, 'no date'), message('ann@example.org', 'sometime last week', 'bad date'));
    expect(codes(items)).toEqual(['mail_no_date', 'mail_bad_date']);
    expect(items[1]?.kind === 'reject' && items[1].diagnostic).toMatchObject({ source: { file: 'mail.mbox', line: 7 }, stage: 'ingest' });
  });

  it('rejects a truncated last message (headers cut off, or a multipart body without its closing boundary) and keeps the complete ones', async () => {
    const good = message('ann@example.org', 'Mon, 3 Mar 2025 09:00:00 +0100', 'complete');
    const cutHeaders = 'From ann@example.org Mon Mar  3 09:00:00 2025\nFrom: ann@example.org\nDate: Mon, 3 Mar 2025 09:30:00 +0100\nSubj';
    const cutMultipart = message('ann@example.org', 'Mon, 3 Mar 2025 09:40:00 +0100', '--XX\nContent-Type: text/plain\n\nhalf a mess', 'MIME-Version: 1.0\nContent-Type: multipart/mixed; boundary=XX\n').trimEnd();
    expect(codes(await read(good, cutHeaders))).toEqual(['mail_truncated']);
    // Cut off inside the Date line, or before it: the message is truncated, not badly dated or undated.
    const cutInDate = 'From ann@example.org Mon Mar  3 09:00:00 2025\nFrom: ann@example.org\nDate: Mon, 3 Mar 20';
    const cutBeforeDate = 'From ann@example.org Mon Mar  3 09:00:00 2025\nFrom: ann@example.org\nSubj';
    expect(codes(await read(good, cutInDate))).toEqual(['mail_truncated']);
    expect(codes(await read(good, cutBeforeDate))).toEqual(['mail_truncated']);
    const items = await read(good, cutMultipart);
    expect(texts(items)).toEqual(['complete']);
    expect(codes(items)).toEqual(['mail_truncated']);
  });

  it('rejects lines before the first separator (a file cut at the start) as mbox_preamble and still reads the rest', async () => {
    const items = await read('the end of a message\nthat lost its start\n\n', message('ann@example.org', 'Mon, 3 Mar 2025 09:00:00 +0100', 'whole'));
    expect(codes(items)).toEqual(['mbox_preamble']);
    expect(texts(items)).toEqual(['whole']);
  });

  it('raises a clear error for a file with no separator at all', async () => {
    await expect(read('Just some text\nthat is not mail\n')).rejects.toThrow(/no line starts a message/);
  });

  it('reads mixed encodings: raw Latin-1 and UTF-8 bodies in their declared charsets, and repairs a double-encoded UTF-8 body', async () => {
    const latin1 = Buffer.concat([Buffer.from(message('ann@example.org', 'Mon, 3 Mar 2025 09:00:00 +0100', 'XX', 'Content-Type: text/plain; charset=iso-8859-1\nContent-Transfer-Encoding: 8bit\n').split('XX')[0] as string), Buffer.from('d\xe9j\xe0 vu', 'latin1'), Buffer.from('\n\n')]);
    const mojibake = message('ann@example.org', 'Mon, 3 Mar 2025 10:00:00 +0100', 'Ã§a va trÃ¨s bien', 'Content-Type: text/plain; charset=utf-8\n');
    const items = await read(latin1, mojibake);
    expect(texts(items)).toEqual(['déjà vu', 'ça va très bien']);
    expect(items[1]?.kind === 'entry' && items[1].notes).toEqual(['mojibake']);
  });
});

describe('stripMailQuotes', () => {
  it('keeps interleaved answers between quoted lines', () => {
    expect(stripMailQuotes('On 3 Mar 2025, Bob wrote:\n> Are you coming?\nYes!\n> When?\nAt eight.')).toBe('Yes!\nAt eight.');
  });
  it('cuts a two-line attribution with everything after it when the quote lost its > marks', () => {
    expect(stripMailQuotes('Sounds good.\n\nOn Mon, 3 Mar 2025 at 08:00, Bob Smith <\nbob@example.org> wrote:\nHere is my long letter')).toBe('Sounds good.');
  });
  it('does not take an ordinary sentence starting with "On" for an attribution', () => {
    expect(stripMailQuotes('On the whole it was fine, as my sister wrote:\nI agree.')).toBe('On the whole it was fine, as my sister wrote:\nI agree.');
  });
  it('drops a device footer standing last, but keeps the same words inside the message (common practice)', () => {
    expect(stripMailQuotes('See you at the hives.\n\nSent from my phone\n')).toBe('See you at the hives.');
    expect(stripMailQuotes('Sent from my phone, sorry for typos\nSee you at the hives.')).toBe('Sent from my phone, sorry for typos\nSee you at the hives.');
  });
  it('cuts at an Outlook-style original message header block', () => {
    expect(stripMailQuotes('Fine by me.\n\n________________________________\nFrom: Bob\nSent: Monday\nTo: Ann\nSubject: plan\n\nOld text')).toBe('Fine by me.');
  });
});
