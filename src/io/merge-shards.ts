import { createHash } from 'node:crypto';
import { copyFile, readFile } from 'node:fs/promises';
import { basename, dirname, join, resolve } from 'node:path';
import { LexichronError, usageError } from '../errors.js';
import { readEntryBatches } from '../ingest/read-entries.js';
import { tableFile } from './table-file.js';
import { auditEntryFeeder, DEFAULT_SEED, finishStudy, prepareStudy, readStudy, SHARD_MANIFEST, studyAuditors, type PreparedStudy, type RunStudyOptions, type RunStudyResult } from '../pipeline.js';
import type { Manifest } from '../report/manifest.js';
import type { ScoreColumn } from '../score/score-columns.js';
import { checkShardSet, type ShardRecord } from '../shard/check-shard-set.js';
import type { ShardSpec } from '../shard/shard-of-person.js';
import type { LexiconRef, RawEntry, Reconciliation } from '../types.js';
import { openAtomicLineWriter, writeFileAtomic } from './atomic-write.js';
import { checkOutputFolder } from './check-output-folder.js';
import { lockOutputFolder } from './lock-output-folder.js';
import { removeStaleTemporaries } from './own-temporaries.js';
import { readCsvRecords } from './read-csv-records.js';
import { fileDigest, type InputRecord, type RunScoreResult } from './run-score.js';
import { openStagedOutput } from './staged-output.js';
import { studyInput } from './study-input.js';

/** Options of mergeShards. */
export interface MergeShardsOptions extends Pick<RunStudyOptions, 'now' | 'stages' | 'env' | 'allowSymlinks'> {
  /** The shards' output folders (each written by `lexichron run STUDY --shard I/N`). */
  shardDirs: string[];
  /** Output folder (default: the study file's `out`). */
  out?: string;
}

interface ShardFolder {
  dir: string;
  manifest: Manifest;
  shard: ShardSpec;
  studyFile: { path: string; studyPath: string; sha256: string };
}

/** Reads a shard folder's shard.json, with a message naming the folder when it is not one. */
async function readShardFolder(dir: string): Promise<ShardFolder> {
  let manifest: Manifest;
  try {
    manifest = JSON.parse(await readFile(join(dir, SHARD_MANIFEST), 'utf8')) as Manifest;
  } catch (error) {
    const why = (error as NodeJS.ErrnoException).code === 'ENOENT' ? `has no ${SHARD_MANIFEST}` : `has a ${SHARD_MANIFEST} that is not valid JSON`;
    throw usageError(`\`${dir}\` ${why}, so it is not the finished output folder of \`lexichron run STUDY --shard I/N\`; run that shard (again) and give its folder.`);
  }
  const shard = manifest.parameters?.shard as ShardSpec | undefined;
  const studyFile = manifest.parameters?.studyFile as ShardFolder['studyFile'] | undefined;
  if (!shard || !studyFile || !Number.isInteger(shard.index) || !Number.isInteger(shard.count)) {
    throw usageError(`\`${dir}/${SHARD_MANIFEST}\` does not say which shard it is; run that shard again with \`lexichron run STUDY --shard I/N\`.`);
  }
  return { dir, manifest, shard, studyFile };
}

/** The fields every shard of one run shares, named as the refusal message names them. */
function sameFields(f: ShardFolder): Record<string, string> {
  const p = f.manifest.parameters;
  const inputs = f.manifest.inputs.map((i) => ({ path: i.path, sha256: i.sha256, bytes: i.bytes, rows: i.rows }));
  return {
    'tool version': JSON.stringify(f.manifest.tool),
    'study file': JSON.stringify([f.studyFile.path, f.studyFile.sha256]),
    inputs: JSON.stringify(inputs),
    lexicons: JSON.stringify(f.manifest.lexicons.map((l) => l.sha256)),
    'study options': JSON.stringify(p.study),
    seed: JSON.stringify(p.seed),
    'privacy settings': JSON.stringify({ ...(p.privacy as object), pseudonymized: undefined }),
  };
}

