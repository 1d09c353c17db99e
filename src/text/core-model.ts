import type { CoreModel } from './prepare-core-model.js';

/** Where a fresh copy of wink's core model comes from (see provideCoreModel). */
let source: (() => CoreModel) | undefined;

/**
 * Gives the text layer its source of wink-eng-lite-web-model's core model: a function that
 * returns a fresh, prepared copy each time it is called (each reader of the model gets its own,
 * since wink-nlp's reference reader changes the copy it is given). The program's entry points
 * call this once with readCoreModel (src/io/read-core-model.ts), which reads the installed
 * model file: the command line (src/cli/main.ts), the scoring worker (src/io/score-worker.ts)
 * and the library (src/index.ts). The text layer itself reads no file.
 */
export function provideCoreModel(load: () => CoreModel): void {
  source = load;
}

/** A fresh copy of wink's core model from the source given to provideCoreModel. */
export function coreModel(): CoreModel {
  if (source === undefined) {
    throw new Error("lexichron's English tokenizer has no wink model: call provideCoreModel(readCoreModel) (src/io/read-core-model.ts) before tokenizing, or import the library through its entry point");
  }
  return source();
}
