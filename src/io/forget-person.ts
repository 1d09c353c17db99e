import { createReadStream } from 'node:fs';
import { lstat, readdir, readFile, rm, stat } from 'node:fs/promises';
import { basename, extname, join, relative } from 'node:path';
import { createInterface } from 'node:readline';
import { usageError } from '../errors.js';
import { createPersonRowFilter } from '../privacy/create-person-row-filter.js';
import { removePersonFromJson } from '../privacy/remove-person-from-json.js';
import { openAtomicLineWriter, writeFileAtomic } from './atomic-write.js';
import { fileDigest } from './run-score.js';

/** What to forget and how to record it. */
export interface ForgetOptions {
  /** Every form under which the person appears in the outputs (the raw id and/or its pseudonym). */
  ids: readonly string[];
  /** What the manifest records for the removal: a pseudonymous id, never the raw id. */
  record: string;
  /** Time of the removal (RFC 3339), passed in by the caller. */
  at: string;
  /** Record nothing in the manifest when no output held the person. */
  onlyIfFound?: boolean;
}

/** What forgetPerson did, with paths relative to the study folder. */
export interface ForgetResult {
  /** Files rewritten without the person, with the rows/elements removed. */
  changed: Array<{ file: string; removed: number }>;
  /** Files removed because they are about the person alone (a name holding the id, or a JSON document of the person). */
  deleted: string[];
  /** Files the tool cannot edit (HTML, SVG, text…) that still mention an id: regenerate or delete them. */
  stale: string[];
}

const TEXT_SCAN = new Set(['.html', '.htm', '.svg', '.txt', '.md', '.xml']);
const MAX_SCAN_BYTES = 256 * 1024 * 1024;

async function* walk(dir: string): AsyncGenerator<string> {
  const entries = await readdir(dir, { withFileTypes: true });
  entries.sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
  for (const entry of entries) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) yield* walk(path);
    else if (entry.isFile()) yield path;
  }
}

function idPattern(ids: readonly string[]): RegExp {
  const escaped = ids.map((id) => id.replace(/[.*+?^${}()|[\]\\]/g, '\\$&'));
  return new RegExp(`(?<![\\p{L}\\p{N}_])(?:${escaped.join('|')})(?![\\p{L}\\p{N}_])`, 'u');
}

/** Rewrites a CSV/TSV/JSON Lines file without the person's rows; returns the rows removed (0 leaves the file untouched). */
async function filterLines(path: string, format: 'csv' | 'tsv' | 'jsonl', ids: ReadonlySet<string>, mentions: RegExp): Promise<number> {
  const filter = createPersonRowFilter(ids, format, mentions);
  const writer = await openAtomicLineWriter(path);
  const input = createReadStream(path, { encoding: 'utf8' });
  try {
    const lines = createInterface({ input, crlfDelay: Infinity });
    for await (const line of lines) {
      for (const out of filter.push(line)) await writer.write(out);
    }
    for (const out of filter.end()) await writer.write(out);
  } catch (error) {
    await writer.abort();
    throw error;
  } finally {
    input.destroy();
  }
  if (filter.removed === 0) {
    await writer.abort();
    return 0;
  }
  await writer.commit();
  return filter.removed;
}

/**
 * Removes a person from every output of a study folder (withdrawal of consent), then records
 * the removal in the folder's `manifest.json` under `forgotten` as `{person: record, at, files}`.
 *
 * - CSV/TSV with a `person` column and JSON Lines: the person's rows are removed (createPersonRowFilter),
 *   other lines stay byte for byte; files without a match are not touched;
 * - JSON: the person is removed wherever listed (removePersonFromJson); a JSON document that is
 *   about the person alone is deleted;
 * - files whose name holds one of the ids as a whole word are deleted;
 * - HTML, SVG, Markdown, XML and text files cannot be edited safely: those that still mention an id are
 *   returned as `stale` (regenerate the report, or delete them).
 * Every rewrite is atomic. The raw id is never written; the caller passes the pseudonymous `record`.
 */
