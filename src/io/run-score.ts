import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { stat } from 'node:fs/promises';
import { basename } from 'node:path';
import { parseColumnMapping, type ColumnMapping } from '../ingest/column-mapping.js';
import type { TimeOptions } from '../ingest/parse-instant.js';
import { readEntryBatches } from '../ingest/read-entries.js';
import type { TableFormat } from '../ingest/read-records.js';
import { tableFile } from './table-file.js';
import type { ZoneTable } from '../ingest/zone-table.js';
import type { CompiledLexicon } from '../lexicon/compile-lexicon.js';
import type { Pseudonymizer } from '../privacy/create-pseudonymizer.js';
import { csvRow } from '../report/csv.js';
import { scoresHeader } from '../report/score-rows.js';
import { scoreRowFiller } from '../fast/score-row-filler.js';
import { scoreColumns, type CountRate, type ScoreColumn } from '../score/score-columns.js';
import { scoredEntryFrom } from '../score/score-entry.js';
import { scoreTexts, scoreVaderInto, type BatchScores, type PieceWordCaches } from '../fast/score-texts.js';
import { createScorePool, scoreWorkerCount, type ScorePool } from './score-pool.js';
import type { Diagnostic, LexiconRef, RawEntry, ReadItem, Reconciliation, ScoredEntry, SourceRef } from '../types.js';
import { TOOL_VERSION } from '../version.js';
import { shardFilter, type ShardSpec } from '../shard/shard-of-person.js';
import { openAtomicLineWriter, writeFileAtomic, type AtomicLineWriter } from './atomic-write.js';
import { diagnosticText } from '../privacy/diagnostic-text.js';

/** One input file with how to read it. */
export interface ScoreInput {
  path: string;
  columns?: ColumnMapping | string;
  format?: TableFormat;
  delimiter?: string;
  /** This input's time options (default: the run's `time`). */
  time?: TimeOptions;
  /**
   * A source of items other than a table (a donated export through an importer): entries,
   * rejects, and drops (third-party messages, duplicates) that are counted but never scored.
   */
  items?: () => Promise<AsyncIterable<ReadItem | { kind: 'drop'; reason: string; source: SourceRef }>>;
}

export interface RunScoreOptions {
  inputs: ScoreInput[];
  lexicons: CompiledLexicon[];
  zones: ZoneTable;
  time: TimeOptions;
  out: string;
  /** Unit of `count` categories (default per100w), written at the end of their column names. */
  countRate?: CountRate;
  keepText?: boolean;
  /** Maps kept text before it is written (redaction). */
  redact?: (text: string) => string;
  /** Maps person ids before anything is written (pseudonymization); `pseudonyms` does this and more. */
  person?: (id: string) => string;
  /**
   * Pseudonymization with a key: person ids become pseudonyms, entry ids keyed digests, and input
   * files are named by position (`input-1`, `input-2`…) in the rejects, the sidecar and the result,
   * so that no raw id or file name sits beside a pseudonym. Entries marked as pseudonymized at
   * import with this key are kept as they are; those marked with another key are rejected
   * (`pseudonym_other_key`).
   */
  pseudonyms?: Pseudonymizer;
  /** Called every 1,000 rows with the rows read so far. */
  onProgress?: (rows: number) => void;
  /** Scoring workers: a number (0 = score in this thread) or `auto` (the default: by input size and cores). */
  workers?: number | 'auto';
  /**
   * Workers already started (startScorePool with scoreWorkerCount's number), used instead of
   * `workers`: a caller that starts them before loading the lexicons saves their start-up time.
   * runScore sends them the lexicons and stops them when done.
   */
  pool?: ScorePool;
  /** Called with each rejected row before it is written; may throw to stop the run (the outputs are then discarded). */
  onReject?: (diagnostic: Diagnostic) => void;
  /** Also receives each scored entry. */
  onEntry?: (entry: ScoredEntry) => void;
  /** Also receives each entry with its text, after pseudonymization and before scoring (for the term audit of `run`). */
  onRawEntry?: (entry: RawEntry) => void;
  /**
   * Score only this shard's persons (shardOfPerson of the id as written). Rows of other persons
   * are counted as `otherShard` in the reconciliation; rejected rows and drops belong to shard 0
   * (the others count them as `otherShard`), so the shards' counts add up to a whole run's. The
   * position of each scored row among all rows read is written to `<out>.seq` (one number a
   * line), which `lexichron merge` uses to put the rows back in input order.
   */
  shard?: ShardSpec;
}

