/** One header field, unfolded (RFC 5322 section 2.2.3): continuation lines joined, line breaks removed. */
export interface MailHeader {
  /** Field name in lower case. */
  name: string;
  value: string;
}

/** The header section of a raw message and where its body starts. */
export interface MailHeaderBlock {
  headers: MailHeader[];
  /** Byte offset of the body, or undefined when the blank line that ends the header section is missing. */
  bodyStart: number | undefined;
  /** Lines in the header section that are neither a field nor a continuation (a sign of a damaged message). */
  strayLines: number;
}

const utf8 = new TextDecoder('utf-8', { fatal: true });

function decodeHeaderBytes(bytes: Uint8Array): string {
  try {
    return utf8.decode(bytes); // RFC 6532 allows UTF-8 in header fields
  } catch {
    return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString('latin1');
  }
}

/**
 * Reads the header section of a raw message (RFC 5322 section 2.2): fields up to the first empty
 * line, folded lines (starting with a space or tab) unfolded, field names lower-cased.
 * Whitespace before the colon is accepted (the obsolete syntax of section 4.5).
 * Header values are decoded as UTF-8 when valid (RFC 6532), otherwise byte for byte (ISO-8859-1).
 */
export function readMailHeaders(raw: Uint8Array): MailHeaderBlock {
  const headers: MailHeader[] = [];
  let strayLines = 0;
  let pos = 0;
  let bodyStart: number | undefined;
  let current: { name: string; parts: string[] } | undefined;
  const finish = (): void => {
    if (current) headers.push({ name: current.name, value: current.parts.join('').trim() });
    current = undefined;
  };
  while (pos < raw.length) {
    let end = raw.indexOf(10, pos);
    const next = end === -1 ? raw.length : end + 1;
    if (end === -1) end = raw.length;
    let lineEnd = end;
    if (lineEnd > pos && raw[lineEnd - 1] === 13) lineEnd--;
    if (lineEnd === pos) {
      bodyStart = next;
      break;
    }
    const line = decodeHeaderBytes(raw.subarray(pos, lineEnd));
    if ((line[0] === ' ' || line[0] === '\t') && current) {
      current.parts.push(line);
    } else {
      const colon = line.indexOf(':');
      const name = colon > 0 ? line.slice(0, colon).trim() : '';
      if (name !== '' && /^[\x21-\x39\x3b-\x7e]+$/.test(name)) {
        finish();
        current = { name: name.toLowerCase(), parts: [line.slice(colon + 1)] };
      } else {
        strayLines++;
      }
    }
    pos = next;
  }
  finish();
  return { headers, bodyStart, strayLines };
}

/** The value of the first header field named `name` (lower case), or undefined. */
export function mailHeader(block: MailHeaderBlock, name: string): string | undefined {
  return block.headers.find((h) => h.name === name)?.value;
}
