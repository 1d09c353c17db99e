/**
 * A seeded builder of test sentences for the VADER parity check. It mixes
 * lexicon words, boosters and dampeners, negators (also capitalised), ALL CAPS,
 * contrastive "but", "least", "never so/this", the special idioms, "kind of",
 * emoticons, emoji, attached punctuation, "!" and "?" runs and odd whitespace,
 * so that every rule of VADER is exercised many times.
 */
import { random, type RandomSource } from '../../src/stats/random.js';

const FILLERS = ['the', 'it', 'was', 'today', 'my', 'a', 'I', 'we', 'and', 'day', 'work', 'felt', 'is', 'this', 'that', 'so', 'at', 'of', 'very', 'kind', 'with', 'me', 'x', 'meeting', 'weather'];
const BOOSTERS = ['very', 'really', 'extremely', 'so', 'totally', 'quite', 'most', 'more', 'barely', 'slightly', 'somewhat', 'kinda', 'sorta', 'hardly', 'little', 'uber', 'friggin', 'incredibly', 'absolutely', 'almost'];
const NEGATORS = ['not', 'never', "don't", "isn't", 'cant', 'without', 'nothing', "wasn't", 'nor', 'seldom', "won't", 'Not', 'NOT', 'Never', "Don't", 'NEVER', "DON'T", "couldn't", 'rarely', 'none'];
const PHRASES = [
  'kind of', 'sort of', 'just enough', 'at least', 'the least', 'very least', 'least', 'never so', 'never this',
  'so', 'this', 'but', 'But', 'BUT', 'the shit', 'the bomb', 'bad ass', 'yeah right', 'cut the mustard',
  'kiss of death', 'hand to mouth', 'Kind of', 'KIND OF', 'no', 'No',
];
const EMOTICONS = [':)', ':(', ':D', ':-)', '<3', ';)', ":'(", ':P', '=)', ':/', 'XD', '</3', '😁', '💘', '(:', ':-(', 'lol', 'LOL', 'wtf'];
const SUFFIXES = [',', '.', '!', '!!', '!!!', '!!!!', '?', '??', '...', ')', ':', ';', '-', "'", '"', '?!?', '!?!?'];
const PREFIXES = ['(', '"', "'", '-', '.', '!!', '#', '@'];
const ENDINGS = ['', '.', '!', '!!', '!!!', '!!!!!', '?', '??', '???', '????', '?!', '...', ' :)', ' !'];
const SPACES = [' ', ' ', ' ', ' ', ' ', ' ', ' ', '  ', '\t', '\u00a0', '\n'];

function pick<T>(rand: RandomSource, items: readonly T[]): T {
  return items[Math.floor(rand() * items.length)]!;
}

function shape(rand: RandomSource, word: string): string {
  const r = rand();
  if (r < 0.1) return word.toUpperCase();
  if (r < 0.15) return word.charAt(0).toUpperCase() + word.slice(1);
  return word;
}

/**
 * Build `count` sentences from a seed and the lexicon's words.
 * @param seed - seed of the generator
 * @param lexiconWords - lexicon entries to draw sentiment words from
 * @param count - how many sentences
 */
export function vaderSentences(seed: number, lexiconWords: readonly string[], count: number): string[] {
  const rand = random(seed);
  // Single-word lexicon entries made of letters: the usual sentiment words.
  const words = lexiconWords.filter((w) => /^[a-z][a-z'-]*$/.test(w));
  const out: string[] = [];
  for (let s = 0; s < count; s++) {
    const length = 3 + Math.floor(rand() * 14);
    const parts: string[] = [];
    for (let k = 0; k < length; k++) {
      const r = rand();
      let token: string;
      if (r < 0.3) token = shape(rand, pick(rand, words));
      else if (r < 0.55) token = shape(rand, pick(rand, FILLERS));
      else if (r < 0.67) token = shape(rand, pick(rand, BOOSTERS));
      else if (r < 0.77) token = pick(rand, NEGATORS);
      else if (r < 0.9) token = pick(rand, PHRASES);
      else token = pick(rand, EMOTICONS);
      const p = rand();
      if (p < 0.12) token += pick(rand, SUFFIXES);
      else if (p < 0.16) token = pick(rand, PREFIXES) + token;
      parts.push(token);
    }
    let text = parts[0]!;
    for (let k = 1; k < parts.length; k++) text += pick(rand, SPACES) + parts[k]!;
    if (rand() < 0.5) text = text.charAt(0).toUpperCase() + text.slice(1);
    if (rand() < 0.04) text = text.toUpperCase();
    out.push(text + pick(rand, ENDINGS));
  }
  return out;
}