/** Description of an input file for the manifest. */
export interface InputRecord {
  path: string;
  bytes: number;
  sha256: string;
  rows: number;
}

export interface RunScoreResult {
  reconciliation: Reconciliation;
  /** Whether the scores hold pseudonyms (a key was given, or entries pseudonymized at import were read). */
  pseudonymized: boolean;
  columns: ScoreColumn[];
  lexicons: LexiconRef[];
  inputs: InputRecord[];
  scoresPath: string;
  rejectsPath: string;
  metaPath: string;
}

/** Entries per scoring batch. */
const BATCH_SIZE = 256;

/**
 * Batches in flight per worker. Enough for this thread to go on reading (and scoring VADER) for
 * the half second a worker takes to start, instead of waiting for it; about 33,000 entries per
 * worker (a few MB of text), so memory stays bounded. (Switching to 8 once the first batch came
 * back made no measurable difference.)
 */
const INFLIGHT_PER_WORKER = 128;

/** Batches waiting per worker from which this thread takes over the VADER lexicons of a batch. */
const VADER_HERE_AFTER = 2;

/** An importer's items as batches of one, for the loop that reads table files in batches. */
async function* oneByOne<T>(items: AsyncIterable<T>): AsyncGenerator<T[]> {
  for await (const item of items) yield [item];
}

/** An input's record for the sidecar: with its column map as read (absent: the default column names). */
function withColumnMap(record: InputRecord, columns: ColumnMapping | string | undefined): InputRecord & { columns?: ColumnMapping } {
  if (columns === undefined) return record;
  return { ...record, columns: typeof columns === 'string' ? parseColumnMapping(columns) : { ...columns } };
}

/** Where the rejects and the sidecar of a scores file go. */
export function scoreSidecars(out: string): { rejects: string; meta: string } {
  const stem = out.replace(/\.csv$/i, '');
  return { rejects: `${stem}.rejects.csv`, meta: `${out}.meta.json` };
}

/** SHA-256 and size of a file, streamed. */
export async function fileDigest(path: string): Promise<{ sha256: string; bytes: number }> {
  const hash = createHash('sha256');
  for await (const chunk of createReadStream(path)) hash.update(chunk as Buffer);
  return { sha256: hash.digest('hex'), bytes: (await stat(path)).size };
}

/**
 * Streams every input through reading and scoring into a scores CSV, a rejects CSV
 * (file, line, stage, code, message; never the text) and a JSON sidecar with lexicon
 * provenance, column aggregations and the reconciliation. All three are written atomically;
 * memory does not grow with the number of rows.
 */
