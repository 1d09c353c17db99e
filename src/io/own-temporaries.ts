import { readdir, rm } from 'node:fs/promises';
import { rmSync } from 'node:fs';
import { join } from 'node:path';

/**
 * Names of this tool's temporary files and staging folders: `<name>.lexichron-<pid>-<random>.tmp`
 * beside a file being written, `.lexichron-stage-<pid>-<random>` for a run's staging folder and
 * `.lexichron-lock` for an output folder's lock. The process id tells whether the writer still runs.
 */
export const TEMPORARY_PATTERN = /\.lexichron-(\d+)-[a-z0-9]+\.tmp$|^\.lexichron-stage-(\d+)-[a-z0-9]+$/;

/** A fresh random suffix for a temporary name. */
function randomSuffix(): string {
  return Math.random().toString(36).slice(2, 10) || '0';
}

/** The temporary path of this process for writing `path` (same folder, so the final rename is atomic). */
export function temporaryPathFor(path: string): string {
  return `${path}.lexichron-${process.pid}-${randomSuffix()}.tmp`;
}

/** The name of a staging folder of this process. */
export function stagingNameFor(): string {
  return `.lexichron-stage-${process.pid}-${randomSuffix()}`;
}

/** The process id that made a temporary name of this tool, or undefined for any other name. */
export function temporaryOwner(name: string): number | undefined {
  const match = TEMPORARY_PATTERN.exec(name);
  if (!match) return undefined;
  return Number(match[1] ?? match[2]);
}

/** Whether a process with this id runs (kill with signal 0 only checks; EPERM means it runs as another user). */
export function processRuns(pid: number): boolean {
  if (pid === process.pid) return true;
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

const live = new Set<string>();
let exitHookInstalled = false;
let signalHandlersInstalled = false;

/** Removes this process's live temporaries at once (synchronously: usable on exit and on signals). */
export function removeOwnTemporariesNow(): void {
  for (const path of live) {
    try {
      rmSync(path, { recursive: true, force: true });
    } catch {
      // best effort while exiting
    }
  }
  live.clear();
}

/**
 * Makes SIGINT, SIGTERM and SIGHUP remove this process's live temporaries (and release its
 * locks, which are tracked the same way) before it ends with 128 + the signal's number, as it
 * would without a handler. Called by the command line; a program using the library decides for
 * itself (removeOwnTemporariesNow is there for its own handlers).
 */
export function removeTemporariesOnSignals(): void {
  if (signalHandlersInstalled) return;
  signalHandlersInstalled = true;
  for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) {
    // Only when nobody else handles the signal: then the default would end the process without 'exit'.
    if (process.listenerCount(signal) > 0) continue;
    process.once(signal, () => {
      removeOwnTemporariesNow();
      process.exit(128 + (signal === 'SIGINT' ? 2 : signal === 'SIGTERM' ? 15 : 1));
    });
  }
}

/**
 * Records a temporary file or folder of this process, so that it is removed when the process
 * exits (or, with removeTemporariesOnSignals, is stopped by a signal) before it was committed; `forget` it once it
 * was renamed into place or removed. (SIGKILL cannot be caught: removeStaleTemporaries cleans up
 * after it at the next start.)
 */
export function trackTemporary(path: string): { forget: () => void } {
  if (!exitHookInstalled) {
    exitHookInstalled = true;
    process.once('exit', removeOwnTemporariesNow);
  }
  live.add(path);
  return { forget: () => void live.delete(path) };
}

/**
 * Removes the temporaries of this tool in `dir` (and, with `recursive`, in its sub-folders) whose
 * process no longer runs: what a killed or crashed run left behind. Temporaries of running
 * processes (another run writing there) and every other file are left alone; symbolic links are
 * never followed. Returns the paths removed.
 */
export async function removeStaleTemporaries(dir: string, options: { recursive?: boolean } = {}): Promise<string[]> {
  const removed: string[] = [];
  let entries;
  try {
    entries = await readdir(dir, { withFileTypes: true });
  } catch {
    return removed; // no folder yet: nothing to clean
  }
  for (const entry of entries) {
    const path = join(dir, entry.name);
    const owner = temporaryOwner(entry.name);
    if (owner !== undefined && !entry.isSymbolicLink()) {
      if (!processRuns(owner)) {
        await rm(path, { recursive: true, force: true });
        removed.push(path);
      }
      continue;
    }
    if (options.recursive && entry.isDirectory()) removed.push(...(await removeStaleTemporaries(path, options)));
  }
  return removed;
}
