import type { CategoryAudit, LexiconAuditData, Part } from '../report-data.js';
import { absentNote } from './absent-note.js';
import { escapeHtml } from './escape-html.js';
import { groupThousands } from './format-value.js';
import { sectionFrame } from './section-frame.js';
import { termShareChart } from './term-share-chart.js';

/**
 * Section 4: per lexicon category, the terms that carry most of its hits with their shares and
 * the audit's flags, and what each flag means; then the terms that never matched, per category.
 * A category driven by one or two words measures those words, whatever its name says.
 */
export function lexiconSection(lexicons: Part<LexiconAuditData>): string {
  const purpose = 'Which words actually produce each category\'s score, and which of them the audit flags for a closer look.';
  if (!lexicons.ok) return sectionFrame('lexicons', 4, 'Lexicons', purpose, absentNote('The term audit is', lexicons.reason));
  const l = lexicons.value;
  const parts: string[] = [];
  const flags = Object.entries(l.flagMeanings);
  if (flags.length) parts.push(`<dl class="flags">${flags.map(([f, m]) => `<dt>⚑ ${escapeHtml(f)}</dt><dd>${escapeHtml(m)}</dd>`).join('')}</dl>`);
  const matched = l.categories.filter((c) => c.terms.length > 0);
  if (matched.length === 0) parts.push(absentNote('Term counts are', 'the audit output lists no category with matched terms.'));
  else parts.push(`<div class="multiples wide">${matched.map(termShareChart).join('')}</div>`);
  const unmatched = l.categories.filter((c) => (c.neverMatched?.length ?? 0) > 0);
  if (unmatched.length) {
    parts.push(
      '<h3>Terms that never matched</h3><p>A term that never matches adds nothing to its category here. In a short construct list, many such terms, or a category with none matched, suggest the list does not fit how these people write; in a large general lexicon most terms never occur in any one corpus. Full lists are in each lexicon\'s <code>term-hits.csv</code>.</p>' +
        `<ul class="never-matched">${unmatched.map(neverMatchedItem).join('')}</ul>`,
    );
  }
  return sectionFrame('lexicons', 4, 'Lexicons', purpose, parts.join(''));
}

/** Never-matched terms shown per category before "and N more". */
const NEVER_MATCHED_SHOWN = 12;

/** One category's line of the never-matched list. */
function neverMatchedItem(c: CategoryAudit): string {
  const terms = c.neverMatched ?? [];
  const shown = terms.slice(0, NEVER_MATCHED_SHOWN).map((t) => `<code>${escapeHtml(t)}</code>`).join(', ');
  const more = terms.length > NEVER_MATCHED_SHOWN ? ` and ${groupThousands(terms.length - NEVER_MATCHED_SHOWN)} more` : '';
  const of = c.termCount !== undefined ? ` of ${groupThousands(c.termCount)}` : '';
  const what = c.terms.length === 0 ? `none of its ${groupThousands(terms.length)} terms matched` : `${groupThousands(terms.length)}${of} terms never matched`;
  return `<li><b>${escapeHtml(c.lexicon)} · ${escapeHtml(c.category)}</b>: ${what}: ${shown}${more}</li>`;
}
