import { decodeWindows1252 } from './decode-windows-1252.js';
import { repairMojibake } from './repair-mojibake.js';

/** A decoded text line, with the repair applied to it, if any. */
export interface DecodedLine {
  text: string;
  /** `windows_1252`: the bytes were not UTF-8 and were read as Windows-1252; `mojibake`: double-encoded UTF-8 was undone. */
  repaired?: 'windows_1252' | 'mojibake';
}

const utf8 = new TextDecoder('utf-8', { fatal: true });

/**
 * Decodes one line of a text export (chat log, diary) from bytes.
 *
 * - A trailing `\r` (CRLF files) and a leading byte-order mark are removed.
 * - Bytes that are valid UTF-8 are read as UTF-8; a line that is not (a file with mixed
 *   encodings, e.g. one line saved as Latin-1) is read as Windows-1252, the usual single-byte
 *   encoding of such lines (WHATWG Encoding Standard, which maps ISO-8859-1 labels to it).
 * - Double-encoded UTF-8 (mojibake such as `Ã©` for `é`) is undone by repairMojibake.
 */
export function decodeTextLine(bytes: Uint8Array): DecodedLine {
  let end = bytes.length;
  if (end > 0 && bytes[end - 1] === 13) end--;
  let start = 0;
  if (end >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) start = 3;
  const view = bytes.subarray(start, end);
  let text: string;
  try {
    text = utf8.decode(view);
  } catch {
    return { text: decodeWindows1252(view), repaired: 'windows_1252' };
  }
  const fixed = repairMojibake(text);
  return fixed === text ? { text } : { text: fixed, repaired: 'mojibake' };
}
