/**
 * A scoring worker (worker_threads): compiles the lexicons it is given once, then scores batches
 * of texts and sends the scores back as transferable typed arrays. Started by score-pool.ts.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { compileLexicon } from '../lexicon/compile-lexicon.js';
import type { Lexicon } from '../lexicon/lexicon-types.js';
import { scoreColumns } from '../score/score-columns.js';
import { scoreTexts, type ScorePart } from '../score/score-text.js';

const lexicons = (workerData as { lexicons: Lexicon[] }).lexicons.map(compileLexicon);
const columns = scoreColumns(lexicons).length;

parentPort?.on('message', (message: { id: number; texts: string[]; part: ScorePart }) => {
  const out = scoreTexts(message.texts, lexicons, columns, message.part);
  const transfer = [out.values.buffer as ArrayBuffer, out.matched.buffer as ArrayBuffer, out.negated.buffer as ArrayBuffer, out.words.buffer as ArrayBuffer];
  if (out.pieces) transfer.push(out.pieces.serials.buffer as ArrayBuffer, out.pieces.starts.buffer as ArrayBuffer, out.pieces.counts.buffer as ArrayBuffer);
  parentPort?.postMessage({ id: message.id, ...out }, transfer);
});