export async function runScore(options: RunScoreOptions): Promise<RunScoreResult> {
  const columns = scoreColumns(options.lexicons, options.countRate);
  const keepText = options.keepText === true;
  const sidecars = scoreSidecars(options.out);
  let pool: ScorePool | undefined = options.pool;
  let scores: AtomicLineWriter;
  let rejects: AtomicLineWriter;
  try {
    scores = await openAtomicLineWriter(options.out);
    rejects = await openAtomicLineWriter(sidecars.rejects);
  } catch (error) {
    await pool?.close();
    throw error;
  }
  const reconciliation: Reconciliation = { read: 0, scored: 0, rejected: {}, dropped: {} };
  const inputs: InputRecord[] = [];
  const pseudonyms = options.pseudonyms;
  const mapPerson = pseudonyms ? pseudonyms.person : (options.person ?? ((id: string) => id));
  /** Whether an entry pseudonymized at import was read (the outputs hold pseudonyms even without a key). */
  let markedEntries = false;
  let inputName = '';
  const row = scoreRowFiller(columns, options.lexicons, keepText);
  const shard = options.shard;
  const inShard = shard ? shardFilter(shard) : undefined;
  /** Rows a shard leaves to another shard; only rejects and drops of shard 0 are its own. */
  const rowsElsewhere = shard !== undefined && shard.index !== 0;
  if (shard) reconciliation.otherShard = 0;
  /** Scored rows with a note, by note (reconciliation.notes, set only when there are any). */
  const notes: Record<string, number> = {};
  let seqWriter: AtomicLineWriter | undefined;
  try {
    if (shard) seqWriter = await openAtomicLineWriter(`${options.out}.seq`);
    await scores.write(csvRow(scoresHeader(columns, options.lexicons, keepText)));
    await rejects.write(csvRow(['file', 'line', 'stage', 'code', 'message']));
    const addReject = async (d: Diagnostic): Promise<void> => {
      options.onReject?.(d);
      reconciliation.rejected[d.code] = (reconciliation.rejected[d.code] ?? 0) + 1;
      const file = pseudonyms && d.source ? inputName : (d.source?.file ?? '');
      await rejects.write(csvRow([file, String(d.source?.line ?? ''), d.stage, d.code, diagnosticText(d.message)]));
    };
    if (pool) pool.setLexicons(options.lexicons);
    else pool = createScorePool(options.lexicons, await scoreWorkerCount(options.inputs.map((input) => input.path), options.workers));
    const hasVader = options.lexicons.some((l) => l.scoring === 'vader');
    /** Per worker, the VADER tokens of the pieces it has sent (see scoreVaderInto). */
    const vaderCaches: PieceWordCaches[] = [];
    // Entries are scored in batches and written in input order, by the workers when there are any
    // (at most INFLIGHT_PER_WORKER batches in flight per worker, so memory stays bounded), else in
    // this thread.
    const inflight: Array<{ entries: RawEntry[]; seqs: number[]; scores: Promise<BatchScores> }> = [];
    let batch: RawEntry[] = [];
    let batchSeqs: number[] = [];
    const maxInflight = pool ? INFLIGHT_PER_WORKER * pool.size + 4 : 0;
    const submit = (): void => {
      if (batch.length === 0) return;
      const entries = batch;
      const seqs = batchSeqs;
      batch = [];
      batchSeqs = [];
      const texts = entries.map((e) => e.text);
      // When the workers fall behind (they tokenize, which costs most on text with many rare
      // words), this thread scores the batch's VADER lexicons itself, from the pieces the worker
      // found (no second pass over the text), while the workers score the rest. Either way the
      // scores are the same (tested), so the file is too.
      let scored: Promise<BatchScores>;
      if (!pool) scored = Promise.resolve(scoreTexts(texts, options.lexicons, columns.length));
      else if (!hasVader || pool.queued() < VADER_HERE_AFTER * pool.size) scored = pool.score(texts).then((r) => r.scores);
      else {
        scored = pool.score(texts, 'rules').then(({ scores, worker }) => {
          scoreVaderInto(scores, texts, options.lexicons, columns.length, (vaderCaches[worker] ??= new Map()));
          return scores;
        });
      }
      inflight.push({ entries, seqs, scores: scored });
    };
    const drain = async (keep: number): Promise<void> => {
      while (inflight.length > keep) {
        const { entries, seqs, scores: pendingScores } = inflight.shift() as (typeof inflight)[number];
        const scored = await pendingScores;
        if (seqWriter && seqs.length > 0) await seqWriter.write(seqs.join('\n'));
        for (let i = 0; i < entries.length; i++) {
          const raw = entries[i] as RawEntry;
          const text = keepText ? (options.redact ? options.redact(raw.text) : raw.text) : undefined;
          reconciliation.scored++;
          if (options.onEntry) {
            const entry = scoredEntryFrom(raw, scored, i, columns, options.lexicons, keepText);
            if (text !== undefined) entry.text = text;
            options.onEntry(entry);
          }
          const pending = scores.writeWith(row.most(raw, text), (buffer, at) => row.fill(buffer, at, raw, scored, i, text));
          if (pending) await pending;
        }
      }
    };
    for (const [index, input] of options.inputs.entries()) {
      let rows = 0;
      inputName = pseudonyms ? `input-${index + 1}` : basename(input.path);
      // Table files are read a chunk of rows at a time (one step of the event loop per chunk, not per row).
      // A table file's digest is taken from the bytes as they are read (one read of the file, and
      // the digest is of exactly what was scored); an importer's source is digested afterwards.
      const digest = input.items ? undefined : { hash: createHash('sha256'), bytes: 0 };
      const onBytes = digest
        ? (bytes: Buffer): void => {
            digest.hash.update(bytes);
            digest.bytes += bytes.length;
          }
        : undefined;
      const batches = input.items ? oneByOne(await input.items()) : readEntryBatches(tableFile(input.path), { columns: input.columns, format: input.format, delimiter: input.delimiter, zones: options.zones, time: input.time ?? options.time, onBytes });
      for await (const items of batches) {
        for (const item of items) {
          rows++;
          reconciliation.read++;
          if (reconciliation.read % 1000 === 0) options.onProgress?.(reconciliation.read);
          if (item.kind !== 'entry' && rowsElsewhere) {
            reconciliation.otherShard = (reconciliation.otherShard ?? 0) + 1;
            continue;
          }
          if (item.kind === 'drop') {
            reconciliation.dropped[item.reason] = (reconciliation.dropped[item.reason] ?? 0) + 1;
            continue;
          }
          if (item.kind === 'reject') {
            await addReject(item.diagnostic);
            continue;
          }
          const entry = item.entry;
          if (entry.pseudonymKey === undefined) {
            entry.person = mapPerson(entry.person);
            if (pseudonyms) {
              entry.id = pseudonyms.entryId(entry.id);
              entry.source = { ...entry.source, file: inputName };
            }
          } else if (pseudonyms && entry.pseudonymKey !== pseudonyms.keyCheck) {
            if (rowsElsewhere) {
              reconciliation.otherShard = (reconciliation.otherShard ?? 0) + 1;
              continue;
            }
            await addReject({ code: 'pseudonym_other_key', message: 'the entry was pseudonymized at import with another key; give the key it was imported with, or import the export again with this key', source: entry.source, stage: 'ingest' });
            continue;
          } else markedEntries = true; // pseudonymized once, at import: kept as it is
          if (inShard && !inShard(entry.person)) {
            reconciliation.otherShard = (reconciliation.otherShard ?? 0) + 1;
            continue;
          }
          options.onRawEntry?.(entry);
          for (const note of item.notes ?? []) notes[note] = (notes[note] ?? 0) + 1;
          batch.push(entry);
          if (seqWriter) batchSeqs.push(reconciliation.read);
          if (batch.length >= BATCH_SIZE) {
            submit();
            if (inflight.length > maxInflight) await drain(maxInflight);
          }
        }
      }
      submit();
      await drain(0);
      const read = digest ? { sha256: digest.hash.digest('hex'), bytes: digest.bytes } : await fileDigest(input.path);
      inputs.push({ path: inputName, bytes: read.bytes, sha256: read.sha256, rows });
    }
    options.onProgress?.(reconciliation.read);
    if (Object.keys(notes).length > 0) reconciliation.notes = Object.fromEntries(Object.entries(notes).sort(([a], [b]) => (a < b ? -1 : 1)));
    const meta = {
      tool: { name: 'lexichron', version: TOOL_VERSION },
      lexicons: options.lexicons.map((l) => l.ref),
      columns,
      // Each input as read: its column map too (study file, --columns or --file-columns), when one was given.
      inputs: inputs.map((record, k) => withColumnMap(record, options.inputs[k]?.columns)),
      reconciliation,
      options: { keepText, time: options.time, pseudonymized: options.person !== undefined || pseudonyms !== undefined || markedEntries },
      ...(shard ? { shard } : {}),
    };
    await scores.commit();
    await rejects.commit();
    await seqWriter?.commit();
    await writeFileAtomic(sidecars.meta, JSON.stringify(meta, null, 2) + '\n');
  } catch (error) {
    await scores.abort();
    await rejects.abort();
    await seqWriter?.abort();
    throw error;
  } finally {
    await pool?.close();
  }
  return {
    reconciliation,
    pseudonymized: options.person !== undefined || pseudonyms !== undefined || markedEntries,
    columns,
    lexicons: options.lexicons.map((l) => l.ref),
    inputs,
    scoresPath: options.out,
    rejectsPath: sidecars.rejects,
    metaPath: sidecars.meta,
  };
}
