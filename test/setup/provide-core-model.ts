// Gives the English tokenizer wink's model, as src/cli/main.ts, src/io/score-worker.ts and
// src/index.ts do (the text layer reads no file: see src/text/core-model.ts).
import { readCoreModel } from '../../src/io/read-core-model.js';
import { provideCoreModel } from '../../src/text/core-model.js';

provideCoreModel(readCoreModel);
