import { existsSync } from 'node:fs';
import { stat } from 'node:fs/promises';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { CompiledLexicon } from '../lexicon/compile-lexicon.js';
import type { BatchScores, ScorePart } from '../fast/score-texts.js';

/** Scoring workers that score batches of texts in parallel, results in submission order per call. */
export interface ScorePool {
  size: number;
  /** Scores `part` of the lexicons (see scoreTextInto) for these texts; also says which worker did (0 … size − 1). */
  score(texts: string[], part?: ScorePart): Promise<{ scores: BatchScores; worker: number }>;
  /** Batches sent to the workers and not yet returned. */
  queued(): number;
  /** Sends the workers the lexicons to score with; called once, before the first batch (see startScorePool). */
  setLexicons(lexicons: readonly CompiledLexicon[]): void;
  close(): Promise<void>;
}

/** Input size (bytes) from which `auto` starts workers: below it, their start-up costs more than they save. */
export const AUTO_WORKERS_MIN_BYTES = 4 * 1024 * 1024;

/**
 * Old-generation heap limit of a scoring worker. A worker's live data is bounded (the tokenizer's
 * memo, wink-nlp's model: about 60 MB on the long-tail bench corpus); without a limit V8 let the
 * heap grow to three or four times its live data before collecting (measured before the piece
 * reader: peak 565 MB for 600,000 messages with one worker, 385 MB with this limit, same speed).
 */
const WORKER_HEAP_MB = 512;

const WORKER_SCRIPT = new URL('./score-worker.js', import.meta.url);

function newScoreWorker(): Worker {
  return new Worker(WORKER_SCRIPT, { resourceLimits: { maxOldGenerationSizeMb: WORKER_HEAP_MB } });
}

/**
 * One scoring worker started before the command line is even parsed (see prestartScoreWorker),
 * with whether it has failed; taken by the next pool.
 */
let prestarted: { worker: Worker; failed: boolean } | undefined;

/**
 * Starts one scoring worker now, for a pool that is likely to want it soon: `lexichron score`
 * calls this first thing, so the worker loads wink-nlp's model while the command line, the
 * lexicons and the first rows are read (the worker is the busier thread from the moment it is
 * ready, so the sooner it starts the sooner the run ends). Nothing when there is a single core or
 * the compiled worker script is missing. The worker does not keep the process alive until a pool
 * takes it (startScorePool: as its first worker, or stopped when the pool wants none);
 * releasePrestartedWorker stops it if no pool did.
 */
export function prestartScoreWorker(cores = availableParallelism()): void {
  if (prestarted !== undefined || cores < 2 || !existsSync(fileURLToPath(WORKER_SCRIPT))) return;
  const entry = { worker: newScoreWorker(), failed: false };
  entry.worker.unref();
  entry.worker.on('error', () => {
    entry.failed = true;
  });
  prestarted = entry;
}

/** Stops the prestarted worker if no pool took it. */
export async function releasePrestartedWorker(): Promise<void> {
  await takePrestartedWorker()?.terminate();
}

/** The prestarted worker, now referenced (it keeps the process alive like any pool worker), or undefined; a failed one is stopped and not given. */
function takePrestartedWorker(): Worker | undefined {
  const entry = prestarted;
  prestarted = undefined;
  if (entry === undefined) return undefined;
  if (entry.failed) {
    void entry.worker.terminate();
    return undefined;
  }
  entry.worker.ref();
  return entry.worker;
}

/** Workers for `auto`: one per core beyond the one that reads and writes, at most 4; none for small inputs or a single core. */
export function autoWorkers(inputBytes: number, cores = availableParallelism()): number {
  if (inputBytes < AUTO_WORKERS_MIN_BYTES || cores < 2) return 0;
  return Math.min(cores - 1, 4);
}

/** The number of scoring workers for `workers` (`auto`: by the total size of the input files and the cores). */
export async function scoreWorkerCount(paths: readonly string[], workers: number | 'auto' = 'auto'): Promise<number> {
  if (workers !== 'auto') return workers;
  let bytes = 0;
  for (const path of paths) bytes += await stat(path).then((s) => s.size, () => 0);
  return autoWorkers(bytes);
}

/**
 * Starts `size` scoring workers for these lexicons (each compiles them once). Returns undefined
 * when `size` is 0 or the compiled worker script is not there (running from TypeScript sources,
 * as in unit tests): the caller then scores in process, with identical results.
 */
export function createScorePool(lexicons: readonly CompiledLexicon[], size: number): ScorePool | undefined {
  const pool = startScorePool(size);
  pool?.setLexicons(lexicons);
  return pool;
}

/**
 * Starts `size` scoring workers before the lexicons are known, so that they load wink-nlp's model
 * while this thread loads the lexicons; setLexicons must be called before the first batch. As
 * createScorePool otherwise.
 */
export function startScorePool(size: number): ScorePool | undefined {
  const taken = takePrestartedWorker();
  if (size <= 0 || !existsSync(fileURLToPath(WORKER_SCRIPT))) {
    void taken?.terminate();
    return undefined;
  }
  const workers = Array.from({ length: size }, (_, k) => (k === 0 && taken ? taken : newScoreWorker()));
  const pending = workers.map(() => new Map<number, { resolve: (b: { scores: BatchScores; worker: number }) => void; reject: (e: Error) => void }>());
  let failure: Error | undefined;
  workers.forEach((worker, w) => {
    worker.on('message', ({ id, ...scores }: BatchScores & { id: number }) => {
      const p = pending[w]?.get(id);
      pending[w]?.delete(id);
      p?.resolve({ scores, worker: w });
    });
    worker.on('error', (raw) => {
      const error =
        (raw as NodeJS.ErrnoException).code === 'ERR_WORKER_OUT_OF_MEMORY'
          ? new Error(`A scoring thread ran out of memory (limit ${WORKER_HEAP_MB} MB of heap); run again with --workers 0 to score in the main thread.`)
          : raw;
      failure = error;
      for (const p of pending[w]?.values() ?? []) p.reject(error);
      pending[w]?.clear();
    });
  });
  let next = 0;
  return {
    size,
    queued: () => pending.reduce((sum, p) => sum + p.size, 0),
    setLexicons(lexicons) {
      // With their hashes, which the workers need not work out again.
      const data = { lexicons: lexicons.map((l) => l.lexicon), hashes: lexicons.map((l) => l.ref.sha256) };
      for (const worker of workers) worker.postMessage(data);
    },
    score(texts, part = 'all') {
      if (failure) return Promise.reject(failure);
      // the least busy worker takes the batch
      let w = 0;
      for (let k = 1; k < workers.length; k++) if ((pending[k]?.size ?? 0) < (pending[w]?.size ?? 0)) w = k;
      const id = next++;
      return new Promise<{ scores: BatchScores; worker: number }>((resolve, reject) => {
        pending[w]?.set(id, { resolve, reject });
        workers[w]?.postMessage({ id, texts, part });
      });
    },
    async close() {
      await Promise.all(workers.map((worker) => worker.terminate()));
    },
  };
}
