import type { Aggregation, Category, LexiconProblem } from '../lexicon/lexicon-types.js';
import { isWildcard, MIN_WILDCARD_STEM } from '../lexicon/parse-lexicon.js';

/** First line of every override file. */
export const OVERRIDES_SIGNATURE = '## lexichron overrides 1';

/** One change of an override file. */
export interface OverrideChange {
  action: 'add' | 'reweight' | 'remove';
  term: string;
  /** Empty for `remove` means: from every category. */
  category: string;
  weight?: number;
  line: number;
}

/** A parsed override file: changes to a base lexicon, applied at load time. */
export interface LexiconOverrides {
  /** The base lexicon: a bundled name or a path relative to the override file. */
  base: string;
  /** When given, the base's content hash must equal it. */
  baseSha256?: string;
  name: string;
  version: string;
  license: string;
  source: string;
  notes: string[];
  /** New categories the added terms may use. */
  categories: Category[];
  changes: OverrideChange[];
}

const REQUIRED = ['base', 'name', 'version', 'license', 'source'] as const;
const KEYS = new Set<string>([...REQUIRED, 'base-sha256', 'note', 'category']);

/**
 * Reads an override file (format in README.md, "Term lists"): metadata lines `## base`, `## name`,
 * `## version`, `## license`, `## source` (required), `## base-sha256`, `## note`, `## category`
 * (optional), a header `change<TAB>term<TAB>category<TAB>weight`, then one change per line:
 * `add` (term, category, weight), `reweight` (term, category, new weight), `remove` (term and
 * optionally category; empty category removes the term from every category).
 * Returns the overrides or every problem with its line.
 */
export function parseLexiconOverrides(text: string): { overrides?: LexiconOverrides; problems: LexiconProblem[] } {
  const problems: LexiconProblem[] = [];
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
  if ((lines[0] ?? '').trim() !== OVERRIDES_SIGNATURE) {
    return { problems: [{ line: 1, message: `the first line must be \`${OVERRIDES_SIGNATURE}\`; this does not look like a lexichron override file` }] };
  }
  const meta = new Map<string, string>();
  const notes: string[] = [];
  const categories: Category[] = [];
  const changes: OverrideChange[] = [];
  let header = false;
  for (let i = 1; i < lines.length; i++) {
    const lineNo = i + 1;
    const line = lines[i] as string;
    if (line.trim() === '') continue;
    if (line.startsWith('##')) {
      const [key = '', ...values] = line.slice(2).split('\t').map((f) => f.trim());
      const value = values.filter((v) => v !== '');
      if (!KEYS.has(key)) problems.push({ line: lineNo, message: `unknown metadata key \`${key}\`; known keys are ${[...KEYS].join(', ')}` });
      else if (key === 'note') notes.push(value.join(' '));
      else if (key === 'category') {
        const [name, aggregation, ...description] = value;
        if (!name || !['count', 'rating', 'sum'].includes(aggregation ?? '')) problems.push({ line: lineNo, message: 'a category line needs a name and an aggregation (count, rating or sum): `## category<TAB>worry<TAB>count`' });
        else categories.push({ name, aggregation: aggregation as Aggregation, description: description.join(' ') });
      } else if (meta.has(key)) problems.push({ line: lineNo, message: `metadata key \`${key}\` appears twice` });
      else meta.set(key, value.join(' '));
      continue;
    }
    const fields = line.split('\t').map((f) => f.trim());
    if (!header) {
      if (fields[0]?.toLowerCase() !== 'change' || fields[1]?.toLowerCase() !== 'term') {
        problems.push({ line: lineNo, message: 'the column header must be `change<TAB>term<TAB>category<TAB>weight`' });
        return { problems };
      }
      header = true;
      continue;
    }
    const [action = '', term = '', category = '', weightText = ''] = fields;
    if (fields.length > 4) {
      problems.push({ line: lineNo, message: `the row has ${fields.length} fields; expected change, term, category, weight separated by single tabs` });
      continue;
    }
    if (action !== 'add' && action !== 'reweight' && action !== 'remove') {
      problems.push({ line: lineNo, message: `unknown change \`${action}\`; use add, reweight or remove` });
      continue;
    }
    if (term === '') {
      problems.push({ line: lineNo, message: 'the term is empty' });
      continue;
    }
    if (term === '*' || (isWildcard(term) && term.length - 1 < MIN_WILDCARD_STEM)) {
      problems.push({ line: lineNo, message: `wildcard \`${term}\` is too short: it would match nearly every word; give at least ${MIN_WILDCARD_STEM} letters before *` });
      continue;
    }
    if (action === 'remove') {
      changes.push({ action, term, category, line: lineNo });
      continue;
    }
    if (category === '') {
      problems.push({ line: lineNo, message: `\`${action} ${term}\` needs a category` });
      continue;
    }
    const weight = Number(weightText);
    if (weightText === '' || !Number.isFinite(weight)) {
      problems.push({ line: lineNo, message: `\`${action} ${term}\` needs a numeric weight (dot as decimal mark), not \`${weightText}\`` });
      continue;
    }
    changes.push({ action, term, category, weight, line: lineNo });
  }
  if (!header) problems.push({ line: lines.length, message: 'no column header `change<TAB>term<TAB>category<TAB>weight` was found' });
  for (const key of REQUIRED) if (!meta.get(key)) problems.push({ line: 1, message: `required metadata \`## ${key}\` is missing or empty` });
  if (problems.length > 0) return { problems };
  const overrides: LexiconOverrides = {
    base: meta.get('base') as string,
    name: meta.get('name') as string,
    version: meta.get('version') as string,
    license: meta.get('license') as string,
    source: meta.get('source') as string,
    notes,
    categories,
    changes,
  };
  if (meta.get('base-sha256')) overrides.baseSha256 = meta.get('base-sha256') as string;
  return { overrides, problems };
}
