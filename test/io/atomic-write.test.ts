import { mkdtempSync, readFileSync, rmSync, existsSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { openAtomicLineWriter } from '../../src/io/atomic-write.js';

const dirs: string[] = [];
afterEach(() => {
  for (const d of dirs.splice(0)) rmSync(d, { recursive: true, force: true });
});

function folder(): string {
  const d = mkdtempSync(join(tmpdir(), 'lexichron-write-'));
  dirs.push(d);
  return d;
}

describe('openAtomicLineWriter', () => {
  it('writes every line in order, across buffer boundaries, with multi-byte UTF-8 and lines longer than the buffer', async () => {
    const path = join(folder(), 'out.csv');
    const writer = await openAtomicLineWriter(path);
    const lines: string[] = [];
    for (let k = 0; k < 60_000; k++) lines.push(`${k},päivä 🐝 ${'x'.repeat(k % 37)},${k % 3 === 0 ? '日本語' : 'plain'}`);
    lines.splice(30_000, 0, '€'.repeat(700_000)); // 2.1 MB of UTF-8: more than one buffer
    lines.splice(40_000, 0, 'y'.repeat(400_000));
    for (const line of lines) {
      const pending = writer.write(line);
      if (pending) await pending;
    }
    expect(existsSync(path)).toBe(false); // nothing at the path before commit
    await writer.commit();
    expect(readFileSync(path, 'utf8')).toBe(lines.join('\n') + '\n');
  });

  it('abort leaves no file and no temporary file behind, even while the file is still being opened', async () => {
    const dir = folder();
    // Many writers aborted at once: their files are still opening when abort runs.
    const writers = await Promise.all(Array.from({ length: 40 }, (_, k) => openAtomicLineWriter(join(dir, `out${k}.csv`))));
    writers.forEach((w) => w.write('a,b'));
    await Promise.all(writers.map((w) => w.abort()));
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(readdirSync(dir)).toEqual([]);
  });
});
