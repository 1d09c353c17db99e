import { Inflectors } from 'en-inflectors';
import type { WordNetPos } from './wordnet-types.js';

/** One inflected form of a word. */
export interface InflectedForm {
  form: string;
  /** plural, past, past participle, 3rd person, gerund, comparative, superlative. */
  kind: 'plural' | 'past' | 'past-participle' | 'third-person' | 'gerund' | 'comparative' | 'superlative';
}

const VOWEL_GROUPS = /[aeiouy]+/g;

/**
 * Whether English forms the comparative of an adjective with -er/-est: one syllable, or two
 * syllables ending in -y (the usual grammar-book rule; "happy" → "happier", but "anxious" →
 * "more anxious"). Syllables are counted as vowel groups, ignoring a final silent e.
 */
function takesSuffixComparison(word: string): boolean {
  const body = word.replace(/e$/, '');
  const groups = body.match(VOWEL_GROUPS)?.length ?? 0;
  return groups <= 1 || (groups === 2 && /[^aeiou]y$/.test(word));
}

/**
 * Inflected forms of a single English word with npm en-inflectors, for the parts of speech it
 * has (from WordNet): nouns get their plural (unless the word is uncountable per en-inflectors),
 * verbs their past, past participle, third-person and gerund forms, adjectives their comparative
 * and superlative only when English forms them with -er/-est. Phrases and forms equal to the word
 * are left out; the result is sorted and without duplicates.
 */
export function inflectedForms(word: string, parts: readonly WordNetPos[]): InflectedForm[] {
  const w = word.trim().toLowerCase();
  if (w === '' || /\s|_/.test(w) || !/^[a-z'-]+$/.test(w)) return [];
  const inflector = new Inflectors(w);
  const out = new Map<string, InflectedForm['kind']>();
  const add = (form: string, kind: InflectedForm['kind']): void => {
    const f = form.toLowerCase();
    if (f && f !== w && /^[a-z'-]+$/.test(f) && !out.has(f)) out.set(f, kind);
  };
  if (parts.includes('n') && inflector.isCountable()) add(inflector.toPlural(), 'plural');
  if (parts.includes('v')) {
    add(inflector.toPast(), 'past');
    add(inflector.toPastParticiple(), 'past-participle');
    add(inflector.toPresentS(), 'third-person');
    add(inflector.toGerund(), 'gerund');
  }
  if (parts.includes('a') && takesSuffixComparison(w)) {
    add(inflector.comparative(), 'comparative');
    add(inflector.superlative(), 'superlative');
  }
  return [...out].map(([form, kind]) => ({ form, kind })).sort((a, b) => (a.form < b.form ? -1 : a.form > b.form ? 1 : 0));
}
