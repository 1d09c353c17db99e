import { WINDOWS_1252_HIGH } from './decode-windows-1252.js';

const utf8 = new TextDecoder('utf-8', { fatal: true });

/** Character → byte under Windows-1252 and under ISO-8859-1 (C1 controls), the two usual wrong decodings. */
const BYTE_OF = (() => {
  const map = new Map<string, number>();
  for (let b = 0x80; b <= 0xff; b++) {
    map.set(String.fromCharCode(b), b);
    if (b <= 0x9f) map.set(String.fromCharCode(WINDOWS_1252_HIGH[b - 0x80] as number), b);
  }
  return map;
})();

const SUSPECT_CHARS = [...BYTE_OF.keys()].map((c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`).join('');
/** A run that starts with a UTF-8 lead byte (0xC2–0xF4) seen through Windows-1252, followed by more such characters. */
const RUN = new RegExp(`[\\u00c2-\\u00f4][${SUSPECT_CHARS}]+`, 'g');

/**
 * Undoes double-encoded UTF-8 ("mojibake"): text whose UTF-8 bytes were once decoded as
 * Windows-1252 or ISO-8859-1 and encoded again, so that `é` reads `Ã©`, `’` reads `â€™`
 * and the narrow no-break space U+202F reads `â€¯`.
 *
 * Each run of characters that starts with a UTF-8 lead byte (U+00C2–U+00F4) and continues with
 * characters that exist in those code pages is mapped back to bytes, and every complete, valid
 * UTF-8 sequence in it (RFC 3629) is decoded; characters that do not form one stay as written,
 * so genuine Latin-1 text such as `café` or `Größe` is left alone. Returns the input unchanged when nothing needed repair.
 */
export function repairMojibake(text: string): string {
  if (!/[\u00c2-\u00f4]/.test(text)) return text;
  return text.replace(RUN, (run) => {
    const bytes = Array.from(run, (c) => BYTE_OF.get(c) ?? 0);
    let out = '';
    let i = 0;
    while (i < bytes.length) {
      const lead = bytes[i] as number;
      const n = lead >= 0xf0 ? 4 : lead >= 0xe0 ? 3 : lead >= 0xc2 ? 2 : 1;
      if (n > 1 && i + n <= bytes.length) {
        try {
          out += utf8.decode(Uint8Array.from(bytes.slice(i, i + n)));
          i += n;
          continue;
        } catch {
          // not a valid sequence: keep the character as written
        }
      }
      out += run[i];
      i++;
    }
    return out;
  });
}
