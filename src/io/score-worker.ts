/**
 * A scoring worker (worker_threads): loads wink-nlp's model as soon as it starts, compiles the
 * lexicons it is sent once (the first message), then scores batches of texts and sends the scores
 * back as transferable typed arrays. Started by score-pool.ts.
 */
import { parentPort } from 'node:worker_threads';
import { compileLexicon, type CompiledLexicon } from '../lexicon/compile-lexicon.js';
import type { Lexicon } from '../lexicon/lexicon-types.js';
import { scoreColumns } from '../score/score-columns.js';
import { batchBuffers, scoreTexts, type ScorePart } from '../fast/score-texts.js';
import { preparePieceReader } from '../fast/read-piece.js';
import { provideCoreModel } from '../text/core-model.js';
import { readCoreModel } from './read-core-model.js';

let lexicons: CompiledLexicon[] = [];
let columns = 0;

parentPort?.on('message', (message: { lexicons: Lexicon[]; hashes: string[] } | { id: number; texts: string[]; part: ScorePart }) => {
  if ('lexicons' in message) {
    lexicons = message.lexicons.map((lexicon, l) => compileLexicon(lexicon, message.hashes[l]));
    columns = scoreColumns(lexicons).length;
    return;
  }
  const out = scoreTexts(message.texts, lexicons, columns, message.part);
  parentPort?.postMessage({ id: message.id, ...out }, batchBuffers(out));
});

// The model takes a fifth of a second to load: done while the reading thread loads the lexicons
// and reads the first rows (messages wait in the queue meanwhile).
provideCoreModel(readCoreModel);
preparePieceReader();
