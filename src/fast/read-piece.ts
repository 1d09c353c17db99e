import { createRequire } from 'node:module';
import { coreModel } from '../text/core-model.js';
import type { CoreModel } from '../text/prepare-core-model.js';
import type { WinkTokens } from '../text/wink-tokens.js';

/**
 * Reading one piece of text (no spaces) with the parts of wink-nlp 2.4.0 that its `readDoc`
 * runs to tokenize (src/wink-nlp.js `load` and `readDoc`): the lexeme cache, the compiled token
 * patterns and the tokenizer, without what `readDoc` builds around the tokens (a document object
 * of some fifty closures, sentence and entity records, one array per `out` call).
 *
 * wink's tokenizer adds tokens through three calls on a document record (src/dd-wrapper.js):
 * `_addTokenIfInCache` and `isLexeme` look a text up in the lexeme cache; `_addToken` adds a text
 * as a token and, when the cache lacks it or its lower case, adds them to the cache (cache.js
 * `add`, which also works out six features of each new word). Here known words go to wink's own
 * calls, and new words are kept in an overlay for the one piece instead of the cache, with what
 * `add` would give them (the category of their first addition; their lower case as normal form,
 * through wink's spelling map when the lower case is a known word). Later look-ups in the same
 * piece see the overlay as wink's would see the cache, so the tokens equal those of a freshly
 * loaded wink-nlp, and the model is never changed: nothing to take out again, nothing that
 * grows. wink-nlp is pinned at 2.4.0 (package.json), and test/fast/tokenize-english.test.ts checks
 * the tokens against `readDoc` on every test corpus, so a change inside wink-nlp fails tests.
 */
interface WinkCache {
  value(index: number): string;
  property(index: number, name: string): string;
  normal(index: number): number;
  nox(binary: number): number;
  lookup(text: string): number[] | null;
  mappedSpelling(index: number): number;
}

/** The document record calls wink's tokenizer makes (src/dd-wrapper.js). */
interface WinkDocCalls {
  _addToken(text: string, category: number, precedingSpaces: number, nbsp: unknown): boolean;
  _addTokenIfInCache(text: string, precedingSpaces: number, nbsp: unknown): number;
  isLexeme(text: string): unknown;
}

interface PieceReader {
  cache: WinkCache;
  /** The model's lexeme index (text → lexeme), never changed. */
  known: Record<string, number>;
  tokenize: (doc: WinkDocCalls, text: string) => void;
  doc: WinkDocCalls;
  /** Tokens of the piece being read, 4 numbers each (wink src/its.js); a negative lexeme is −1 − an overlay entry. */
  tokens: number[];
  /** Names of token categories by number (the model's tokenType feature). */
  typeNames: string[];
  /** New words of the piece being read: text → overlay entry. */
  overlay: Map<string, number>;
  overlayText: string[];
  overlayType: string[];
  overlayNormal: string[];
}

const requireWink = createRequire(import.meta.url);
/** The piece reader of this thread, loaded at its first use (a cache of wink's model: it never changes, see above). */
let reader: PieceReader | undefined;

function loadPieceReader(): PieceReader {
  const Cache = requireWink('wink-nlp/src/cache.js') as (core: CoreModel, featureFn: unknown) => WinkCache;
  const compileTRex = requireWink('wink-nlp/src/compile-trex.js') as (trex: unknown) => unknown;
  const tokenizer = requireWink('wink-nlp/src/tokenizer.js') as (trex: unknown, categories: unknown, preserve: unknown) => PieceReader['tokenize'];
  const DocDataWrapper = requireWink('wink-nlp/src/dd-wrapper.js') as (record: object) => WinkDocCalls;
  const featureFn = requireWink('wink-eng-lite-web-model/dist/feature.js') as unknown;
  const core = coreModel();
  const cache = Cache(core, featureFn);
  const tokens: number[] = [];
  const record = Object.assign(Object.create(null) as object, { cache, tokens, sentences: [], markings: [], nonBreakingSpaces: Object.create(null) as object });
  const wink = DocDataWrapper(record);
  const known = core.features.lexeme.hash;
  const typeNames = (core.features as unknown as Record<string, { list: string[] }>).tokenType!.list;
  const r: PieceReader = { cache, known, tokenize: tokenizer(compileTRex(core.trex), core.tcat.hash, core.preserve), doc: wink, tokens, typeNames, overlay: new Map(), overlayText: [], overlayType: [], overlayNormal: [] };

  /** An overlay entry for new word `text` (as cache.js `add` makes a lexeme). */
  const addNew = (text: string, category: number, normal: string): number => {
    const entry = r.overlayText.length;
    r.overlay.set(text, entry);
    r.overlayText.push(text);
    r.overlayType.push(typeNames[category] as string);
    r.overlayNormal.push(normal);
    return entry;
  };
  /** The lexeme of `text` after cache.js `add(text, category)`: a known word's index, else −1 − its overlay entry. */
  const add = (text: string, category: number): number => {
    const lower = text.toLowerCase();
    let lexeme = known[text];
    if (lexeme === undefined) {
      const entry = r.overlay.get(text) ?? addNew(text, category, normalOfNew(lower));
      lexeme = -1 - entry;
    }
    if (lower !== text && known[lower] === undefined && !r.overlay.has(lower)) addNew(lower, category, lower);
    return lexeme;
  };
  /** A new word's normal form (cache.js `normal` of an added lexeme): its lower case, spelling-mapped when that is a known word. */
  const normalOfNew = (lower: string): string => {
    const index = known[lower];
    return index === undefined ? lower : cache.value(cache.mappedSpelling(index));
  };
  r.doc = {
    _addToken: (text, category, precedingSpaces) => {
      tokens.push(add(text, category), precedingSpaces, 0, 0);
      return true;
    },
    _addTokenIfInCache: (text, precedingSpaces, nbsp) => {
      const entry = r.overlay.get(text);
      if (entry === undefined) return wink._addTokenIfInCache(text, precedingSpaces, nbsp);
      tokens.push(-1 - entry, precedingSpaces, 0, 0);
      return 99; // wink's "added" answer
    },
    isLexeme: (text) => (r.overlay.has(text) ? true : cache.lookup(text)),
  };
  return r;
}

