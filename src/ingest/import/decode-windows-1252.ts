/**
 * Characters of bytes 0x80–0x9F in Windows-1252 (WHATWG Encoding Standard, index windows-1252);
 * the five unassigned bytes map to the C1 controls of the same number, as the standard does.
 * Bytes 0x00–0x7F and 0xA0–0xFF are the same code points as in ISO-8859-1.
 */
export const WINDOWS_1252_HIGH = [
  0x20ac, 0x0081, 0x201a, 0x0192, 0x201e, 0x2026, 0x2020, 0x2021, 0x02c6, 0x2030, 0x0160, 0x2039, 0x0152, 0x008d, 0x017d, 0x008f,
  0x0090, 0x2018, 0x2019, 0x201c, 0x201d, 0x2022, 0x2013, 0x2014, 0x02dc, 0x2122, 0x0161, 0x203a, 0x0153, 0x009d, 0x017e, 0x0178,
] as const;

/**
 * Decodes bytes as Windows-1252. (Node's own TextDecoder gives ISO-8859-1 for this label, which
 * turns 0x80–0x9F into invisible C1 controls instead of € ‚ “ ” – — and the like.)
 */
export function decodeWindows1252(bytes: Uint8Array): string {
  let out = '';
  for (let i = 0; i < bytes.length; i++) {
    const b = bytes[i] as number;
    out += String.fromCharCode(b >= 0x80 && b <= 0x9f ? (WINDOWS_1252_HIGH[b - 0x80] as number) : b);
  }
  return out;
}
