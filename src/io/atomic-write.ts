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
  const stream = createWriteStream(tmp);
  // Lines are encoded straight into a buffer (no joined string in between); a full buffer is
  // handed to the stream and a new one started.
  const SIZE = 1 << 20;
  let buffer = Buffer.allocUnsafe(SIZE);
  let used = 0;
  /** Hands `chunk` to the stream; a promise when the stream asks to wait for it to drain. */
  const send = (chunk: Buffer): Promise<void> | undefined =>
    stream.write(chunk) ? undefined : new Promise<void>((resolve) => stream.once('drain', () => resolve()));
  const flush = (): Promise<void> | undefined => {
    if (used === 0) return undefined;
    const chunk = buffer.subarray(0, used);
    buffer = Buffer.allocUnsafe(SIZE);
    used = 0;
    return send(chunk);
  };
  return {
    write(line: string) {
      // A UTF-16 code unit takes at most 3 bytes of UTF-8.
      const most = 3 * line.length + 1;
      if (used + most <= SIZE) {
        used += buffer.write(line, used, 'utf8');
        buffer[used++] = 10;
        return undefined;
      }
      const flushed = flush();
      // A line longer than the buffer (a kept long text) goes out on its own.
      if (most > SIZE) return send(Buffer.from(`${line}\n`, 'utf8')) ?? flushed;
      used += buffer.write(line, used, 'utf8');
      buffer[used++] = 10;
      return flushed;
    },
    async commit() {
      await flush();
      await new Promise<void>((resolve, reject) => stream.end((error?: Error | null) => (error ? reject(error) : resolve())));
      await rename(tmp, path);
    },
    async abort() {
      // The file may still be opening: wait until the stream has closed it, or the removal
      // could run first and the open create the file after it.
      if (!stream.closed) {
        const closed = new Promise<void>((resolve) => stream.once('close', () => resolve()));
        stream.destroy();
        await closed;
      }
      await rm(tmp, { force: true });
    },
  };
}
