/** Writes ASCII `text` into `buffer` at `at`, one byte per character; returns where it ended. */
export function writeAscii(buffer: Uint8Array, at: number, text: string): number {
  for (let k = 0; k < text.length; k++) buffer[at++] = text.charCodeAt(k);
  return at;
}
