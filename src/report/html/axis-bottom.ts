import { PALETTE } from './palette.js';
import { px, svgText } from './svg-text.js';

/** A tick of an axis: position in data units and its label. */
export interface Tick {
  value: number;
  label: string;
}

/**
 * A horizontal axis at pixel row `y` from `x0` to `x1`: baseline, tick marks with labels, light
 * vertical grid lines up to `top` when given, and the axis title (with its unit) centred below.
 */
export function axisBottom(ticks: readonly Tick[], scale: (v: number) => number, y: number, x0: number, x1: number, title: string, top?: number): string {
  const parts: string[] = [`<g class="axis axis-x">`];
  for (const t of ticks) {
    const x = scale(t.value);
    if (x < x0 - 0.5 || x > x1 + 0.5) continue;
    if (top !== undefined) parts.push(`<line x1="${px(x)}" x2="${px(x)}" y1="${px(top)}" y2="${px(y)}" stroke="${PALETTE.grid}" stroke-width="1"/>`);
    parts.push(`<line x1="${px(x)}" x2="${px(x)}" y1="${px(y)}" y2="${px(y + 4)}" stroke="${PALETTE.muted}"/>`);
    parts.push(svgText(x, y + 15, t.label, 'text-anchor="middle" class="tick"'));
  }
  parts.push(`<line x1="${px(x0)}" x2="${px(x1)}" y1="${px(y)}" y2="${px(y)}" stroke="${PALETTE.muted}"/>`);
  if (title) parts.push(svgText((x0 + x1) / 2, y + 32, title, 'text-anchor="middle" class="axis-title"'));
  parts.push('</g>');
  return parts.join('');
}
