import type { LexiconProblem } from '../lexicon/lexicon-types.js';
import type { WordNetRelation } from './wordnet-related-lemmas.js';
import type { WordNetPos } from './wordnet-types.js';

/** First line of every seed file. */
export const SEEDS_SIGNATURE = '## lexichron seeds 1';

/** A seed word, optionally restricted to one part of speech (`angry/a`). */
export interface Seed {
  word: string;
  pos?: WordNetPos;
}

/** A seed file: categories with their seed words and how to grow them from WordNet. */
export interface SeedFile {
  name: string;
  version: string;
  source: string;
  notes: string[];
  /** WordNet senses followed per seed and part of speech (most frequent first). */
  senses: number;
  relations: WordNetRelation[];
  categories: Array<{ name: string; seeds: Seed[]; description: string; line: number }>;
}

const RELATIONS: readonly WordNetRelation[] = ['synonym', 'similar', 'see-also', 'derived', 'pertainym'];

/**
 * Reads a seed file (format in README.md, "Term lists"): `## name`, `## version`, `## source`,
 * `## senses` (default 1), `## relations` (default synonym, similar), `## note`, then a header
 * `category<TAB>seeds<TAB>description` and one category per line with comma-separated seeds
 * (`word` or `word/pos`, pos one of n, v, a, r). Returns the seeds or every problem with its line.
 */
export function parseSeedFile(text: string): { seeds?: SeedFile; problems: LexiconProblem[] } {
  const problems: LexiconProblem[] = [];
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
  if ((lines[0] ?? '').trim() !== SEEDS_SIGNATURE) return { problems: [{ line: 1, message: `the first line must be \`${SEEDS_SIGNATURE}\`` }] };
  const meta = new Map<string, string>();
  const notes: string[] = [];
  const categories: SeedFile['categories'] = [];
  let header = false;
  for (let i = 1; i < lines.length; i++) {
    const line = lines[i] as string;
    const lineNo = i + 1;
    if (line.trim() === '') continue;
    const fields = line.replace(/^##/, '').split('\t').map((f) => f.trim());
    if (line.startsWith('##')) {
      const [key = '', ...rest] = fields;
      if (key === 'note') notes.push(rest.join(' '));
      else if (['name', 'version', 'source', 'senses', 'relations'].includes(key)) meta.set(key, rest.join(' ').trim());
      else problems.push({ line: lineNo, message: `unknown metadata key \`${key}\`; use name, version, source, senses, relations or note` });
      continue;
    }
    if (!header) {
      if (fields[0] !== 'category' || fields[1] !== 'seeds') {
        problems.push({ line: lineNo, message: 'the column header must be `category<TAB>seeds<TAB>description`' });
        return { problems };
      }
      header = true;
      continue;
    }
    const [name = '', seedText = '', description = ''] = fields;
    const seeds: Seed[] = [];
    for (const s of seedText.split(',').map((x) => x.trim()).filter((x) => x !== '')) {
      const m = /^([^/]+?)(?:\/([nvar]))?$/.exec(s);
      if (!m) problems.push({ line: lineNo, message: `seed \`${s}\` is not \`word\` or \`word/pos\` with pos one of n, v, a, r` });
      else seeds.push(m[2] ? { word: (m[1] as string).toLowerCase(), pos: m[2] as WordNetPos } : { word: (m[1] as string).toLowerCase() });
    }
    if (name === '' || seeds.length === 0) problems.push({ line: lineNo, message: 'each line needs a category name and at least one seed' });
    else if (categories.some((c) => c.name === name)) problems.push({ line: lineNo, message: `category \`${name}\` appears twice` });
    else categories.push({ name, seeds, description, line: lineNo });
  }
  for (const key of ['name', 'version', 'source']) if (!meta.get(key)) problems.push({ line: 1, message: `required metadata \`## ${key}\` is missing` });
  const senses = Number(meta.get('senses') ?? '1');
  if (!Number.isInteger(senses) || senses < 1) problems.push({ line: 1, message: '`## senses` must be a whole number ≥ 1' });
  const relations = (meta.get('relations') ?? 'synonym,similar').split(',').map((r) => r.trim()) as WordNetRelation[];
  for (const r of relations) if (!RELATIONS.includes(r)) problems.push({ line: 1, message: `unknown relation \`${r}\`; use ${RELATIONS.join(', ')}` });
  if (problems.length > 0) return { problems };
  return { problems, seeds: { name: meta.get('name') as string, version: meta.get('version') as string, source: meta.get('source') as string, notes, senses, relations, categories } };
}
