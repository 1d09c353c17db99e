import { formatNumber } from '../report/format-number.js';
import { csvDocument } from '../report/csv.js';
import { diffLexicons, type LexiconDiff } from '../terms/diff-lexicons.js';
import { writeFileAtomic } from './atomic-write.js';
import { readLexicon } from './load-lexicon.js';

/**
 * Compares two versions of a lexicon (names or files, `diffLexicons`) and, when `out` is given,
 * writes the changes there: as JSON for a `.json` name, else as CSV.
 */
export async function runTermsDiff(before: string, after: string, out?: string): Promise<LexiconDiff> {
  const d = diffLexicons(await readLexicon(before), await readLexicon(after));
  if (out !== undefined) {
    const w = (v: number | undefined): string => (v === undefined ? '' : formatNumber(v));
    const body = out.endsWith('.json')
      ? JSON.stringify(d, null, 2) + '\n'
      : csvDocument(['change', 'category', 'term', 'weight_before', 'weight_after', 'status_before', 'status_after'], d.changes.map((c) => [c.change, c.category, c.term, w(c.weightBefore), w(c.weightAfter), c.statusBefore ?? '', c.statusAfter ?? '']));
    await writeFileAtomic(out, body);
  }
  return d;
}
