import type { Tick } from './axis-bottom.js';
import { PALETTE } from './palette.js';
import { px, svgText } from './svg-text.js';

/** Options of {@link axisVertical}. */
export interface VerticalAxis {
  ticks: readonly Tick[];
  scale: (v: number) => number;
  /** Pixel column of the axis line. */
  x: number;
  y0: number;
  y1: number;
  /** Axis title with unit, written rotated beside the labels. */
  title: string;
  side: 'left' | 'right';
  /** Colour of labels and title (to tie a scale to its series); default ink. */
  colour?: string;
  /** Draw horizontal grid lines to this pixel column. */
  gridTo?: number;
}

/**
 * A vertical axis on the left or right of a plot: line, ticks, labels and a rotated title, in the
 * colour of the series it belongs to when two scales share a chart.
 */
export function axisVertical(a: VerticalAxis): string {
  const colour = a.colour ?? PALETTE.ink;
  const dir = a.side === 'left' ? -1 : 1;
  const top = Math.min(a.y0, a.y1);
  const bottom = Math.max(a.y0, a.y1);
  const parts: string[] = [`<g class="axis axis-y">`];
  for (const t of a.ticks) {
    const y = a.scale(t.value);
    if (y < top - 0.5 || y > bottom + 0.5) continue;
    if (a.gridTo !== undefined) parts.push(`<line x1="${px(a.x)}" x2="${px(a.gridTo)}" y1="${px(y)}" y2="${px(y)}" stroke="${PALETTE.grid}"/>`);
    parts.push(`<line x1="${px(a.x)}" x2="${px(a.x + dir * 4)}" y1="${px(y)}" y2="${px(y)}" stroke="${colour}"/>`);
    parts.push(svgText(a.x + dir * 7, y + 4, t.label, `text-anchor="${a.side === 'left' ? 'end' : 'start'}" class="tick" fill="${colour}"`));
  }
  parts.push(`<line x1="${px(a.x)}" x2="${px(a.x)}" y1="${px(top)}" y2="${px(bottom)}" stroke="${colour}"/>`);
  const tx = a.x + dir * 44;
  const ty = (top + bottom) / 2;
  parts.push(svgText(tx, ty, a.title, `text-anchor="middle" class="axis-title" fill="${colour}" transform="rotate(${a.side === 'left' ? -90 : 90} ${px(tx)} ${px(ty)})"`));
  parts.push('</g>');
  return parts.join('');
}
