/** Token kinds. Words are what `nWords` counts; punctuation stops negation windows. */
export const TokenKind = { Word: 0, Punct: 1, Emoji: 2, Emoticon: 3, Number: 4, Other: 5 } as const;
export type TokenKind = (typeof TokenKind)[keyof typeof TokenKind];

/**
 * Tokens of one text as parallel arrays (lean for the per-entry hot path).
 * `norm` is the matching form: lower-cased, with contraction pieces expanded (`n't` → `not`).
 */
export interface Tokens {
  norm: string[];
  /** The token as written (for VADER-style capitalisation checks and keyword-in-context). */
  raw: string[];
  kind: TokenKind[];
  /** Number of word tokens (see tokenize for what counts). */
  nWords: number;
  /**
   * Tokens of the memoised English tokenizer only (src/fast/tokenize-english.ts): per token a
   * small integer standing for its `norm` (equal norms, equal ids), valid while tokenGeneration()
   * returns `generation`. Lets matchers keep per-word answers in arrays instead of looking each
   * token up by its text.
   */
  ids?: number[];
  generation?: number;
  /**
   * The number of tokens when the arrays are reused from text to text and may be longer (see
   * tokenizeEnglishInto); otherwise undefined and the arrays hold exactly the tokens.
   */
  size?: number;
  /** With tokenizeEnglishInto's piece lists: how many of their entries belong to this text. */
  pieceCount?: number;
}
