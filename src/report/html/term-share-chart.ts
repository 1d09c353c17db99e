import type { CategoryAudit } from '../report-data.js';
import { chartFrame } from './chart-frame.js';
import { formatValue, groupThousands } from './format-value.js';
import { PALETTE } from './palette.js';
import { px, svgText } from './svg-text.js';

/** Terms shown per category. */
export const TERMS_PER_CATEGORY = 12;

/**
 * Horizontal bars of the terms carrying most of a category's hits, longest first, each labelled
 * with its share of the category's hits and any audit flags (in orange, after the share).
 */
export function termShareChart(c: CategoryAudit): string {
  const terms = [...c.terms].sort((a, b) => b.hits - a.hits || (a.term < b.term ? -1 : 1)).slice(0, TERMS_PER_CATEGORY);
  const rowH = 20;
  const labelW = 130;
  const barW = 240;
  const width = 620;
  const top = 8;
  const height = top + terms.length * rowH + 30;
  const maxShare = Math.max(1e-9, ...terms.map((t) => t.share));
  const parts: string[] = [];
  terms.forEach((t, i) => {
    const y = top + i * rowH;
    const w = (t.share / maxShare) * barW;
    parts.push(svgText(labelW - 6, y + 14, t.term, 'text-anchor="end" class="term"'));
    parts.push(`<rect class="mark" x="${labelW}" y="${y + 3}" width="${px(Math.max(1, w))}" height="${rowH - 6}" fill="${PALETTE.score}"/>`);
    parts.push(svgText(labelW + w + 6, y + 14, `${formatValue(100 * t.share, 1)}% (${groupThousands(t.hits)})`, 'class="tick"'));
    if (t.flags.length) parts.push(svgText(labelW + w + 92, y + 14, `⚑ ${t.flags.join(', ')}`, `class="tick flag" fill="#8a5a00"`));
  });
  parts.push(`<line x1="${labelW}" x2="${labelW}" y1="${top}" y2="${top + terms.length * rowH}" stroke="${PALETTE.muted}"/>`);
  parts.push(svgText(labelW + barW / 2, height - 6, 'Share of the category\'s matched terms (%; hits in brackets)', 'text-anchor="middle" class="axis-title"'));
  const cut = c.terms.length - terms.length;
  return chartFrame({
    name: `terms-${c.lexicon}-${c.category}`.replace(/[^A-Za-z0-9-]/g, '-'),
    title: `${c.lexicon} · ${c.category}: the terms behind ${groupThousands(c.totalHits)} hits`,
    ...(cut > 0 ? { note: `Top ${terms.length} of ${c.terms.length} matched terms.` } : {}),
    width,
    height,
    body: parts.join(''),
  });
}
