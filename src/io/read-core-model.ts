import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { prepareCoreModel, type CoreModel } from '../text/prepare-core-model.js';

const requireModelFile = createRequire(import.meta.url);

/** The installed wink-eng-lite-web-model package's core model file, read and prepared (see prepareCoreModel). */
export function readCoreModel(): CoreModel {
  const path = requireModelFile.resolve('wink-eng-lite-web-model/dist/languages/cur/models/eng-core-web-model.json');
  return prepareCoreModel(readFileSync(path, 'utf8'));
}
