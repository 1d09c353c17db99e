import { readFile } from 'node:fs/promises';
import { dataPackage, type TableResource } from '../report/data-dictionary.js';
import { writeFileAtomic } from './atomic-write.js';

/**
 * Writes `path` (a datapackage.json) with `resources`, keeping the resources of an existing
 * package there that describe other files, so that commands run one after another in the same
 * folder add to one package instead of replacing it.
 */
export async function mergeDataPackage(path: string, name: string, title: string, resources: readonly TableResource[]): Promise<void> {
  await writeFileAtomic(path, await mergedDataPackage(path, name, title, resources));
}

/** The text mergeDataPackage writes (for callers that write it together with other files). */
export async function mergedDataPackage(path: string, name: string, title: string, resources: readonly TableResource[]): Promise<string> {
  let kept: TableResource[] = [];
  try {
    const existing = JSON.parse(await readFile(path, 'utf8')) as { resources?: TableResource[] };
    const paths = new Set(resources.map((r) => r.path));
    const names = new Set(resources.map((r) => r.name));
    kept = (existing.resources ?? []).filter((r) => !paths.has(r.path) && !names.has(r.name));
  } catch {
    // no package yet (or not JSON): start a new one
  }
  return JSON.stringify(dataPackage(name, title, [...kept, ...resources]), null, 2) + '\n';
}
