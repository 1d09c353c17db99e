import type { ByteLine } from './split-byte-lines.js';

/** A piece of an mbox file: one message (raw bytes, `>From ` unescaped) or stray lines before the first separator. */
export type MboxPart =
  | { kind: 'message'; line: number; raw: Buffer }
  | { kind: 'preamble'; line: number; lines: number };

const FROM_ = Buffer.from('From ');
const LF = Buffer.from('\n');
/** A separator line as RFC 4155 describes it: `From `, an envelope sender, then a timestamp (a clock time and a year). */
const SEPARATOR = /^From \S+\s.*\b\d{1,2}:\d{2}/;
const YEAR = /\b\d{4}\b/;

/** True when the bytes form an mbox separator line (`From sender@host Thu Nov 21 09:55:06 1997`). */
export function isMboxSeparator(bytes: Uint8Array): boolean {
  if (bytes.length < 6 || Buffer.compare(bytes.subarray(0, 5), FROM_) !== 0) return false;
  const text = Buffer.from(bytes.buffer, bytes.byteOffset, Math.min(bytes.length, 200)).toString('latin1');
  return SEPARATOR.test(text) && YEAR.test(text.slice(5));
}

/** Undoes mboxrd quoting: a body line `>From `, `>>From `, … loses one `>` (RFC 4155 section 2 and its note on the mboxrd variant). */
function unescapeFromLine(bytes: Buffer): Buffer {
  let i = 0;
  while (i < bytes.length && bytes[i] === 0x3e) i++;
  if (i > 0 && bytes.length - i >= 5 && Buffer.compare(bytes.subarray(i, i + 5), FROM_) === 0) return bytes.subarray(1);
  return bytes;
}

/**
 * Splits an mbox file (RFC 4155, `application/mbox`) into messages, streamed: only the
 * current message is held in memory, so a 1 GB mbox needs no more than its largest message.
 *
 * A message starts at a separator line (isMboxSeparator) and runs to the next one; the
 * separator itself is not part of the message. Body lines escaped as `>From ` are unescaped
 * (mboxrd). Lines before the first separator come back as one `preamble` part (a file cut at
 * the start, or not an mbox at all), so the caller can report them.
 */
export async function* splitMbox(lines: AsyncIterable<ByteLine>): AsyncGenerator<MboxPart> {
  let current: Buffer[] | undefined;
  let start = 0;
  let preambleStart = 0;
  let preambleLines = 0;
  for await (const { line, bytes } of lines) {
    if (isMboxSeparator(bytes)) {
      if (current) yield { kind: 'message', line: start, raw: Buffer.concat(current) };
      else if (preambleLines > 0) yield { kind: 'preamble', line: preambleStart, lines: preambleLines };
      current = [];
      start = line;
      continue;
    }
    if (current) {
      current.push(unescapeFromLine(bytes), LF);
    } else if (bytes.length > 0 && !(bytes.length === 1 && bytes[0] === 13)) {
      if (preambleLines === 0) preambleStart = line;
      preambleLines++;
    }
  }
  if (current) yield { kind: 'message', line: start, raw: Buffer.concat(current) };
  else if (preambleLines > 0) yield { kind: 'preamble', line: preambleStart, lines: preambleLines };
}
