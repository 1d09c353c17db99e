/** One physical line of a file as raw bytes (without the `\n`; a `\r` before it is kept). */
export interface ByteLine {
  /** 1-based line number. */
  line: number;
  bytes: Buffer;
}

/**
 * Splits a stream of byte chunks into lines at `\n` (LF; CRLF lines keep their `\r`, which
 * callers strip or keep). Bytes are not decoded, so each mail message keeps its own charset.
 * Memory holds one chunk and one partial line. A last line without a final `\n` is yielded too;
 * an empty file yields nothing.
 */
export async function* splitByteLines(chunks: AsyncIterable<Buffer | Uint8Array>): AsyncGenerator<ByteLine> {
  let carry: Buffer | undefined;
  let line = 0;
  for await (const raw of chunks) {
    const chunk = Buffer.isBuffer(raw) ? raw : Buffer.from(raw.buffer, raw.byteOffset, raw.byteLength);
    let start = 0;
    for (let nl = chunk.indexOf(10, start); nl !== -1; nl = chunk.indexOf(10, start)) {
      const piece = chunk.subarray(start, nl);
      const bytes = carry ? Buffer.concat([carry, piece]) : Buffer.from(piece);
      carry = undefined;
      line++;
      yield { line, bytes };
      start = nl + 1;
    }
    if (start < chunk.length) {
      const rest = chunk.subarray(start);
      carry = carry ? Buffer.concat([carry, rest]) : Buffer.from(rest);
    }
  }
  if (carry && carry.length > 0) {
    line++;
    yield { line, bytes: carry };
  }
}
