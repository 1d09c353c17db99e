import { simpleParser } from 'mailparser';
import type { RawEntry } from '../../types.js';
import { htmlBodyText } from './html-body-text.js';
import { importReject, type EntryNote, type ImportItem } from './import-item.js';
import { mailHeader, readMailHeaders } from './read-mail-headers.js';
import { normalizeAddress, parseAddressList } from './parse-address-list.js';
import { parseMailDate } from './parse-mail-date.js';
import { repairMojibake } from './repair-mojibake.js';
import { stripMailQuotes } from './strip-mail-quotes.js';
import { diagnosticText } from '../../privacy/diagnostic-text.js';

/** Who the participant is and where the message came from. */
export interface MailContext {
  file: string;
  /** Line of the message's separator in the mbox (1-based). */
  line: number;
  person: string;
  /** The person's IANA zone (the entry's `zone`; the time keeps the Date header's own offset). */
  zone: string;
  /** The participant's addresses, as normalizeAddress returns them. */
  addresses: ReadonlySet<string>;
}

/** Checks that a message is complete: the header section ends, and every multipart body reaches its closing boundary. */
function truncation(raw: Buffer, bodyStart: number | undefined, contentType: string | undefined): string | undefined {
  if (bodyStart === undefined) return 'the header section does not end with a blank line (the file may be cut off here)';
  const boundary = contentType && /^\s*multipart\//i.test(contentType) ? /boundary\s*=\s*(?:"([^"]+)"|([^\s;]+))/i.exec(contentType) : null;
  if (boundary) {
    const marker = `--${boundary[1] ?? boundary[2]}--`;
    if (raw.indexOf(marker, bodyStart, 'latin1') === -1) return 'the multipart body never reaches its closing boundary (the file may be cut off here)';
  }
  return undefined;
}

/**
 * Turns one raw message of an mbox into an entry, a reject or a drop.
 *
 * 1. From (RFC 5322 section 3.6.2) is parsed with parseAddressList; a message whose From holds
 *    none of the participant's addresses is dropped as `third_party` before its body is decoded;
 *    one whose From also names someone else (or that has two From fields) is rejected as
 *    `mail_shared_from`: only text whose author is proven to be the participant is kept.
 * 2. A cut-off message (no end of headers, or a multipart body without its closing boundary) →
 *    `mail_truncated`, before the Date is looked at: a header section cut off in or before its
 *    Date line would otherwise be reported as a bad or missing date.
 * 3. Date (section 3.6.1) is read with parseMailDate, keeping its offset: missing → `mail_no_date`,
 *    unreadable → `mail_bad_date`.
 * 4. The body is decoded by mailparser (MIME per RFC 2045–2049, quoted-printable and base64, charsets,
 *    RFC 2047 encoded words); text/plain is preferred, otherwise mailparser's text rendering of the HTML
 *    (also for an HTML part inside a multipart container without text/plain, see htmlBodyText).
 *    Double-encoded UTF-8 is repaired; replacement characters are noted (`undecodable_bytes`).
 * 5. Quotes, forwarded blocks and the signature are removed by stripMailQuotes; nothing left → `mail_empty`.
 */
export async function parseMailMessage(raw: Buffer, context: MailContext): Promise<ImportItem> {
  const { file, line } = context;
  const block = readMailHeaders(raw);
  const fromFields = block.headers.filter((h) => h.name === 'from');
  if (fromFields.length === 0) return importReject(file, line, 'mail_no_from', 'the message has no From header, so its sender is unknown');
  const senders = fromFields.flatMap((h) => parseAddressList(h.value)).map((m) => normalizeAddress(m.address));
  const ownCount = senders.filter((address) => context.addresses.has(address)).length;
  if (ownCount === 0) return { kind: 'drop', reason: 'third_party', source: { file, line } };
  if (ownCount < senders.length || fromFields.length > 1) {
    return importReject(file, line, 'mail_shared_from', `the From header names ${senders.length - ownCount} author(s) besides the participant${fromFields.length > 1 ? ` (in ${fromFields.length} From fields)` : ''}, so whose words are whose cannot be told; the message is left out`);
  }
  const cut = truncation(raw, block.bodyStart, mailHeader(block, 'content-type'));
  if (cut) return importReject(file, line, 'mail_truncated', cut);
  const dateValue = mailHeader(block, 'date');
  if (dateValue === undefined) return importReject(file, line, 'mail_no_date', 'the message has no Date header, so its time is unknown');
  const date = parseMailDate(dateValue);
  if (!date.ok) return importReject(file, line, date.code, date.message);
  let text: string;
  try {
    const parsed = await simpleParser(raw, { skipImageLinks: true, skipTextLinks: true, skipTextToHtml: true, keepCidLinks: true });
    text = parsed.text ?? '';
    if (text.trim() === '' && typeof parsed.html === 'string' && parsed.html.trim() !== '') {
      // An HTML body without a text/plain part inside a multipart container: mailparser leaves it as HTML.
      const rendered = await htmlBodyText(parsed.html);
      if (rendered.error !== undefined && rendered.text.trim() === '') {
        return importReject(file, line, 'mail_unreadable', `the HTML body cannot be turned into text (${diagnosticText(rendered.error, 80)}); the message is left out`);
      }
      text = rendered.text;
    }
  } catch (error) {
    return importReject(file, line, 'mail_unreadable', `the message cannot be decoded (${diagnosticText((error as Error).name || 'error', 60)} in the MIME decoder); check that the file is an mbox export`);
  }
  const notes: EntryNote[] = [];
  const repaired = repairMojibake(text);
  if (repaired !== text) notes.push('mojibake');
  if (repaired.includes('\uFFFD')) notes.push('undecodable_bytes');
  const own = stripMailQuotes(repaired);
  if (own === '') return importReject(file, line, 'mail_empty', 'nothing of the sender\'s own text remains after removing quotes, forwarded parts and the signature');
  const entry: RawEntry = {
    id: `${file}:${line}`,
    person: context.person,
    instant: date.instant,
    zone: context.zone,
    offsetMinutes: date.offsetMinutes,
    text: own,
    source: { file, line },
  };
  return notes.length > 0 ? { kind: 'entry', entry, notes } : { kind: 'entry', entry };
}
