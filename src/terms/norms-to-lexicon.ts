import { DEFAULT_NEGATORS, type Lexicon, type LexiconProblem, type NegationRule, type TermRow } from '../lexicon/lexicon-types.js';
import type { Diagnostic, SourceRef } from '../types.js';

/** One rating column of a norms table and the category it becomes. */
export interface NormsRating {
  column: string;
  category: string;
}

/** Options of {@link normsToLexicon}. */
export interface NormsToLexiconOptions {
  word: string;
  ratings: readonly NormsRating[];
  name: string;
  version: string;
  license: string;
  source: string;
  language?: string;
  /** Declared scale; by default the lowest and highest rating in the data. */
  scale?: [number, number];
  /** Same word twice (case-insensitively): stop (`error`, default), keep the `first`, or take the `mean`. */
  duplicates?: 'error' | 'first' | 'mean';
  /** Read `5,25` as 5.25. */
  decimalComma?: boolean;
  negation?: NegationRule;
}

/** One row of a norms table. */
export interface NormsRecord {
  record: Record<string, string>;
  source: SourceRef;
}

/**
 * Turns a table of published word norms (one row per word, one numeric rating per column, e.g.
 * valence, arousal, dominance) into a lexichron lexicon with one `rating` category per rating
 * column (the entry score is then the mean rating of the matched words).
 *
 * Rows with an empty word, a word with `*` or a tab, or a rating that is not a number become
 * diagnostics (the row, or only that rating, is left out); ratings outside a declared scale too.
 * Duplicate words (case-insensitive) are problems that stop the conversion unless `duplicates` is
 * `first` or `mean`. The license and source are required (a problem when empty).
 */
export function normsToLexicon(records: Iterable<NormsRecord>, options: NormsToLexiconOptions): { lexicon?: Lexicon; diagnostics: Diagnostic[]; problems: LexiconProblem[] } {
  const diagnostics: Diagnostic[] = [];
  const problems: LexiconProblem[] = [];
  const diag = (code: string, message: string, source: SourceRef): void => {
    diagnostics.push({ code, message, source, stage: 'terms' });
  };
  if (!options.license.trim()) problems.push({ line: 0, message: 'no license given: pass --license with the license of the norms (e.g. "CC BY 4.0"); lexichron does not write a lexicon of unknown license' });
  if (!options.source.trim()) problems.push({ line: 0, message: 'no source given: pass --source with the citation of the norms (authors, year, title, DOI)' });
  const values = new Map<string, { term: string; line: number; sums: number[]; counts: number[]; first: Array<number | undefined> }>();
  for (const { record, source } of records) {
    const word = (record[options.word] ?? '').trim().replace(/\s+/g, ' ');
    if (word === '') {
      diag('empty_word', `the \`${options.word}\` field is empty; the row is left out`, source);
      continue;
    }
    if (word.includes('*') || word.includes('\t')) {
      diag('bad_word', `\`${word}\` holds a \`*\` or a tab, which lexicon terms cannot; the row is left out`, source);
      continue;
    }
    const key = word.toLowerCase();
    const ratings = options.ratings.map((r) => {
      let text = (record[r.column] ?? '').trim();
      if (options.decimalComma) text = text.replace(',', '.');
      if (text === '' || text.toUpperCase() === 'NA') return undefined;
      const v = Number(text);
      if (!Number.isFinite(v)) {
        diag('not_a_number', `\`${r.column}\` of \`${word}\` is \`${text}\`, not a number${/^\s*-?\d+,\d+\s*$/.test(text) ? '; pass --decimal-comma for a comma decimal mark' : ''}; that rating is left out`, source);
        return undefined;
      }
      if (options.scale && (v < options.scale[0] || v > options.scale[1])) {
        diag('outside_scale', `\`${r.column}\` of \`${word}\` is ${v}, outside the declared scale ${options.scale[0]} to ${options.scale[1]}; that rating is left out`, source);
        return undefined;
      }
      return v;
    });
    const previous = values.get(key);
    if (!previous) {
      values.set(key, { term: word, line: source.line, sums: ratings.map((v) => v ?? 0), counts: ratings.map((v) => (v === undefined ? 0 : 1)), first: ratings });
      continue;
    }
    const same = ratings.every((v, j) => v === previous.first[j]);
    const mode = options.duplicates ?? 'error';
    if (mode === 'error' && !same) {
      problems.push({ line: source.line, message: `\`${word}\` is listed again (first on line ${previous.line}) with different ratings; remove one row, or pass --duplicates first|mean` });
      continue;
    }
    diag('duplicate_word', `\`${word}\` is listed again (first on line ${previous.line}); ${mode === 'mean' && !same ? 'the ratings are averaged' : 'the first row is kept'}`, source);
    if (mode === 'mean') {
      ratings.forEach((v, j) => {
        if (v === undefined) return;
        previous.sums[j] = (previous.sums[j] as number) + v;
        previous.counts[j] = (previous.counts[j] as number) + 1;
      });
    }
  }
  if (values.size === 0) problems.push({ line: 0, message: `no row had a word in column \`${options.word}\`; check --word and the file` });
  const terms: TermRow[] = [];
  let lo = Infinity;
  let hi = -Infinity;
  options.ratings.forEach((r, j) => {
    for (const v of values.values()) {
      if ((v.counts[j] as number) === 0) continue;
      const w = (v.sums[j] as number) / (v.counts[j] as number);
      lo = Math.min(lo, w);
      hi = Math.max(hi, w);
      terms.push({ term: v.term, category: r.category, weight: w, status: 'accepted', line: v.line });
    }
  });
  if (terms.length === 0 && values.size > 0) problems.push({ line: 0, message: `no rating column held a number (${options.ratings.map((r) => r.column).join(', ')}); check --rating` });
  if (problems.length > 0) return { diagnostics, problems };
  return {
    diagnostics,
    problems,
    lexicon: {
      name: options.name,
      version: options.version,
      license: options.license.trim(),
      source: options.source.trim(),
      language: options.language ?? 'en',
      scale: options.scale ?? [lo, hi],
      scoring: 'rules',
      negation: options.negation ?? 'ignore',
      negators: [...DEFAULT_NEGATORS],
      window: 3,
      categories: options.ratings.map((r) => ({ name: r.category, aggregation: 'rating', description: `Mean \`${r.column}\` rating of the matched words` })),
      terms,
      notes: [`Converted from a word-norms table by lexichron terms from-norms (columns ${options.ratings.map((r) => `${r.column} → ${r.category}`).join(', ')}); scale ${options.scale ? 'declared' : 'taken from the data'}.`],
    },
  };
}