export async function forgetPerson(dir: string, options: ForgetOptions): Promise<ForgetResult> {
  const info = await stat(dir).catch(() => undefined);
  if (!info?.isDirectory()) throw usageError(`Cannot forget a person in \`${dir}\`: it is not a folder; pass the study's output folder with --study DIR.`);
  const ids = new Set(options.ids.map((id) => id.trim()).filter((id) => id !== ''));
  if (ids.size === 0) throw usageError('Cannot forget a person without an id; pass the person id as it appears in the study.');
  const pattern = idPattern([...ids]);
  const result: ForgetResult = { changed: [], deleted: [], stale: [] };
  const manifestPath = join(dir, 'manifest.json');
  for await (const path of walk(dir)) {
    const rel = relative(dir, path).split('\\').join('/');
    const ext = extname(path).toLowerCase();
    if ((await lstat(path)).isSymbolicLink()) continue;
    if (pattern.test(basename(path, extname(path)))) {
      await rm(path, { force: true });
      result.deleted.push(rel);
      continue;
    }
    if (ext === '.csv' || ext === '.tsv' || ext === '.jsonl' || ext === '.ndjson') {
      const removed = await filterLines(path, ext === '.tsv' ? 'tsv' : ext === '.csv' ? 'csv' : 'jsonl', ids, pattern);
      if (removed > 0) result.changed.push({ file: rel, removed });
      continue;
    }
    if (ext === '.json') {
      let parsed: unknown;
      try {
        parsed = JSON.parse(await readFile(path, 'utf8'));
      } catch {
        continue; // not JSON after all: leave it
      }
      const removal = removePersonFromJson(parsed, ids);
      if (removal.wholeDocument) {
        await rm(path, { force: true });
        result.deleted.push(rel);
      } else if (removal.removed > 0) {
        if (path === manifestPath) continue; // rewritten below, with the record
        await writeFileAtomic(path, `${JSON.stringify(removal.value, null, 2)}\n`);
        result.changed.push({ file: rel, removed: removal.removed });
      }
      continue;
    }
    if (TEXT_SCAN.has(ext) && (await stat(path)).size <= MAX_SCAN_BYTES) {
      if (pattern.test(await readFile(path, 'utf8'))) result.stale.push(rel);
    }
  }
  if (options.onlyIfFound && result.changed.length === 0 && result.deleted.length === 0) return result;
  let manifest: Record<string, unknown> = {};
  try {
    const parsed = JSON.parse(await readFile(manifestPath, 'utf8')) as unknown;
    if (parsed !== null && typeof parsed === 'object' && !Array.isArray(parsed)) {
      const { forgotten: earlier, ...rest } = parsed as Record<string, unknown>;
      const removal = removePersonFromJson(rest, ids);
      if (removal.removed > 0) result.changed.push({ file: 'manifest.json', removed: removal.removed });
      manifest = removal.value as Record<string, unknown>;
      if (earlier !== undefined) manifest.forgotten = earlier;
    }
  } catch {
    // no manifest yet: start one that holds the record
  }
  // Outputs listed in the manifest: fresh hashes for rewritten files, deleted files dropped.
  if (Array.isArray(manifest.outputs)) {
    const changed = new Set(result.changed.map((c) => c.file));
    const deleted = new Set(result.deleted);
    const outputs: unknown[] = [];
    for (const output of manifest.outputs as Array<{ path?: string; sha256?: string; bytes?: number }>) {
      if (typeof output?.path !== 'string' || deleted.has(output.path)) continue;
      if (changed.has(output.path) && output.sha256 !== undefined) {
        const d = await fileDigest(join(dir, output.path));
        outputs.push({ ...output, sha256: d.sha256, bytes: d.bytes });
      } else outputs.push(output);
    }
    manifest.outputs = outputs;
  }
  const forgotten = Array.isArray(manifest.forgotten) ? (manifest.forgotten as unknown[]) : [];
  forgotten.push({ person: options.record, at: options.at, files: [...result.changed.map((c) => c.file), ...result.deleted].sort() });
  manifest.forgotten = forgotten;
  await writeFileAtomic(manifestPath, `${JSON.stringify(manifest, null, 2)}\n`);
  return result;
}