/** Scores sidecar as the score stage writes it. */
interface ScoresMeta {
  tool: unknown;
  lexicons: LexiconRef[];
  columns: ScoreColumn[];
  inputs: InputRecord[];
  reconciliation: Reconciliation;
  options: { pseudonymized: boolean } & Record<string, unknown>;
  shard?: ShardSpec;
}

/** Adds counts by reason, keeping the first-seen order of reasons (as a whole run records them). */
function addCounts(into: Record<string, number>, from: Record<string, number>): void {
  for (const [k, v] of Object.entries(from)) into[k] = (into[k] ?? 0) + v;
}

/**
 * Writes the scores of every shard into one file, rows in the order a whole run writes them:
 * each shard's `scores.csv.seq` gives its rows' positions among all rows read, and the shards'
 * files (each in that order) are merged on it.
 */
async function mergeScores(shards: readonly ShardFolder[], out: string): Promise<number> {
  const writer = await openAtomicLineWriter(out);
  try {
    const cursors = shards.map((s) => ({ dir: s.dir, rows: readCsvRecords(join(s.dir, 'scores.csv')), seqs: readCsvRecords(join(s.dir, 'scores.csv.seq')), row: '', seq: Infinity }));
    type Cursor = (typeof cursors)[number];
    let header: string | undefined;
    const advance = async (c: Cursor): Promise<void> => {
      const [row, seq] = await Promise.all([c.rows.next(), c.seqs.next()]);
      if (row.done !== seq.done) throw usageError(`\`${c.dir}\`: scores.csv and scores.csv.seq have different numbers of rows; the shard's files were changed after it ran; run that shard again.`);
      if (!seq.done && !/^\d+$/.test(seq.value)) throw usageError(`\`${c.dir}/scores.csv.seq\` holds \`${seq.value.slice(0, 40)}\` where a row position should be; the shard's files were changed after it ran; run that shard again.`);
      c.row = row.done ? '' : row.value;
      c.seq = seq.done ? Infinity : Number(seq.value);
    };
    for (const c of cursors) {
      const first = await c.rows.next();
      if (first.done) throw usageError(`\`${c.dir}/scores.csv\` is empty; run that shard again.`);
      if (header === undefined) {
        header = first.value;
        await writer.write(header);
      } else if (first.value !== header) throw usageError(`\`${c.dir}/scores.csv\` has other columns than \`${cursors[0]?.dir}/scores.csv\`; run every shard with the same study file.`);
      await advance(c);
    }
    // A binary min-heap of the shards by the position of their next row (many shards stay fast).
    const heap = cursors.filter((c) => c.seq !== Infinity);
    const less = (a: number, b: number): boolean => (heap[a] as Cursor).seq < (heap[b] as Cursor).seq;
    const swap = (a: number, b: number): void => {
      const t = heap[a] as Cursor;
      heap[a] = heap[b] as Cursor;
      heap[b] = t;
    };
    const down = (i: number): void => {
      for (;;) {
        const l = 2 * i + 1;
        const r = l + 1;
        let m = i;
        if (l < heap.length && less(l, m)) m = l;
        if (r < heap.length && less(r, m)) m = r;
        if (m === i) return;
        swap(i, m);
        i = m;
      }
    };
    for (let i = (heap.length >> 1) - 1; i >= 0; i--) down(i);
    let rows = 0;
    while (heap.length > 0) {
      const best = heap[0] as Cursor;
      const pending = writer.write(best.row);
      if (pending) await pending;
      rows++;
      const before = best.seq;
      await advance(best);
      if (best.seq <= before) throw usageError(`\`${best.dir}/scores.csv.seq\` is not in increasing order; the shard's files were changed after it ran; run that shard again.`);
      if (best.seq === Infinity) {
        heap[0] = heap[heap.length - 1] as Cursor;
        heap.pop();
      }
      down(0);
    }
    await writer.commit();
    return rows;
  } catch (error) {
    await writer.abort();
    throw error;
  }
}

/**
 * Feeds the study's term auditors with every entry's text, read again from the inputs exactly
 * as the score stage reads them (the same person ids, pseudonyms and entry ids, in input order),
 * and checks on the way that each table input still has the hash the shards recorded.
 */
