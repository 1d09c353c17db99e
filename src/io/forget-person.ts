import { createReadStream } from 'node:fs';
import { readdir, readFile, rm, stat } from 'node:fs/promises';
import { extname, join, relative } from 'node:path';
import { StringDecoder } from 'node:string_decoder';
import { usageError } from '../errors.js';
import { createPersonRowFilter } from '../privacy/create-person-row-filter.js';
import { removePersonFromJson } from '../privacy/remove-person-from-json.js';
import { openAtomicLineWriter, writeFileAtomic, type AtomicLineWriter } from './atomic-write.js';
import { LOCK_NAME, lockOutputFolder } from './lock-output-folder.js';
import { processRuns, temporaryOwner } from './own-temporaries.js';
import { fileDigest } from './run-score.js';

/** What to forget and how to record it. */
export interface ForgetOptions {
  /** Every form under which the person appears in the outputs as a person value (the pseudonym when the study used a key). */
  ids: readonly string[];
  /** What the manifest records for the removal: a pseudonymous id, never the raw id. */
  record: string;
  /** Time of the removal (RFC 3339), passed in by the caller. */
  at: string;
}

/** What forgetPerson did, with paths relative to the study folder. */
export interface ForgetResult {
  /** Whether any output held the person; when false, nothing was changed or recorded. */
  found: boolean;
  /** Files rewritten without the person, with the rows/elements removed. */
  changed: Array<{ file: string; removed: number }>;
  /** JSON documents removed because they are about the person alone (a top-level `person` of the id). */
  deleted: string[];
  /** Other files that mention an id as a word (reports, plots, notes, unknown formats): regenerate or delete them. */
  stale: string[];
  /** Symbolic links in the folder: not followed, so whatever they point to was neither read nor changed. */
  symlinks: string[];
  /** Temporary files and staging folders that killed runs of this tool left (removed: they may hold the person's rows). */
  temporaries: string[];
}

const TABLES: Record<string, 'csv' | 'tsv' | 'jsonl'> = { '.csv': 'csv', '.tsv': 'tsv', '.jsonl': 'jsonl', '.ndjson': 'jsonl' };

/** Every entry under `dir` (sorted), without following symbolic links. */
async function* walk(dir: string): AsyncGenerator<{ path: string; kind: 'file' | 'link' | 'temporary' | 'other' }> {
  const entries = await readdir(dir, { withFileTypes: true });
  entries.sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
  for (const entry of entries) {
    const path = join(dir, entry.name);
    if (entry.isSymbolicLink()) yield { path, kind: 'link' };
    else if (temporaryOwner(entry.name) !== undefined) yield { path, kind: 'temporary' };
    else if (entry.isDirectory()) yield* walk(path);
    else if (entry.isFile()) yield { path, kind: entry.name === LOCK_NAME ? 'other' : 'file' };
    else yield { path, kind: 'other' };
  }
}

function idPattern(ids: readonly string[]): RegExp {
  const escaped = ids.map((id) => id.replace(/[.*+?^${}()|[\]\\]/g, '\\$&'));
  return new RegExp(`(?<![\\p{L}\\p{N}_])(?:${escaped.join('|')})(?![\\p{L}\\p{N}_])`, 'u');
}

/** Whether a file mentions `pattern`, read as UTF-8 in chunks of any size (a window of `overlap` characters spans chunk ends). */
async function fileMentions(path: string, pattern: RegExp, overlap: number): Promise<boolean> {
  const decoder = new StringDecoder('utf8');
  let tail = '';
  for await (const chunk of createReadStream(path)) {
    const text = tail + decoder.write(chunk as Buffer);
    if (pattern.test(text)) return true;
    tail = text.slice(-overlap);
  }
  return pattern.test(tail + decoder.end());
}

/** A table rewritten without the person into a temporary file, not yet in place. */
interface PendingTable {
  file: string;
  removed: number;
  writer: AtomicLineWriter;
}

/** Writes a CSV/TSV/JSON Lines file without the person's rows to a temporary; returns undefined (and keeps nothing) when no row is the person's. */
async function filterTable(path: string, file: string, format: 'csv' | 'tsv' | 'jsonl', ids: ReadonlySet<string>): Promise<PendingTable | undefined> {
  const filter = createPersonRowFilter(ids, format);
  const writer = await openAtomicLineWriter(path);
  const input = createReadStream(path, { encoding: 'utf8' });
  try {
    for await (const text of input as AsyncIterable<string>) await writer.append(filter.push(text));
    await writer.append(filter.end());
  } catch (error) {
    await writer.abort();
    throw error;
  } finally {
    input.destroy();
  }
  if (filter.removed === 0) {
    await writer.abort();
    return undefined;
  }
  return { file, removed: filter.removed, writer };
}

