import { describe, expect, it, vi } from 'vitest';
import { buildProgram, main } from '../../src/cli/main.js';
import { TOOL_VERSION } from '../../src/version.js';

describe('lexichron --version', () => {
  it('prints the version and exits 0 without registering any command', async () => {
    const written: string[] = [];
    const spy = vi.spyOn(process.stdout, 'write').mockImplementation((chunk: string | Uint8Array) => {
      written.push(String(chunk));
      return true;
    });
    try {
      expect(await main(['node', 'lexichron', '--version'])).toBe(0);
      expect(await main(['node', 'lexichron', '-V'])).toBe(0);
    } finally {
      spy.mockRestore();
    }
    expect(written.join('')).toBe(`${TOOL_VERSION}\n${TOOL_VERSION}\n`);
    expect((await buildProgram('--version')).commands).toHaveLength(0);
    expect((await buildProgram('--help')).commands.map((c) => c.name())).toContain('score');
  });
});