/** Bits of a token's second number (wink-nlp src/its.js): preceding spaces below, a contraction's normal above. */
const SPACES_MASK = 0xffff;

/** Loads wink's model and tokenizer now rather than at the first piece (a scoring thread does this while it waits for work). */
export function preparePieceReader(): void {
  reader ??= loadPieceReader();
}

/**
 * A plain piece: a word of ASCII letters, alone or followed by one mark (`.`, `,`, `!`, `?`,
 * `;`, `:`), with wink's type for each (`mark` is empty when there is none).
 */
export interface PlainPiece {
  word: string;
  wordType: string;
  mark: string;
  markType: string;
}

/** Marks a plain piece may end with: in wink's word-then-punctuation pattern, and never attached to the word before (see appendTokens). */
const PLAIN_MARKS = '.,!?;:';

/**
 * How wink reads `text` when it is a plain piece (most new pieces of a corpus: three in four are
 * letters only, one in five letters and a mark); undefined for any other piece, which readPiece
 * must read. Following wink's tokenizer (src/tokenizer.js `tokenize`, `processWordRP`): a piece
 * the lexeme cache knows (`etc.` too) is one token of its model type, unless it is a contraction
 * such as `cannot`, `dont` or `AINT`, which expands into several and is left to readPiece; an
 * unknown letters-only piece matches the model's first token-category pattern, `^[a-z…]+$`
 * (case-insensitive), and is one `word` token; an unknown word with a mark matches the second,
 * word-then-punctuation, and is added as two tokens, the word (its model type when known,
 * without contraction expansion; else `word`) and the mark, except a single letter and a point
 * (`a.`), added as one `word` token.
 * test/fast/tokenize-english.test.ts checks this against wink-nlp's readDoc.
 */
export function readPlainPiece(text: string): PlainPiece | undefined {
  const n = text.length;
  if (n === 0) return undefined;
  const last = text.charCodeAt(n - 1);
  const marked = PLAIN_MARKS.includes(text[n - 1] as string) && n > 1;
  const letters = marked ? n - 1 : n;
  for (let k = 0; k < letters; k++) {
    const c = text.charCodeAt(k) | 0x20;
    if (c < 0x61 || c > 0x7a) return undefined;
  }
  reader ??= loadPieceReader();
  const { known, cache } = reader;
  // One look-up in the lexeme cache: null for an unknown piece, [lexeme] for a known one, more for a contraction.
  const found = cache.lookup(text);
  if (found !== null) return found.length === 1 ? { word: text, wordType: cache.property(found[0] as number, 'tokenType'), mark: '', markType: '' } : undefined;
  if (!marked || (n === 2 && last === 0x2e)) return { word: text, wordType: 'word', mark: '', markType: '' };
  const word = text.slice(0, -1);
  const mark = text[n - 1] as string;
  const wordLexeme = known[word];
  const markLexeme = known[mark];
  return {
    word,
    wordType: wordLexeme === undefined ? 'word' : cache.property(wordLexeme, 'tokenType'),
    mark,
    markType: markLexeme === undefined ? 'punctuation' : cache.property(markLexeme, 'tokenType'),
  };
}

/** The normal forms of a plain piece's tokens: the word in lower case, then the mark (if any) as it is. */
export function plainNorms(plain: PlainPiece): string[] {
  const word = plain.word.toLowerCase();
  return plain.mark === '' ? [word] : [word, plain.mark];
}

/** wink's tokens of one piece of text (no spaces, or one run of tabs and line breaks), as a freshly loaded wink-nlp reads it. */
export function readPiece(text: string): WinkTokens {
  reader ??= loadPieceReader();
  const { cache, tokens } = reader;
  tokens.length = 0;
  reader.overlay.clear();
  reader.overlayText.length = 0;
  reader.overlayType.length = 0;
  reader.overlayNormal.length = 0;
  reader.tokenize(reader.doc, text);
  const n = tokens.length / 4;
  const result: WinkTokens = { values: new Array<string>(n), types: new Array<string>(n), contraction: new Array<boolean>(n), normals: new Array<string>(n), spaced: new Array<boolean>(n) };
  for (let k = 0; k < n; k++) {
    const lexeme = tokens[4 * k] as number;
    const second = tokens[4 * k + 1] as number;
    const contraction = second > SPACES_MASK;
    result.contraction[k] = contraction;
    result.spaced[k] = (second & SPACES_MASK) > 0;
    if (lexeme < 0) {
      const entry = -1 - lexeme;
      result.values[k] = reader.overlayText[entry] as string;
      result.types[k] = reader.overlayType[entry] as string;
      result.normals[k] = reader.overlayNormal[entry] as string;
    } else {
      result.values[k] = cache.value(lexeme);
      result.types[k] = cache.property(lexeme, 'tokenType');
      result.normals[k] = contraction ? cache.value(cache.nox(second)) : cache.value(cache.normal(lexeme));
    }
  }
  return result;
}
