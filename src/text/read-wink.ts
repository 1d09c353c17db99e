import { createRequire } from 'node:module';
import type winkNLP from 'wink-nlp';
import type model from 'wink-eng-lite-web-model';
import { coreModel } from './core-model.js';
import type { WinkTokens } from './wink-tokens.js';

type Nlp = ReturnType<typeof winkNLP>;
type WinkModel = typeof model;

/**
 * wink-nlp remembers every new word it meets (in its lexeme table), and a remembered word can
 * change how a later text is split: in one process the first `don’twell...` gives
 * `don’twell . ..` and every later one `don’twell ...`; `'em` is split as `' em` until some
 * text has made `'em` a token. Tokens would then depend on the texts read before (their order,
 * and how they were shared between worker threads). So every text is tokenized as by a freshly
 * loaded wink-nlp: readWink reads it through wink's public `readDoc` and takes the words wink
 * added out of the table's index again right after (they stay in its list, whose positions wink
 * relies on; the instance is replaced when the list holds WINK_RENEW words beyond the model's
 * own). The fast path's piece reader (src/fast/read-piece.ts) keeps new words out of the table
 * instead. Only this reference loads wink-nlp's full pipeline and the model package (sentence,
 * part-of-speech and entity models).
 */
interface IsolatedWink {
  nlp: Nlp;
  /** The lexeme index (text → position in `lexemes`) that wink looks words up in. */
  index: Record<string, number>;
  /** Words the model had before any text was read. */
  intrinsic: number;
  /** The lexeme list, to see how far it has grown. */
  lexemes: unknown[];
}

const WINK_RENEW = 100_000;
/** The one wink-nlp instance of the reference (a cache: replaced when it has grown, never read for output). */
let english: IsolatedWink | undefined;

const requireLazily = createRequire(import.meta.url);

function loadIsolatedWink(): IsolatedWink {
  const winkNLPLoader = requireLazily('wink-nlp') as typeof winkNLP;
  const model = requireLazily('wink-eng-lite-web-model') as WinkModel;
  const state: Partial<IsolatedWink> = {};
  const wrapped: WinkModel = {
    ...model,
    core: () => {
      const core = coreModel();
      const lexeme = core.features.lexeme;
      state.intrinsic = lexeme.intrinsicSize;
      state.lexemes = lexeme.list;
      state.index = lexeme.hash;
      return core;
    },
  } as WinkModel;
  state.nlp = winkNLPLoader(wrapped, []);
  return state as IsolatedWink;
}

/** The wink-nlp English tokenizer with an empty pipeline (tokenization only: no sentence, POS or NER steps). */
function englishNlp(): IsolatedWink {
  if (english === undefined || english.lexemes.length - english.intrinsic > WINK_RENEW) english = loadIsolatedWink();
  return english;
}

/** Takes the words wink added since its list had `from` entries out of its index (see IsolatedWink). */
function forgetAdded(wink: IsolatedWink, from: number): void {
  const { lexemes, index } = wink;
  for (let k = from; k < lexemes.length; k++) {
    const word = lexemes[k] as string;
    if (index[word] === k) delete index[word];
  }
}

/** wink's tokens of `text` as read by a freshly loaded wink-nlp (see IsolatedWink), through its public `readDoc`. */
export function readWink(text: string): WinkTokens {
  const wink = englishNlp();
  const { nlp } = wink;
  const its = nlp.its;
  const before = wink.lexemes.length;
  const tokens = nlp.readDoc(text).tokens();
  const spaces = tokens.out(its.precedingSpaces) as string[];
  const result = {
    values: tokens.out(its.value) as string[],
    types: tokens.out(its.type) as string[],
    contraction: tokens.out(its.contractionFlag) as boolean[],
    normals: tokens.out(its.normal) as string[],
    spaced: spaces.map((s) => s !== ''),
  };
  if (wink.lexemes.length > before) forgetAdded(wink, before);
  return result;
}
