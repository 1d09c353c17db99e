import type { Lexicon } from './lexicon-types.js';
import { LEXICON_SIGNATURE } from './parse-lexicon.js';
import { DEFAULT_NEGATORS } from './lexicon-types.js';

function clean(value: string): string {
  return value.replace(/[\t\r\n]+/g, ' ').trim();
}

/**
 * Writes a lexicon in the lexichron lexicon format (lexicons/README.md). `parseLexicon` reads
 * the result back to an equal lexicon. Terms keep their order; the `status` column is written
 * only when some term is not accepted.
 */
export function serializeLexicon(lexicon: Lexicon): string {
  const lines = [LEXICON_SIGNATURE];
  const meta = (key: string, ...values: Array<string | number>): void => {
    lines.push(['## ' + key, ...values.map((v) => clean(String(v)))].join('\t'));
  };
  meta('name', lexicon.name);
  meta('version', lexicon.version);
  meta('license', lexicon.license);
  meta('source', lexicon.source);
  meta('language', lexicon.language);
  meta('scale', lexicon.scale[0], lexicon.scale[1]);
  if (lexicon.scoring !== 'rules') meta('scoring', lexicon.scoring);
  meta('negation', lexicon.negation);
  const defaultNegators = lexicon.negators.length === DEFAULT_NEGATORS.length && lexicon.negators.every((n, i) => n === DEFAULT_NEGATORS[i]);
  if (!defaultNegators) meta('negators', ...lexicon.negators);
  meta('window', lexicon.window);
  for (const note of lexicon.notes) meta('note', note);
  for (const c of lexicon.categories) meta('category', c.name, c.aggregation, ...(c.description ? [c.description] : []));
  const withStatus = lexicon.terms.some((t) => t.status !== 'accepted');
  lines.push(withStatus ? 'term\tcategory\tweight\tstatus' : 'term\tcategory\tweight');
  for (const t of lexicon.terms) {
    const row = [clean(t.term), t.category, String(t.weight)];
    if (withStatus) row.push(t.status);
    lines.push(row.join('\t'));
  }
  return lines.join('\n') + '\n';
}
