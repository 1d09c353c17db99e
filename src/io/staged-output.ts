import { lstat, mkdir, readdir, rename, rm } from 'node:fs/promises';
import { join } from 'node:path';
import { stagingNameFor, trackTemporary } from './own-temporaries.js';

/** A staging folder whose files replace those of an output folder only on `commit`. */
export interface StagedOutput {
  /** The staging folder: write every output here, under the names it will have in the output folder. */
  readonly dir: string;
  /**
   * Moves every file of the staging folder into the output folder, replacing files of the same
   * name; sub-folders are merged file by file (other files in the output folder are left alone).
   * The `descriptions` (files that describe the others, such as `manifest.json`) are removed from
   * the output folder first and put in place last, in the order given: a process killed during
   * the commit leaves a folder without them, never one whose manifest describes another run's files.
   * `beforeStep`, if given, is called before each change to the output folder with its number
   * (0, 1, …): a test throws there to stop the commit at that exact step, as a killed process would.
   */
  commit(beforeStep?: (step: number) => void): Promise<void>;
  /** Removes the staging folder and everything in it; the output folder is unchanged. */
  abort(): Promise<void>;
}

/** Moves the entries of `from` into `to`, recursively for folders that exist in both; `skip` names are left in `from`. */
async function moveInto(from: string, to: string, skip: ReadonlySet<string>, step: () => void): Promise<void> {
  await mkdir(to, { recursive: true });
  const entries = await readdir(from, { withFileTypes: true });
  entries.sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
  for (const entry of entries) {
    if (skip.has(entry.name)) continue;
    const source = join(from, entry.name);
    const target = join(to, entry.name);
    const existing = await lstat(target).catch(() => undefined);
    if (entry.isDirectory() && existing?.isDirectory()) {
      await moveInto(source, target, new Set(), step);
      continue;
    }
    // A folder over a file, a file over a folder, or anything over a symbolic link: the old one goes.
    if (existing && (existing.isDirectory() || entry.isDirectory() || existing.isSymbolicLink())) {
      step();
      await rm(target, { recursive: true, force: true });
    }
    step();
    await rename(source, target);
  }
}

/**
 * Opens a staging folder inside `outDir` (`.lexichron-stage-<pid>-<random>`, so the final renames
 * stay on one file system and a killed run's folder is recognised and removed later by
 * removeStaleTemporaries). The folder is removed when the process exits or is stopped by a signal
 * before `commit`. The caller should hold the output folder's lock (lockOutputFolder).
 */
export async function openStagedOutput(outDir: string, descriptions: readonly string[] = []): Promise<StagedOutput> {
  const dir = join(outDir, stagingNameFor());
  await mkdir(dir, { recursive: true });
  const tracked = trackTemporary(dir);
  return {
    dir,
    async commit(beforeStep) {
      let steps = 0;
      const step = (): void => beforeStep?.(steps++);
      for (const name of descriptions) {
        step();
        await rm(join(outDir, name), { force: true });
      }
      await moveInto(dir, outDir, new Set(descriptions), step);
      for (const name of descriptions) {
        if (!(await lstat(join(dir, name)).catch(() => undefined))) continue;
        step();
        await rename(join(dir, name), join(outDir, name));
      }
      await rm(dir, { recursive: true, force: true });
      tracked.forget();
    },
    async abort() {
      await rm(dir, { recursive: true, force: true });
      tracked.forget();
    },
  };
}