/**
 * Removes a person from every output of a study folder (withdrawal of consent, the right to
 * erasure of GDPR Art. 17), under the folder's lock (lockOutputFolder), and records the removal in
 * its `manifest.json` under `forgotten` as `{person: record, at, files}`. Only person values count:
 *
 * - CSV/TSV: rows whose `person` column is one of `ids`; in a diagnostics table without one, rows
 *   whose message names the person as this tool's diagnostics do; JSON Lines: objects whose `person`
 *   is one of them. Other lines stay byte for byte;
 * - JSON: objects whose `person` is one of them, and entries of a `persons` list (removePersonFromJson);
 *   a JSON document whose top-level `person` is the id is deleted;
 * - every other regular file is scanned (streamed, any size) and returned as `stale` when it
 *   mentions an id as a word; symbolic links are listed, never followed; no file is ever deleted
 *   because of its name.
 *
 * When no output holds the person, nothing is changed or recorded (`found` is false). Otherwise
 * all rewrites are prepared in temporary files first and then renamed into place; temporaries that
 * killed runs left are removed; the manifest keeps everything else and gets fresh SHA-256 and sizes
 * for every file it lists that was rewritten (deleted files are dropped from it). The raw id is
 * never written; the caller passes the pseudonymous `record`.
 */
export async function forgetPerson(dir: string, options: ForgetOptions): Promise<ForgetResult> {
  const info = await stat(dir).catch(() => undefined);
  if (!info?.isDirectory()) throw usageError(`Cannot forget a person in \`${dir}\`: it is not a folder; pass the study's output folder with --study DIR.`);
  const ids = new Set(options.ids.map((id) => id.trim()).filter((id) => id !== ''));
  if (ids.size === 0) throw usageError('Cannot forget a person without an id; pass the person id as it appears in the study.');
  const lock = await lockOutputFolder(dir, 'lexichron forget');
  try {
    return await forgetLocked(dir, ids, options);
  } finally {
    await lock.release();
  }
}

async function forgetLocked(dir: string, ids: ReadonlySet<string>, options: ForgetOptions): Promise<ForgetResult> {
  const pattern = idPattern([...ids]);
  const overlap = Math.max(...[...ids].map((id) => id.length)) + 2;
  const result: ForgetResult = { found: false, changed: [], deleted: [], stale: [], symlinks: [], temporaries: [] };
  const manifestPath = join(dir, 'manifest.json');
  const tables: PendingTable[] = [];
  const documents: Array<{ path: string; file: string; removed: number; content: string }> = [];
  const deletions: Array<{ path: string; file: string }> = [];
  const temporaries: Array<{ path: string; file: string }> = [];
  const rel = (path: string): string => relative(dir, path).split('\\').join('/');
  try {
    for await (const { path, kind } of walk(dir)) {
      const file = rel(path);
      if (kind === 'link') {
        result.symlinks.push(file);
        continue;
      }
      if (kind === 'temporary') {
        const owner = temporaryOwner(path.slice(path.lastIndexOf('/') + 1)) as number;
        if (processRuns(owner)) result.stale.push(file); // being written by a command that is not done yet
        else temporaries.push({ path, file });
        continue;
      }
      if (kind !== 'file' || path === manifestPath) continue;
      const ext = extname(path).toLowerCase();
      const format = TABLES[ext];
      if (format) {
        const pending = await filterTable(path, file, format, ids);
        if (pending) tables.push(pending);
        continue;
      }
      if (ext === '.json') {
        let parsed: unknown;
        try {
          parsed = JSON.parse(await readFile(path, 'utf8'));
        } catch {
          parsed = undefined; // not JSON after all: scanned as text below
        }
        if (parsed !== undefined) {
          const removal = removePersonFromJson(parsed, ids);
          if (removal.wholeDocument) deletions.push({ path, file });
          else if (removal.removed > 0) documents.push({ path, file, removed: removal.removed, content: `${JSON.stringify(removal.value, null, 2)}\n` });
          continue;
        }
      }
      // Any other file: a table without an extension, a report, a plot, notes. Checked, not edited.
      if (await fileMentions(path, pattern, overlap)) result.stale.push(file);
    }
  } catch (error) {
    await Promise.all(tables.map((t) => t.writer.abort()));
    throw error;
  }
  result.found = tables.length + documents.length + deletions.length > 0;
  if (!result.found) return result;

  // The person is there: put every rewrite in place, then the manifest.
  for (const t of tables) {
    await t.writer.commit();
    result.changed.push({ file: t.file, removed: t.removed });
  }
  for (const d of documents) {
    await writeFileAtomic(d.path, d.content);
    result.changed.push({ file: d.file, removed: d.removed });
  }
  for (const d of deletions) {
    await rm(d.path, { force: true });
    result.deleted.push(d.file);
  }
  for (const t of temporaries) {
    await rm(t.path, { recursive: true, force: true });
    result.temporaries.push(t.file);
  }
  result.changed.sort((a, b) => (a.file < b.file ? -1 : a.file > b.file ? 1 : 0));
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
    // no manifest (or not JSON): start one that holds the record
  }
  // Outputs listed in the manifest: fresh hashes and sizes for rewritten files, deleted files dropped.
  if (Array.isArray(manifest.outputs)) {
    const changed = new Set(result.changed.map((c) => c.file));
    const deleted = new Set(result.deleted);
    const outputs: unknown[] = [];
    for (const output of manifest.outputs as Array<{ path?: string; sha256?: string; bytes?: number }>) {
      if (typeof output?.path === 'string' && deleted.has(output.path)) continue;
      if (typeof output?.path === 'string' && changed.has(output.path) && output.sha256 !== undefined) {
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
