import { lexiconHash } from '../lexicon/lexicon-hash.js';
import type { Lexicon, LexiconProblem, TermRow } from '../lexicon/lexicon-types.js';
import type { LexiconOverrides } from './lexicon-overrides.js';

/**
 * Applies an override file to its base lexicon without changing the base: removes, reweights
 * and adds terms, and adds the override's categories. The result takes the override's name and
 * version, joins both licenses and sources, and notes the base's name, version and content hash
 * with the number of changes, so outputs name exactly which list was used.
 *
 * Problems (with the override file's line): the base hash differs from `## base-sha256`,
 * `add` of a term already in the category (use reweight), `reweight` or `remove` of a term the
 * base does not have, an unknown category, a weight outside the base's scale, a term changed twice.
 * A scorer that uses `vader` rules cannot be overridden.
 */
export function applyLexiconOverrides(base: Lexicon, overrides: LexiconOverrides): { lexicon?: Lexicon; problems: LexiconProblem[] } {
  const problems: LexiconProblem[] = [];
  const baseHash = lexiconHash(base);
  if (base.scoring === 'vader') problems.push({ line: 1, message: `\`${base.name}\` is scored with the VADER rules and cannot be overridden; override a rules lexicon instead` });
  if (overrides.baseSha256 && overrides.baseSha256 !== baseHash) {
    problems.push({ line: 1, message: `the base \`${base.name}\` has content hash ${baseHash}, not ${overrides.baseSha256} as \`## base-sha256\` requires; the base changed since the overrides were written: review them and update the hash` });
  }
  const categories = [...base.categories];
  for (const c of overrides.categories) {
    if (categories.some((x) => x.name === c.name)) problems.push({ line: 1, message: `category \`${c.name}\` already exists in \`${base.name}\`; remove its \`## category\` line` });
    else categories.push(c);
  }
  const key = (term: string, category: string): string => `${category}\u0000${term.toLowerCase()}`;
  const terms: Array<TermRow | undefined> = base.terms.map((t) => ({ ...t }));
  const index = new Map(base.terms.map((t, i) => [key(t.term, t.category), i]));
  const touched = new Map<string, number>();
  let added = 0;
  let reweighted = 0;
  let removed = 0;
  for (const ch of overrides.changes) {
    const where = `\`${ch.action} ${ch.term}\``;
    const k = key(ch.term, ch.category);
    if (touched.has(k)) {
      problems.push({ line: ch.line, message: `${where}: this term was already changed on line ${touched.get(k)}; keep one change per term` });
      continue;
    }
    touched.set(k, ch.line);
    if (ch.category !== '' && !categories.some((c) => c.name === ch.category)) {
      problems.push({ line: ch.line, message: `${where}: category \`${ch.category}\` is not in \`${base.name}\` (${categories.map((c) => c.name).join(', ')}); declare it with \`## category\` or fix the name` });
      continue;
    }
    if (ch.weight !== undefined && (ch.weight < base.scale[0] || ch.weight > base.scale[1])) {
      problems.push({
        line: ch.line,
        message: `${where}: weight ${ch.weight} is outside the scale ${base.scale[0]} to ${base.scale[1]} of \`${base.name}\`; use a weight within it, or copy the lexicon and widen its \`## scale\` line (a list whose scale is 1 to 1, the default, weighs every term 1)`,
      });
      continue;
    }
    if (ch.action === 'remove') {
      const hits = ch.category === '' ? base.terms.map((t, i) => (t.term.toLowerCase() === ch.term.toLowerCase() ? i : -1)).filter((i) => i >= 0) : [index.get(k)].filter((i): i is number => i !== undefined);
      if (hits.length === 0 || hits.every((i) => terms[i] === undefined)) {
        problems.push({ line: ch.line, message: `${where}: \`${base.name}\` has no such term${ch.category ? ` in category \`${ch.category}\`` : ''}; check the spelling or drop the line` });
        continue;
      }
      for (const i of hits) terms[i] = undefined;
      removed += hits.length;
      continue;
    }
    const i = index.get(k);
    if (ch.action === 'reweight') {
      const row = i === undefined ? undefined : terms[i];
      if (!row) {
        problems.push({ line: ch.line, message: `${where}: \`${base.name}\` has no such term in category \`${ch.category}\`; use add to add it` });
        continue;
      }
      row.weight = ch.weight as number;
      reweighted++;
      continue;
    }
    if (i !== undefined) {
      problems.push({ line: ch.line, message: `${where}: \`${base.name}\` already has it in category \`${ch.category}\` (weight ${base.terms[i]?.weight}); use reweight to change its weight` });
      continue;
    }
    terms.push({ term: ch.term, category: ch.category, weight: ch.weight as number, status: 'accepted', line: ch.line });
    added++;
  }
  if (problems.length > 0) return { problems };
  return {
    problems,
    lexicon: {
      ...base,
      name: overrides.name,
      version: overrides.version,
      license: `${base.license}; overrides: ${overrides.license}`,
      source: `${base.source}; overrides: ${overrides.source}`,
      categories,
      terms: terms.filter((t): t is TermRow => t !== undefined),
      notes: [
        ...base.notes,
        ...overrides.notes,
        `Derived from ${base.name} ${base.version} (sha256 ${baseHash}) by overrides: ${added} added, ${reweighted} reweighted, ${removed} removed.`,
      ],
    },
  };
}
