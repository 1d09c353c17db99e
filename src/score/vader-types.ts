/** A VADER lexicon: lower-case token → mean valence (−4 … +4). */
export type VaderLexicon = ReadonlyMap<string, number>;

/** VADER's scores of one text. */
export interface VaderScores {
  /** Normalised sum of valences, in [−1, 1]; 0 when nothing matched. */
  compound: number;
  /** Share of positive intensity (0 … 1). */
  pos: number;
  /** Share of neutral tokens (0 … 1). */
  neu: number;
  /** Share of negative intensity (0 … 1). */
  neg: number;
  /** VADER tokens of the text; 0 means the reference's all-zero result, not a measurement. */
  tokens: number;
  /** Tokens found in the lexicon and scored (boosters and "kind of" are not scored). */
  matched: number;
}
