import { readFile } from 'node:fs/promises';
import { usageError } from '../errors.js';
import { parseStudy, type Study } from '../study/parse-study.js';

/** Reads and validates a study file; throws a usage error listing every problem with its JSON path. */
export async function readStudy(path: string): Promise<Study> {
  let json: unknown;
  try {
    json = JSON.parse(await readFile(path, 'utf8'));
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'ENOENT') throw usageError(`Cannot read study file \`${path}\`: no such file; check the path.`);
    throw usageError(`Cannot read study file \`${path}\`: not valid JSON (${(error as Error).message}).`);
  }
  const { study, problems } = parseStudy(json);
  if (!study) throw usageError(`Study file \`${path}\` has ${problems.length} problem${problems.length === 1 ? '' : 's'}:\n${problems.map((p) => `  ${p.path}: ${p.message}`).join('\n')}`);
  return study;
}
