import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll } from 'vitest';

/**
 * A temporary folder for one test file, removed after its tests. `write(name, content)` returns
 * the path of a file written there (strings as UTF-8, buffers byte for byte).
 */
export function tempFolder(prefix = 'lexichron-test-'): { dir: string; write: (name: string, content: string | Buffer) => string; path: (name: string) => string } {
  const dir = mkdtempSync(join(tmpdir(), prefix));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  return {
    dir,
    path: (name) => join(dir, name),
    write: (name, content) => {
      const path = join(dir, name);
      writeFileSync(path, content);
      return path;
    },
  };
}

/** Collects every item of an async iterable. */
export async function collect<T>(items: AsyncIterable<T>): Promise<T[]> {
  const out: T[] = [];
  for await (const item of items) out.push(item);
  return out;
}
