import { lstat, realpath } from 'node:fs/promises';
import { usageError } from '../errors.js';

/**
 * Refuses an output folder that is a symbolic link, unless `allowSymlinks`: outputs (participants'
 * scores, possibly their text) would be written wherever the link points, which a study file or a
 * shared folder can change without the researcher noticing. A folder that does not exist yet is fine.
 */
export async function checkOutputFolder(dir: string, allowSymlinks = false): Promise<void> {
  const info = await lstat(dir).catch(() => undefined);
  if (!info?.isSymbolicLink() || allowSymlinks) return;
  const target = await realpath(dir).catch(() => '(a missing target)');
  throw usageError(`Cannot write to \`${dir}\`: the output folder is a symbolic link to \`${target}\`, so outputs would land wherever it points. Give the real folder, or pass --allow-symlinks if that is intended.`);
}
