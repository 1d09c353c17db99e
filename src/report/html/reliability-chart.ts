import type { ReliabilityCurve } from '../report-data.js';
import { axisBottom } from './axis-bottom.js';
import { axisVertical } from './axis-vertical.js';
import { chartFrame } from './chart-frame.js';
import { formatValue, groupThousands } from './format-value.js';
import { linearScale } from './linear-scale.js';
import { linePath } from './line-path.js';
import { niceTicks } from './nice-ticks.js';
import { PALETTE } from './palette.js';
import { px, svgText } from './svg-text.js';

/** Title of the reliability axis (kept short so that, rotated, it fits the plot's height). */
export const RELIABILITY_AXIS_TITLE = 'Split-half reliability (0–1)';

/**
 * Reliability of a bin score against the words in the bin: the estimated curve (line and dots),
 * its interval as a band when given, the target reliability as a dashed line and the recommended
 * minimum word count as a dotted vertical line.
 */
export function reliabilityChart(curve: ReliabilityCurve): string {
  const width = 560;
  const height = 320;
  const x0 = 64;
  const x1 = width - 20;
  const yTop = 30;
  const yBottom = height - 52;
  const pts = [...curve.points].sort((a, b) => a.words - b.words);
  const maxWords = Math.max(1, ...pts.map((p) => p.words), curve.recommendedMinWords ?? 0);
  const xt = niceTicks(0, maxWords, 6);
  const x = linearScale(xt.domain, [x0, x1]);
  // Reliabilities are 0–1: a band whose halves do not agree is not estimable and is not drawn.
  const yt = niceTicks(0, 1, 5);
  const y = linearScale(yt.domain, [yBottom, yTop]);
  const parts: string[] = [];
  // A short title: rotated, it must fit the plot's height (238 px; about 7 px a character at 12 px bold).
  parts.push(axisVertical({ ticks: yt.ticks.map((v) => ({ value: v, label: formatValue(v, 1) })), scale: y, x: x0, y0: yTop, y1: yBottom, title: RELIABILITY_AXIS_TITLE, side: 'left', gridTo: x1 }));
  parts.push(axisBottom(xt.ticks.map((v) => ({ value: v, label: groupThousands(v) })), x, yBottom, x0, x1, 'Words in the bin', yTop));
  const banded = pts.filter((p) => p.low !== undefined && p.high !== undefined);
  if (banded.length > 1) {
    const upper = banded.map((p) => `${px(x(p.words))} ${px(y(p.high as number))}`);
    const lower = banded.map((p) => `${px(x(p.words))} ${px(y(p.low as number))}`).reverse();
    parts.push(`<path class="mark band" d="M${upper.join('L')}L${lower.join('L')}Z" fill="${PALETTE.band}" fill-opacity="0.3"/>`);
  }
  if (curve.target !== undefined) {
    parts.push(`<line x1="${x0}" x2="${x1}" y1="${px(y(curve.target))}" y2="${px(y(curve.target))}" stroke="${PALETTE.flag}" stroke-width="1.5" stroke-dasharray="6 4"/>`);
    parts.push(svgText(x1 - 4, y(curve.target) - 5, `target ${formatValue(curve.target)}`, `text-anchor="end" class="tick" fill="${PALETTE.ink}"`));
  }
  if (curve.recommendedMinWords !== undefined) {
    const rx = x(curve.recommendedMinWords);
    parts.push(`<line x1="${px(rx)}" x2="${px(rx)}" y1="${yTop}" y2="${yBottom}" stroke="${PALETTE.ink}" stroke-dasharray="2 3"/>`);
    const nearRight = rx > x1 - 110;
    parts.push(svgText(nearRight ? rx - 4 : rx + 4, yBottom - 8, `--min-words ${curve.recommendedMinWords}`, `class="tick" text-anchor="${nearRight ? 'end' : 'start'}"`));
  }
  parts.push(`<path class="mark" d="${linePath(pts.map((p) => ({ x: x(p.words), y: y(p.reliability) })))}" fill="none" stroke="${PALETTE.score}" stroke-width="2"/>`);
  for (const p of pts) parts.push(`<circle class="mark" cx="${px(x(p.words))}" cy="${px(y(p.reliability))}" r="3" fill="${PALETTE.score}"/>`);
  return chartFrame({
    name: `reliability-${curve.score.replace(/[^A-Za-z0-9-]/g, '-')}`,
    title: `How reliable a bin's ${curve.score} is, by the number of words in the bin`,
    note: curve.note ?? 'Split-half reliability across entries within bins, averaged over random splits, Spearman–Brown corrected; bands whose halves do not agree are not estimable and not drawn.',
    width,
    height,
    body: parts.join(''),
  });
}