async function auditInputs(p: PreparedStudy, recorded: readonly InputRecord[], feed: (entry: RawEntry) => void): Promise<void> {
  const { study, pseudonyms } = p;
  for (const [index, studyIn] of study.inputs.entries()) {
    const input = studyInput(studyIn, p.at(studyIn.path), p.zones, p.inputTimes[index] ?? p.time, `$.inputs[${index}]`);
    const inputName = pseudonyms ? `input-${index + 1}` : basename(input.path);
    const hash = createHash('sha256');
    const items = input.items
      ? (async function* () {
          for await (const item of await (input.items as NonNullable<typeof input.items>)()) yield [item];
        })()
      : readEntryBatches(tableFile(input.path), { columns: input.columns, format: input.format, delimiter: input.delimiter, zones: p.zones, time: p.time, onBytes: (bytes) => hash.update(bytes) });
    for await (const batch of items) {
      for (const item of batch) {
        if (item.kind !== 'entry') continue;
        const entry = item.entry;
        if (entry.pseudonymKey === undefined) {
          entry.person = p.person(entry.person);
          if (pseudonyms) {
            entry.id = pseudonyms.entryId(entry.id);
            entry.source = { ...entry.source, file: inputName };
          }
        } else if (pseudonyms && entry.pseudonymKey !== pseudonyms.keyCheck) continue;
        feed(entry);
      }
    }
    const sha256 = input.items ? (await fileDigest(input.path)).sha256 : hash.digest('hex');
    if (sha256 !== recorded[index]?.sha256) throw usageError(`The input \`${studyIn.path}\` changed after the shards were run (its SHA-256 differs from the one the shards recorded); run every shard again on the input as it is now.`);
  }
}

/**
 * `lexichron merge`: puts the shards of one sharded run together into the outputs a one-machine
 * run of the same study writes, byte for byte except the manifest's run time. Checks that the
 * folders are every shard of one run exactly once (checkShardSet; refuses otherwise, naming the
 * folder or shard), merges the scores in input order, takes the rejects and drops from shard 0
 * (which alone records them), rebuilds the series from the merged scores, runs the term audit
 * over the inputs' text (read again, not scored: the audit keeps per-entry data and seeded
 * samples in input order, which shards cannot add up), then the study's stages, datapackage,
 * manifest and report, with runStudy's locking and staging.
 */
export async function mergeShards(options: MergeShardsOptions): Promise<RunStudyResult> {
  const shards: ShardFolder[] = [];
  for (const dir of options.shardDirs) shards.push(await readShardFolder(dir));
  const records: ShardRecord[] = shards.map((s) => ({ dir: s.dir, shard: s.shard, same: sameFields(s) }));
  const problems = checkShardSet(records);
  if (problems.length > 0) throw usageError(`Cannot merge these shards:\n${problems.map((m) => `  ${m}`).join('\n')}`);
  shards.sort((a, b) => a.shard.index - b.shard.index);
  const first = shards[0] as ShardFolder;
  const { path: studyFile, studyPath } = first.studyFile;
  const current = await fileDigest(studyFile).catch(() => undefined);
  if (!current) throw usageError(`The shards were run on the study file \`${studyFile}\`, which cannot be read now; merge where the shards' study file and inputs are.`);
  if (current.sha256 !== first.studyFile.sha256) throw usageError(`The study file \`${studyFile}\` changed after the shards were run; run every shard again with the study file as it is now.`);
  const study = await readStudy(studyFile);
  const p = await prepareStudy(study, studyPath, options.env, options.now, studyFile);
  const seed = (first.manifest.parameters.seed as number | undefined) ?? DEFAULT_SEED;
  const finalDir = options.out !== undefined ? resolve(options.out) : resolve(dirname(studyFile), study.out);
  if (shards.some((s) => resolve(s.dir) === finalDir)) throw usageError(`The merge output folder \`${options.out ?? study.out}\` is one of the shard folders; write the merged outputs to a folder of their own.`);
  await checkOutputFolder(finalDir, options.allowSymlinks);
  const lock = await lockOutputFolder(finalDir, `lexichron merge ${options.shardDirs.join(' ')}`);
  try {
    await removeStaleTemporaries(finalDir, { recursive: true });
    const staged = await openStagedOutput(finalDir, ['report.html', 'manifest.json', SHARD_MANIFEST]);
    try {
      const result = await mergeInto(staged.dir, shards, p, seed, options);
      await staged.commit();
      return { ...result, outDir: finalDir };
    } catch (error) {
      await staged.abort();
      throw error;
    }
  } finally {
    await lock.release();
  }
}

