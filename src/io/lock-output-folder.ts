import { mkdir, open, readFile, rm, stat } from 'node:fs/promises';
import { join } from 'node:path';
import { usageError } from '../errors.js';
import { processRuns, trackTemporary } from './own-temporaries.js';

/** Name of the lock file in an output folder. */
export const LOCK_NAME = '.lexichron-lock';

/** A held lock; `release` removes it (also removed when the process exits or, from the command line, is stopped by a signal). */
export interface FolderLock {
  release(): Promise<void>;
}

/** Age after which a lock file that cannot be read (its writer died between creating and filling it) counts as stale. */
const UNREADABLE_STALE_MS = 60_000;

/** The process holding the lock at `path`: its pid and command, `undefined` when the lock is stale (its process is gone). */
async function holder(path: string): Promise<{ pid?: number; command?: string } | undefined> {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch {
    return undefined; // removed in between: free
  }
  try {
    const { pid, command } = JSON.parse(text) as { pid?: unknown; command?: unknown };
    if (typeof pid === 'number' && Number.isInteger(pid) && pid > 0) return processRuns(pid) ? { pid, command: typeof command === 'string' ? command : undefined } : undefined;
  } catch {
    // being written, or damaged: decided by its age below
  }
  const age = Date.now() - (await stat(path).catch(() => ({ mtimeMs: 0 }))).mtimeMs;
  return age < UNREADABLE_STALE_MS ? {} : undefined;
}

/**
 * Takes the exclusive lock of an output folder: creates `<dir>/.lexichron-lock` (O_EXCL, so that
 * of two processes only one succeeds) holding this process's id and `command`. A lock whose
 * process no longer runs (a killed run) is taken over. When another running process holds it,
 * throws a usage error (exit code 2) naming that process; nothing in the folder is changed.
 */
export async function lockOutputFolder(dir: string, command: string): Promise<FolderLock> {
  await mkdir(dir, { recursive: true });
  const path = join(dir, LOCK_NAME);
  for (let attempt = 0; attempt < 3; attempt++) {
    try {
      const handle = await open(path, 'wx');
      const tracked = trackTemporary(path);
      try {
        await handle.writeFile(JSON.stringify({ pid: process.pid, command, started: new Date().toISOString() }) + '\n');
      } finally {
        await handle.close();
      }
      return {
        async release() {
          tracked.forget();
          await rm(path, { force: true });
        },
      };
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error;
    }
    const held = await holder(path);
    if (held) {
      const who = held.pid !== undefined ? `process ${held.pid}${held.command ? `, \`${held.command}\`` : ''}` : 'a process that is starting';
      throw usageError(`Cannot write to \`${dir}\`: another lexichron command (${who}) is writing there. Wait until it has finished, or choose another output folder; if no such process runs, remove \`${path}\`.`);
    }
    await rm(path, { force: true }); // stale: its process is gone
  }
  throw usageError(`Cannot take the lock \`${path}\`: other processes keep taking it; try again.`);
}
