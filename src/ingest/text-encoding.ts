import { StringDecoder } from 'node:string_decoder';

/** The encodings the table readers read. */
export type TextEncoding = 'utf-8' | 'utf-16le' | 'utf-16be';

/**
 * The encoding of a file from its first bytes: a byte-order mark (Unicode BOM table: FF FE is
 * UTF-16 little endian, FE FF big endian, EF BB BF UTF-8), or else the pattern of zero bytes
 * that UTF-16 gives text in Latin script: when at least 60% of the first (up to 512) byte pairs
 * have a zero in the high byte and a non-zero low byte, the file is UTF-16 in that byte order.
 * A UTF-8 file holding a few NUL bytes stays UTF-8. Everything else is read as UTF-8.
 */
export function textEncoding(head: Uint8Array): TextEncoding {
  if (head.length >= 2 && head[0] === 0xff && head[1] === 0xfe) return 'utf-16le';
  if (head.length >= 2 && head[0] === 0xfe && head[1] === 0xff) return 'utf-16be';
  const pairs = Math.min(512, Math.floor(head.length / 2));
  if (pairs < 2) return 'utf-8';
  let le = 0;
  let be = 0;
  for (let i = 0; i < pairs; i++) {
    const a = head[2 * i] as number;
    const b = head[2 * i + 1] as number;
    if (a !== 0 && b === 0) le++;
    else if (a === 0 && b !== 0) be++;
  }
  if (le >= 0.6 * pairs) return 'utf-16le';
  if (be >= 0.6 * pairs) return 'utf-16be';
  return 'utf-8';
}

/**
 * A streaming decoder for `encoding`: `write` returns the text of the bytes so far (a character
 * split between chunks is joined), `end` the rest. Invalid sequences become U+FFFD, which the
 * readers reject as `invalid_utf8` (for UTF-16: an unpaired surrogate or an odd last byte).
 */
export function textDecoder(encoding: TextEncoding): { write: (bytes: Uint8Array) => string; end: () => string } {
  if (encoding === 'utf-8') {
    // Node's own UTF-8 decoder: the common case, and the fastest.
    const utf8 = new StringDecoder('utf8');
    return { write: (bytes) => utf8.write(bytes as Buffer), end: () => utf8.end() };
  }
  const decoder = new TextDecoder(encoding, { fatal: false, ignoreBOM: true });
  return {
    write: (bytes) => decoder.decode(bytes, { stream: true }),
    end: () => decoder.decode(),
  };
}
