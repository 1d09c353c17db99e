import { createReadStream } from 'node:fs';
import { open, readFile } from 'node:fs/promises';
import { inputError, usageError } from '../errors.js';
import type { TableFile } from '../ingest/read-records.js';

/** Chunks of a file read with `createReadStream` (64 KiB), the stream released however the loop ends. */
async function* fileChunks(path: string): AsyncGenerator<Buffer> {
  const stream = createReadStream(path, { highWaterMark: 1 << 16 });
  try {
    for await (const bytes of stream as AsyncIterable<Buffer>) yield bytes;
  } finally {
    stream.destroy();
  }
}

/** Throws a usage error naming the path when the file is missing or a folder, an input error otherwise. */
async function assertReadable(path: string): Promise<void> {
  try {
    const handle = await open(path, 'r');
    await handle.close();
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'ENOENT') throw usageError(`Cannot read \`${path}\`: no such file; check the path.`);
    if (code === 'EISDIR') throw usageError(`Cannot read \`${path}\`: it is a folder; name a file.`);
    throw inputError(`Cannot read \`${path}\`: ${(error as Error).message}.`);
  }
}

/**
 * The table file at `path`, for the table readers of src/ingest/ (`readRecords`, `readEntries`):
 * they parse, this reads (docs/architecture.md, "Layers").
 */
export function tableFile(path: string): TableFile {
  return { path, check: () => assertReadable(path), chunks: () => fileChunks(path), bytes: () => readFile(path) };
}
