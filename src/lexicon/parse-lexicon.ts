import {
  DEFAULT_NEGATORS,
  type Aggregation,
  type Category,
  type Lexicon,
  type LexiconProblem,
  type LexiconScoring,
  type NegationRule,
  type TermRow,
  type TermStatus,
} from './lexicon-types.js';

/** First line of every lexicon file. */
export const LEXICON_SIGNATURE = '## lexichron lexicon 1';

const REQUIRED = ['name', 'version', 'license', 'source', 'language'] as const;
const KNOWN_KEYS = new Set([...REQUIRED, 'scale', 'scoring', 'negation', 'negators', 'window', 'category', 'note']);
const AGGREGATIONS: readonly Aggregation[] = ['count', 'rating', 'sum'];
const NEGATIONS: readonly NegationRule[] = ['flip', 'drop', 'ignore'];
const STATUSES: readonly TermStatus[] = ['accepted', 'pending', 'rejected'];
/** Fewest characters a wildcard stem may have before `*` (shorter stems match too much). */
export const MIN_WILDCARD_STEM = 3;
const STEM = /^[\p{L}\p{M}\p{N}'’-]+$/u;

/** Whether a term is a trailing wildcard (`worr*`): a stem of letters followed by one `*`. */
export function isWildcard(term: string): boolean {
  return term.endsWith('*') && term.length > 1 && STEM.test(term.slice(0, -1));
}

export interface ParseLexiconResult {
  /** The lexicon when the file had no problems. */
  lexicon?: Lexicon;
  problems: LexiconProblem[];
}

/** A value from the file as a problem quotes it: in backticks, cut after 60 characters (a line may be megabytes long). */
function shown(value: string): string {
  return `\`${value.length > 60 ? `${value.slice(0, 60)}…` : value}\``;
}

/**
 * Reads the text of a lexichron lexicon file (format in lexicons/README.md).
 *
 * Returns the lexicon, or every problem found with its line: missing or unknown metadata,
 * bad scale, unknown category, bad weight or weight outside the scale, duplicate term,
 * the same term with different weights, a wildcard that is too short or not trailing,
 * a bad status, a wrong number of fields.
 */
export function parseLexicon(text: string): ParseLexiconResult {
  const problems: LexiconProblem[] = [];
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
  if ((lines[0] ?? '').trim() !== LEXICON_SIGNATURE) {
    problems.push({ line: 1, message: `the first line must be \`${LEXICON_SIGNATURE}\`; this does not look like a lexichron lexicon file` });
    return { problems };
  }
  const meta = new Map<string, string[]>();
  const categories: Category[] = [];
  const notes: string[] = [];
  const terms: TermRow[] = [];
  let header: string[] | undefined;
  for (let i = 1; i < lines.length; i++) {
    const lineNo = i + 1;
    const line = lines[i] as string;
    if (line.trim() === '' || /^\t*$/.test(line)) continue;
    if (line.startsWith('##')) {
      const fields = line.slice(2).split('\t').map((f) => f.trim());
      const key = fields[0] ?? '';
      const values = fields.slice(1).filter((v) => v !== '');
      if (!KNOWN_KEYS.has(key)) {
        problems.push({ line: lineNo, message: `unknown metadata key ${shown(key)}; known keys are ${[...KNOWN_KEYS].join(', ')}` });
        continue;
      }
      if (key === 'category') {
        const [name, aggregation, ...description] = values;
        if (!name || !aggregation) {
          problems.push({ line: lineNo, message: 'a category line needs a name and an aggregation: `## category<TAB>worry<TAB>count`' });
        } else if (!AGGREGATIONS.includes(aggregation as Aggregation)) {
          problems.push({ line: lineNo, message: `unknown aggregation ${shown(aggregation)} for category ${shown(name)}; use count, rating or sum` });
        } else if (categories.some((c) => c.name === name)) {
          problems.push({ line: lineNo, message: `category ${shown(name)} is declared twice` });
        } else {
          categories.push({ name, aggregation: aggregation as Aggregation, description: description.join(' ') });
        }
        continue;
      }
      if (key === 'note') {
        notes.push(values.join(' '));
        continue;
      }
      if (meta.has(key)) problems.push({ line: lineNo, message: `metadata key ${shown(key)} appears twice` });
      meta.set(key, values);
      continue;
    }
    const fields = line.split('\t');
    if (!header) {
      header = fields.map((f) => f.trim().toLowerCase());
      if (header[0] !== 'term' || header[1] !== 'category' || header[2] !== 'weight' || (header.length > 3 && header[3] !== 'status')) {
        problems.push({ line: lineNo, message: 'the column header must be `term<TAB>category<TAB>weight` (and optionally `<TAB>status`)' });
        return { problems };
      }
      continue;
    }
    const [termRaw = '', categoryRaw = '', weightRaw = '', statusRaw = ''] = fields;
    if (fields.length > header.length) {
      problems.push({ line: lineNo, message: `the row has ${fields.length} fields but the header has ${header.length}; separate columns with one tab` });
      continue;
    }
    const term = termRaw.trim();
    const category = categoryRaw.trim();
    if (term === '') {
      problems.push({ line: lineNo, message: 'the term is empty' });
      continue;
    }
    if (term !== '*' && term.includes('*') && !isWildcard(term) && /^[\p{L}\p{M}\p{N}\s'’-]*\*[\p{L}\p{M}\p{N}\s'’*-]*$/u.test(term)) {
      problems.push({ line: lineNo, message: `${shown(term)}: a wildcard may only end a single word, as in \`worr*\`` });
      continue;
    }
    if (term === '*' || (isWildcard(term) && term.length - 1 < MIN_WILDCARD_STEM)) {
      problems.push({ line: lineNo, message: `wildcard ${shown(term)} is too short: it would match nearly every word; give at least ${MIN_WILDCARD_STEM} letters before *` });
      continue;
    }
    const weightText = weightRaw.trim() === '' ? '1' : weightRaw.trim();
    const weight = Number(weightText);
    if (!Number.isFinite(weight) || !/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(weightText)) {
      problems.push({ line: lineNo, message: `weight ${shown(weightRaw)} of ${shown(term)} is not a number; write it with a dot as decimal mark, e.g. 1.5` });
      continue;
    }
    const status = (statusRaw.trim().toLowerCase() || 'accepted') as TermStatus;
    if (!STATUSES.includes(status)) {
      problems.push({ line: lineNo, message: `status ${shown(statusRaw)} of ${shown(term)} is not one of accepted, pending, rejected` });
      continue;
    }
    terms.push({ term, category, weight, status, line: lineNo });
  }
  if (!header) problems.push({ line: lines.length, message: 'no column header `term<TAB>category<TAB>weight` was found' });

  for (const key of REQUIRED) {
    if (!meta.get(key)?.length) problems.push({ line: 1, message: `required metadata \`## ${key}\` is missing or empty` });
  }
  const scaleValues = (meta.get('scale') ?? ['1', '1']).map(Number);
  let scale: [number, number] = [1, 1];
  if (scaleValues.length !== 2 || scaleValues.some((v) => !Number.isFinite(v)) || (scaleValues[0] as number) > (scaleValues[1] as number)) {
    problems.push({ line: 1, message: '`## scale` needs two numbers, lowest then highest weight, e.g. `## scale<TAB>-5<TAB>5`' });
  } else scale = [scaleValues[0] as number, scaleValues[1] as number];
  const scoring = meta.get('scoring')?.[0] ?? 'rules';
  if (scoring !== 'rules' && scoring !== 'vader' && scoring !== 'plain-words') problems.push({ line: 1, message: `unknown scoring ${shown(scoring)}; use rules, vader or plain-words` });
  const negation = (meta.get('negation')?.[0] ?? 'ignore') as NegationRule;
  if (!NEGATIONS.includes(negation)) problems.push({ line: 1, message: `unknown negation rule ${shown(negation)}; use flip, drop or ignore` });
  const windowText = meta.get('window')?.[0] ?? '3';
  const window = Number(windowText);
  if (!Number.isInteger(window) || window < 0 || window > 20) problems.push({ line: 1, message: `\`## window\` must be a whole number of tokens from 0 to 20, not ${shown(windowText)}` });
  if (categories.length === 0) problems.push({ line: 1, message: 'no category is declared; add `## category<TAB>NAME<TAB>count|rating|sum`' });

  const seen = new Map<string, TermRow>();
  for (const row of terms) {
    if (!categories.some((c) => c.name === row.category)) {
      problems.push({ line: row.line, message: `${shown(row.term)} names category ${shown(row.category)}, which is not declared; declare it with \`## category\` or fix the name` });
      continue;
    }
    if (row.weight < scale[0] || row.weight > scale[1]) {
      problems.push({ line: row.line, message: `weight ${row.weight} of ${shown(row.term)} is outside the scale ${scale[0]} to ${scale[1]}` });
    }
    const key = `${scoring === 'vader' ? row.term : row.term.toLocaleLowerCase()}\u0000${row.category}`;
    const previous = seen.get(key);
    if (previous) {
      problems.push({
        line: row.line,
        message: previous.weight === row.weight
          ? `${shown(row.term)} is listed twice in category ${shown(row.category)} (first on line ${previous.line}); remove one`
          : `${shown(row.term)} is listed twice in category ${shown(row.category)} with different weights (${previous.weight} on line ${previous.line}, ${row.weight} here); keep one`,
      });
      continue;
    }
    seen.set(key, row);
  }
  if (problems.length > 0) return { problems };
  const one = (key: string): string => (meta.get(key) ?? []).join(' ');
  return {
    problems,
    lexicon: {
      name: one('name'),
      version: one('version'),
      license: one('license'),
      source: one('source'),
      language: one('language'),
      scale,
      scoring: scoring as LexiconScoring,
      negation,
      negators: meta.has('negators') ? (meta.get('negators') as string[]).map((n) => n.toLowerCase()) : [...DEFAULT_NEGATORS],
      window,
      categories,
      terms,
      notes,
    },
  };
}
