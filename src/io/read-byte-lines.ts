import { createReadStream } from 'node:fs';
import { stat } from 'node:fs/promises';
import { inputError, usageError } from '../errors.js';
import { decodeTextLine } from '../ingest/import/decode-text-line.js';
import type { NumberedLine } from '../ingest/import/read-chat-lines.js';
import { splitByteLines, type ByteLine, type SplitByteLinesOptions } from '../ingest/import/split-byte-lines.js';

/** Throws a usage error naming the problem when `path` is not a readable file. */
export async function assertInputFile(path: string): Promise<void> {
  let info;
  try {
    info = await stat(path);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'ENOENT') throw usageError(`Cannot read \`${path}\`: no such file; check the path.`);
    throw inputError(`Cannot read \`${path}\`: ${(error as Error).message}.`);
  }
  if (info.isDirectory()) throw usageError(`Cannot read \`${path}\`: it is a folder; name a file.`);
}

/** Streams the lines of a file as bytes (1 MiB reads); see splitByteLines. */
export async function* readByteLines(path: string, options: SplitByteLinesOptions = {}): AsyncGenerator<ByteLine> {
  await assertInputFile(path);
  const stream = createReadStream(path, { highWaterMark: 1 << 20 });
  try {
    yield* splitByteLines(stream, options);
  } finally {
    stream.destroy();
  }
}

/**
 * Streams the lines of a text file decoded with decodeTextLine (UTF-8, Windows-1252 fallback,
 * mojibake repaired). LF, CR and CRLF all end a line, so a stray CR cannot hide a line's start.
 */
export async function* readDecodedLines(path: string): AsyncGenerator<NumberedLine> {
  for await (const { line, bytes } of readByteLines(path, { crBreaks: true })) {
    const decoded = decodeTextLine(bytes);
    yield decoded.repaired ? { line, text: decoded.text, repaired: decoded.repaired } : { line, text: decoded.text };
  }
}