async function mergeInto(outDir: string, shards: readonly ShardFolder[], p: PreparedStudy, seed: number, options: MergeShardsOptions): Promise<RunStudyResult> {
  const metas: ScoresMeta[] = [];
  for (const s of shards) {
    // The sidecar holds the shard's lexicons, score columns and reconciliation: without it the scores cannot be merged.
    let text: string;
    try {
      text = await readFile(join(s.dir, 'scores.csv.meta.json'), 'utf8');
    } catch {
      throw usageError(`\`${s.dir}\` has no \`scores.csv.meta.json\` beside its scores file, so its lexicons, score columns and row counts are unknown; keep the files of the shard's folder together, or run that shard again with \`lexichron run STUDY --shard I/N\`.`);
    }
    try {
      metas.push(JSON.parse(text) as ScoresMeta);
    } catch {
      throw usageError(`\`${s.dir}/scores.csv.meta.json\` is not valid JSON; run that shard again with \`lexichron run STUDY --shard I/N\`.`);
    }
  }
  const meta0 = metas[0] as ScoresMeta;
  // Shard 0 alone records rejects and drops; the others count them as rows of another shard.
  const reconciliation: Reconciliation = { read: meta0.reconciliation.read, scored: 0, rejected: {}, dropped: {} };
  for (const m of metas) {
    if (m.reconciliation.read !== reconciliation.read) throw usageError('The shards read different numbers of rows; run every shard again on the same inputs.');
    reconciliation.scored += m.reconciliation.scored;
    addCounts(reconciliation.rejected, m.reconciliation.rejected);
    addCounts(reconciliation.dropped, m.reconciliation.dropped);
    if (m.reconciliation.notes) addCounts((reconciliation.notes ??= {}), m.reconciliation.notes);
  }
  const sum = (r: Record<string, number>): number => Object.values(r).reduce((a, b) => a + b, 0);
  if (reconciliation.scored + sum(reconciliation.rejected) + sum(reconciliation.dropped) !== reconciliation.read) {
    throw new LexichronError(`Internal error, please report it: the shards' counts do not add up: read ${reconciliation.read} ≠ scored ${reconciliation.scored} + rejected ${sum(reconciliation.rejected)} + dropped ${sum(reconciliation.dropped)}`, 'internal');
  }
  const scoresPath = join(outDir, 'scores.csv');
  const rows = await mergeScores(shards, scoresPath);
  if (rows !== reconciliation.scored) throw usageError(`The shards' scores files hold ${rows} rows but their sidecars count ${reconciliation.scored}; a shard's files were changed after it ran; run the shards again.`);
  const rejectsPath = join(outDir, 'scores.rejects.csv');
  await copyFile(join((shards[0] as ShardFolder).dir, 'scores.rejects.csv'), rejectsPath);
  const pseudonymized = metas.some((m) => m.options.pseudonymized);
  const { shard: _shard, ...meta } = { ...meta0, reconciliation, options: { ...meta0.options, pseudonymized } };
  const metaPath = join(outDir, 'scores.csv.meta.json');
  await writeFileAtomic(metaPath, JSON.stringify(meta, null, 2) + '\n');
  // The sidecar's inputs may carry their column maps; the run's result (and so the manifest) records path, size, digest and rows.
  const inputs = meta0.inputs.map(({ path, bytes, sha256, rows }) => ({ path, bytes, sha256, rows }));
  const score: RunScoreResult = { reconciliation, pseudonymized, columns: meta0.columns, lexicons: meta0.lexicons, inputs, scoresPath, rejectsPath, metaPath };
  const auditors = studyAuditors(p, seed);
  const feed = auditEntryFeeder(p, auditors);
  if (feed) await auditInputs(p, inputs, feed);
  return finishStudy(outDir, p, score, auditors.map((a) => a.finish()), { now: options.now, seed, ...(options.stages ? { stages: options.stages } : {}) });
}
