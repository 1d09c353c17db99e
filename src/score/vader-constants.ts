/**
 * The rule tables of VADER (Valence Aware Dictionary and sEntiment Reasoner).
 *
 * Source: Hutto, C.J. & Gilbert, E.E. (2014). VADER: A Parsimonious Rule-based
 * Model for Sentiment Analysis of Social Media Text. Eighth International
 * Conference on Weblogs and Social Media (ICWSM-14), Ann Arbor, MI.
 * The empirically derived constants (Table 3 of the paper) and the word lists
 * below are those of the reference implementation `vaderSentiment.py`
 * (C.J. Hutto, MIT License), in the release that ships the lexicon bundled with
 * the npm package `vader-sentiment` 1.1.3. Later Python releases added words
 * (for example "considerable", "fuckin") and idioms ("to die for"); they are
 * deliberately not added here so that scores stay comparable with that release.
 *
 * @packageDocumentation
 */

/** Mean increase in rated intensity for a booster word ("very good"), paper Table 3. */
export const VADER_BOOST = 0.293;

/** Mean decrease in rated intensity for a dampener ("slightly good"), paper Table 3. */
export const VADER_DAMPEN = -0.293;

/** Mean increase in rated intensity for an ALL-CAPS word among mixed-case words, paper Table 3. */
export const VADER_CAPS_BOOST = 0.733;

/** Factor applied to a valence negated by a preceding negator ("not good"). */
export const VADER_NEGATION_SCALAR = -0.74;

/** Intensity added per exclamation mark, counted up to {@link VADER_MAX_EXCLAMATIONS}. */
export const VADER_EXCLAMATION_BOOST = 0.292;

/** Exclamation marks beyond this count add nothing. */
export const VADER_MAX_EXCLAMATIONS = 4;

/** Intensity added per question mark when there are 2 or 3 of them. */
export const VADER_QUESTION_BOOST = 0.18;

/** Intensity added when there are more than 3 question marks. */
export const VADER_QUESTION_BOOST_MAX = 0.96;

/** The α of the normalisation compound = x / √(x² + α). */
export const VADER_NORMALISATION_ALPHA = 15;

/** Factor for sentiment before a contrastive "but". */
export const VADER_BEFORE_BUT = 0.5;

/** Factor for sentiment after a contrastive "but". */
export const VADER_AFTER_BUT = 1.5;

/** Factor for "never so good" / "never this good" (the modifier two tokens back). */
export const VADER_NEVER_SO_NEAR = 1.5;

/** Factor for "never so … good" and for "so/this" right before the word (three tokens back). */
export const VADER_NEVER_SO_FAR = 1.25;

/** Scaling of a modifier's effect by its distance: 1, 2 or 3 tokens before the word. */
export const VADER_DISTANCE_SCALE: readonly [number, number, number] = [1, 0.95, 0.9];

/**
 * Punctuation that the reference tokeniser strips when it stands, as one of
 * these exact strings, directly before or after a word ("good!!" → "good",
 * but "good!!!!" stays as it is).
 */
export const VADER_STRIPPABLE_PUNCTUATION: ReadonlySet<string> = new Set([
  '.', '!', '?', ',', ';', ':', '-', "'", '"',
  '!!', '!!!', '??', '???', '?!?', '!?!', '?!?!', '!?!?',
]);

/** Negators: a token equal to one of these (case-sensitive), or containing "n't", negates. */
export const VADER_NEGATORS: ReadonlySet<string> = new Set([
  'aint', 'arent', 'cannot', 'cant', 'couldnt', 'darent', 'didnt', 'doesnt',
  "ain't", "aren't", "can't", "couldn't", "daren't", "didn't", "doesn't",
  'dont', 'hadnt', 'hasnt', 'havent', 'isnt', 'mightnt', 'mustnt', 'neither',
  "don't", "hadn't", "hasn't", "haven't", "isn't", "mightn't", "mustn't",
  'neednt', "needn't", 'never', 'none', 'nope', 'nor', 'not', 'nothing', 'nowhere',
  'oughtnt', 'shant', 'shouldnt', 'uhuh', 'wasnt', 'werent',
  "oughtn't", "shan't", "shouldn't", 'uh-uh', "wasn't", "weren't",
  'without', 'wont', 'wouldnt', "won't", "wouldn't", 'rarely', 'seldom', 'despite',
]);

const B = VADER_BOOST;
const D = VADER_DAMPEN;

/**
 * Boosters and dampeners (degree adverbs), lower case, with their increment.
 * Two-word entries ("kind of") act through the idiom check only.
 */
export const VADER_BOOSTERS: ReadonlyMap<string, number> = new Map([
  ['absolutely', B], ['amazingly', B], ['awfully', B], ['completely', B], ['considerably', B],
  ['decidedly', B], ['deeply', B], ['effing', B], ['enormously', B], ['entirely', B],
  ['especially', B], ['exceptionally', B], ['extremely', B], ['fabulously', B], ['flipping', B],
  ['flippin', B], ['fricking', B], ['frickin', B], ['frigging', B], ['friggin', B], ['fully', B],
  ['fucking', B], ['greatly', B], ['hella', B], ['highly', B], ['hugely', B], ['incredibly', B],
  ['intensely', B], ['majorly', B], ['more', B], ['most', B], ['particularly', B], ['purely', B],
  ['quite', B], ['really', B], ['remarkably', B], ['so', B], ['substantially', B],
  ['thoroughly', B], ['totally', B], ['tremendously', B], ['uber', B], ['unbelievably', B],
  ['unusually', B], ['utterly', B], ['very', B],
  ['almost', D], ['barely', D], ['hardly', D], ['just enough', D], ['kind of', D], ['kinda', D],
  ['kindof', D], ['kind-of', D], ['less', D], ['little', D], ['marginally', D], ['occasionally', D],
  ['partly', D], ['scarcely', D], ['slightly', D], ['somewhat', D], ['sort of', D], ['sorta', D],
  ['sortof', D], ['sort-of', D],
]);

/**
 * Special-case idioms that contain a lexicon word; when one surrounds a
 * lexicon word, its valence replaces the word's (case-sensitive, as published).
 */
export const VADER_IDIOMS: ReadonlyMap<string, number> = new Map([
  ['the shit', 3], ['the bomb', 3], ['bad ass', 1.5], ['yeah right', -2],
  ['cut the mustard', 2], ['kiss of death', -1.5], ['hand to mouth', -2],
]);
