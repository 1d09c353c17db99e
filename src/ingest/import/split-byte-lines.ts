/** One physical line of a file as raw bytes (without the `\n`; a `\r` before it is kept unless CR breaks lines). */
export interface ByteLine {
  /** 1-based line number. */
  line: number;
  bytes: Buffer;
}

/** How splitByteLines breaks lines. */
export interface SplitByteLinesOptions {
  /**
   * Also break at a bare CR, and take CRLF as one break (text exports: chat logs, diaries). A CR
   * that some program left inside a line would otherwise hide the start of the next message.
   * Off for mbox, whose CRLF lines keep their CR.
   */
  crBreaks?: boolean;
}

const LF = 10;
const CR = 13;

/**
 * Splits a stream of byte chunks into lines at `\n` (LF; CRLF lines keep their `\r`, which
 * callers strip or keep), or with `crBreaks` at LF, CR and CRLF alike. Bytes are not decoded,
 * so each mail message keeps its own charset. Memory holds one chunk and one partial line. A
 * last line without a final break is yielded too; an empty file yields nothing.
 */
export async function* splitByteLines(chunks: AsyncIterable<Buffer | Uint8Array>, options: SplitByteLinesOptions = {}): AsyncGenerator<ByteLine> {
  const crBreaks = options.crBreaks === true;
  let carry: Buffer | undefined;
  let line = 0;
  // with crBreaks: the previous chunk ended in CR, so an LF that starts this chunk ends no line
  let afterCr = false;
  for await (const raw of chunks) {
    const chunk = Buffer.isBuffer(raw) ? raw : Buffer.from(raw.buffer, raw.byteOffset, raw.byteLength);
    let start = 0;
    if (afterCr && chunk.length > 0) {
      if (chunk[0] === LF) start = 1;
      afterCr = false;
    }
    for (let end = nextBreak(chunk, start, crBreaks); end !== -1; end = nextBreak(chunk, start, crBreaks)) {
      const piece = chunk.subarray(start, end);
      const bytes = carry ? Buffer.concat([carry, piece]) : Buffer.from(piece);
      carry = undefined;
      line++;
      yield { line, bytes };
      start = end + 1;
      if (crBreaks && chunk[end] === CR) {
        if (end + 1 === chunk.length) afterCr = true;
        else if (chunk[end + 1] === LF) start++;
      }
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

/** Index of the next line break at or after `from` (LF, or LF or CR), or -1. */
function nextBreak(chunk: Buffer, from: number, crBreaks: boolean): number {
  const lf = chunk.indexOf(LF, from);
  if (!crBreaks) return lf;
  const cr = chunk.indexOf(CR, from);
  if (cr === -1) return lf;
  return lf === -1 || cr < lf ? cr : lf;
}
