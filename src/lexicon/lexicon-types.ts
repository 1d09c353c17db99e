/** How a category turns matched terms into an entry score. */
export type Aggregation = 'count' | 'rating' | 'sum';

/** What happens to a hit preceded by a negator within the window. */
export type NegationRule = 'flip' | 'drop' | 'ignore';

/** How a lexicon's terms are matched (`## scoring`). */
export type LexiconScoring = 'rules' | 'vader' | 'plain-words';

/** Review status of a term; only `accepted` terms are scored. */
export type TermStatus = 'accepted' | 'pending' | 'rejected';

export interface Category {
  name: string;
  aggregation: Aggregation;
  description: string;
}

export interface TermRow {
  term: string;
  category: string;
  weight: number;
  status: TermStatus;
  /** 1-based line in the lexicon file (0 for terms built in code). */
  line: number;
}

/** A lexicon as written in a lexichron lexicon file (see lexicons/README.md). */
export interface Lexicon {
  name: string;
  version: string;
  license: string;
  source: string;
  language: string;
  /** Lowest and highest weight allowed. */
  scale: [number, number];
  /**
   * `rules` for the ordinary matcher, `vader` for the published VADER rules, `plain-words` for
   * terms looked up in the words as written (no negation, no contraction expansion; see
   * matchPlainWords).
   */
  scoring: LexiconScoring;
  negation: NegationRule;
  negators: string[];
  /** Tokens before a hit that are searched for a negator (stops at punctuation). */
  window: number;
  categories: Category[];
  terms: TermRow[];
  /** Free notes (e.g. "illustrative, unvalidated"). */
  notes: string[];
}

/** A problem found while reading a lexicon file. */
export interface LexiconProblem {
  line: number;
  message: string;
}

/** Negators used when a lexicon does not list its own (common practice; includes wink's expansion of n't). */
export const DEFAULT_NEGATORS: readonly string[] = [
  'not', 'no', 'never', 'none', 'nobody', 'nothing', 'neither', 'nor', 'nowhere', 'without',
  'cannot', 'cant', 'dont', 'doesnt', 'didnt', 'isnt', 'wasnt', 'arent', 'werent', 'wont', 'wouldnt',
  'shouldnt', 'couldnt', 'havent', 'hasnt', 'hadnt', 'aint',
];
