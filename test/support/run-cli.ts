import { vi } from 'vitest';
import { main } from '../../src/cli/main.js';

/** Runs the command line in this process and returns its exit code and what it wrote to stderr. */
export async function runCli(...args: string[]): Promise<{ code: number; stderr: string }> {
  let stderr = '';
  const spy = vi.spyOn(process.stderr, 'write').mockImplementation((chunk: string | Uint8Array) => {
    stderr += String(chunk);
    return true;
  });
  try {
    return { code: await main(['node', 'lexichron', ...args]), stderr };
  } finally {
    spy.mockRestore();
    process.exitCode = undefined;
  }
}
