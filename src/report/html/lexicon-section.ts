import type { LexiconAuditData, Part } from '../report-data.js';
import { absentNote } from './absent-note.js';
import { escapeHtml } from './escape-html.js';
import { sectionFrame } from './section-frame.js';
import { termShareChart } from './term-share-chart.js';

/**
 * Section 4: per lexicon category, the terms that carry most of its hits with their shares and
 * the audit's flags, and what each flag means. A category driven by one or two words measures
 * those words, whatever its name says.
 */
export function lexiconSection(lexicons: Part<LexiconAuditData>): string {
  const purpose = 'Which words actually produce each category\'s score, and which of them the audit flags for a closer look.';
  if (!lexicons.ok) return sectionFrame('lexicons', 4, 'Lexicons', purpose, absentNote('The term audit is', lexicons.reason));
  const l = lexicons.value;
  const parts: string[] = [];
  const flags = Object.entries(l.flagMeanings);
  if (flags.length) parts.push(`<dl class="flags">${flags.map(([f, m]) => `<dt>⚑ ${escapeHtml(f)}</dt><dd>${escapeHtml(m)}</dd>`).join('')}</dl>`);
  if (l.categories.length === 0) parts.push(absentNote('Term counts are', 'the audit output lists no category with matched terms.'));
  parts.push(`<div class="multiples wide">${l.categories.map(termShareChart).join('')}</div>`);
  return sectionFrame('lexicons', 4, 'Lexicons', purpose, parts.join(''));
}
