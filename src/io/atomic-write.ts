import { createWriteStream } from 'node:fs';
import { mkdir, rename, rm, writeFile } from 'node:fs/promises';
import { dirname } from 'node:path';

/** Temporary path beside `path` (same folder, so the final rename is atomic). */
function temporaryPath(path: string): string {
  return `${path}.${process.pid}.${Math.random().toString(36).slice(2)}.tmp`;
}

/**
 * Writes a whole file atomically: the content goes to a temporary file in the same folder,
 * which is then renamed over `path`. A failed write leaves nothing at `path`.
 */
export async function writeFileAtomic(path: string, content: string | Uint8Array): Promise<void> {
  await mkdir(dirname(path), { recursive: true });
  const tmp = temporaryPath(path);
  try {
    await writeFile(tmp, content);
    await rename(tmp, path);
  } catch (error) {
    await rm(tmp, { force: true });
    throw error;
  }
}

/** A line writer that streams to a temporary file; `commit` renames it into place, `abort` removes it. */
export interface AtomicLineWriter {
  /** Appends a line; returns a promise only when the buffer was flushed and the stream needs draining. */
  write(line: string): Promise<void> | undefined;
  commit(): Promise<void>;
  abort(): Promise<void>;
}

/** Opens an AtomicLineWriter for `path`; each `write` appends the line and a `\n`, honouring back-pressure. */
export async function openAtomicLineWriter(path: string): Promise<AtomicLineWriter> {
  await mkdir(dirname(path), { recursive: true });
  const tmp = temporaryPath(path);
  const stream = createWriteStream(tmp, { encoding: 'utf8' });
  let buffer: string[] = [];
  let size = 0;
  const flush = async (): Promise<void> => {
    if (buffer.length === 0) return;
    const chunk = buffer.join('');
    buffer = [];
    size = 0;
    if (!stream.write(chunk)) await new Promise<void>((resolve) => stream.once('drain', () => resolve()));
  };
  return {
    write(line: string) {
      buffer.push(line, '\n');
      size += line.length + 1;
      return size > 1 << 18 ? flush() : undefined;
    },
    async commit() {
      await flush();
      await new Promise<void>((resolve, reject) => stream.end((error?: Error | null) => (error ? reject(error) : resolve())));
      await rename(tmp, path);
    },
    async abort() {
      stream.destroy();
      await rm(tmp, { force: true });
    },
  };
}
