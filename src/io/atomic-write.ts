import { createWriteStream } from 'node:fs';
import { mkdir, rename, rm, writeFile } from 'node:fs/promises';
import { dirname } from 'node:path';
import { removeStaleTemporaries, temporaryPathFor, trackTemporary } from './own-temporaries.js';

/** Folders this process has already cleaned of stale temporaries. */
const cleaned = new Map<string, Promise<unknown>>();

/**
 * Creates `dir` when missing and, the first time this process writes there, removes the stale
 * temporaries that killed runs of this tool left in it (removeStaleTemporaries).
 */
async function prepareFolder(dir: string): Promise<void> {
  await mkdir(dir, { recursive: true });
  let done = cleaned.get(dir);
  if (!done) cleaned.set(dir, (done = removeStaleTemporaries(dir)));
  await done;
}

/**
 * Writes a whole file atomically: the content goes to a temporary file in the same folder
 * (`<path>.lexichron-<pid>-<random>.tmp`, see own-temporaries.ts), which is then renamed over
 * `path`. The first write of a process into a folder removes stale temporaries there. A failed write leaves nothing at `path`; the temporary is removed on failure, and when
 * the process exits or is stopped by a signal before the rename.
 */
export async function writeFileAtomic(path: string, content: string | Uint8Array): Promise<void> {
  await prepareFolder(dirname(path));
  const tmp = temporaryPathFor(path);
  const tracked = trackTemporary(tmp);
  try {
    await writeFile(tmp, content);
    await rename(tmp, path);
  } catch (error) {
    await rm(tmp, { force: true });
    throw error;
  } finally {
    tracked.forget();
  }
}

/** A line writer that streams to a temporary file; `commit` renames it into place, `abort` removes it. */
export interface AtomicLineWriter {
  /** Appends a line; returns a promise only when the buffer was flushed and the stream needs draining. */
  write(line: string): Promise<void> | undefined;
  /**
   * Appends a line that `fill` writes as UTF-8 bytes into `buffer` from `at`, returning where it
   * ended (no line end: the writer adds it); `most` bounds its length in bytes. For lines built
   * from parts without joining them into a string first. Returns as `write` does.
   */
  writeWith(most: number, fill: (buffer: Buffer, at: number) => number): Promise<void> | undefined;
  /** Appends `text` as UTF-8, exactly as it is (no line end added). Returns as `write` does. */
  append(text: string): Promise<void> | undefined;
  commit(): Promise<void>;
  abort(): Promise<void>;
}

/**
 * Opens an AtomicLineWriter for `path`; each `write` appends the line and a `\n`, honouring
 * back-pressure. The temporary file is named as writeFileAtomic's and removed on exit or signal
 * when neither `commit` nor `abort` ran.
 */
export async function openAtomicLineWriter(path: string): Promise<AtomicLineWriter> {
  await prepareFolder(dirname(path));
  const tmp = temporaryPathFor(path);
  const tracked = trackTemporary(tmp);
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
  const writeWith = (most: number, fill: (buffer: Buffer, at: number) => number): Promise<void> | undefined => {
    if (used + most + 1 <= SIZE) {
      used = fill(buffer, used);
      buffer[used++] = 10;
      return undefined;
    }
    const flushed = flush();
    if (most + 1 > SIZE) {
      // A line longer than the buffer (a kept long text) goes out on its own.
      const own = Buffer.allocUnsafe(most + 1);
      const end = fill(own, 0);
      own[end] = 10;
      return send(own.subarray(0, end + 1)) ?? flushed;
    }
    used = fill(buffer, used);
    buffer[used++] = 10;
    return flushed;
  };
  return {
    // A UTF-16 code unit takes at most 3 bytes of UTF-8.
    write: (line: string) => writeWith(3 * line.length, (into, at) => at + into.write(line, at, 'utf8')),
    writeWith,
    append(text: string) {
      // Into the same buffer as lines (a UTF-16 code unit takes at most 3 bytes of UTF-8).
      const most = 3 * text.length;
      if (used + most <= SIZE) {
        used += buffer.write(text, used, 'utf8');
        return undefined;
      }
      const flushed = flush();
      if (most > SIZE) return send(Buffer.from(text, 'utf8')) ?? flushed;
      used += buffer.write(text, used, 'utf8');
      return flushed;
    },
    async commit() {
      await flush();
      await new Promise<void>((resolve, reject) => stream.end((error?: Error | null) => (error ? reject(error) : resolve())));
      await rename(tmp, path);
      tracked.forget();
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
      tracked.forget();
    },
  };
}
