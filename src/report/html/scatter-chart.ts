import { axisBottom } from './axis-bottom.js';
import { axisVertical } from './axis-vertical.js';
import { chartFrame } from './chart-frame.js';
import { formatValue } from './format-value.js';
import { leastSquaresLine } from './least-squares-line.js';
import { linearScale } from './linear-scale.js';
import { niceTicks } from './nice-ticks.js';
import { PALETTE } from './palette.js';
import { px, svgText } from './svg-text.js';
import { valueExtent } from './value-extent.js';

/** Most points drawn in one scatter; beyond this every k-th point is drawn (statistics use all). */
export const MAX_SCATTER_POINTS = 3000;

/** What {@link scatterChart} draws. */
export interface ScatterChartOptions {
  name: string;
  title: string;
  note?: string;
  points: readonly { x: number; y: number }[];
  xLabel: string;
  yLabel: string;
  colour: string;
  /** Statistic printed in the plot corner, e.g. `r = 0.21 [0.12, 0.30]`. */
  statText: string;
  /** Marker radius. */
  radius?: number;
}

const tickLabels = (ticks: number[]): { value: number; label: string }[] => {
  const step = ticks.length > 1 ? Math.abs((ticks[1] as number) - (ticks[0] as number)) : 1;
  const digits = step >= 1 ? 0 : step >= 0.1 ? 1 : step >= 0.01 ? 2 : 3;
  return ticks.map((v) => ({ value: v, label: formatValue(v, digits) }));
};

/**
 * A scatter of (x, y) with a least-squares line and the correlation printed in the corner.
 * Points are half-transparent so overplotting shows as density; past
 * {@link MAX_SCATTER_POINTS} points a regular subsample is drawn and the note says so.
 */
export function scatterChart(o: ScatterChartOptions): string {
  const width = 440;
  const height = 360;
  const x0 = 64;
  const x1 = width - 16;
  const yTop = 34;
  const yBottom = height - 52;
  const xExt = valueExtent(o.points.map((p) => p.x)) ?? [0, 1];
  const yExt = valueExtent(o.points.map((p) => p.y)) ?? [0, 1];
  const xt = niceTicks(xExt[0], xExt[1], 5);
  const yt = niceTicks(yExt[0], yExt[1], 5);
  const x = linearScale(xt.domain, [x0, x1]);
  const y = linearScale(yt.domain, [yBottom, yTop]);
  const parts: string[] = [];
  parts.push(axisVertical({ ticks: tickLabels(yt.ticks), scale: y, x: x0, y0: yTop, y1: yBottom, title: o.yLabel, side: 'left', gridTo: x1 }));
  parts.push(axisBottom(tickLabels(xt.ticks), x, yBottom, x0, x1, o.xLabel, yTop));
  const step = Math.max(1, Math.ceil(o.points.length / MAX_SCATTER_POINTS));
  const r = o.radius ?? (o.points.length > 500 ? 2 : 3.2);
  for (let i = 0; i < o.points.length; i += step) {
    const p = o.points[i] as { x: number; y: number };
    parts.push(`<circle class="mark" cx="${px(x(p.x))}" cy="${px(y(p.y))}" r="${r}" fill="${o.colour}" fill-opacity="${o.points.length > 200 ? 0.35 : 0.7}"/>`);
  }
  const fit = leastSquaresLine(o.points);
  if (fit) {
    const [a, b] = xt.domain;
    const ya = fit.intercept + fit.slope * a;
    const yb = fit.intercept + fit.slope * b;
    parts.push(`<clipPath id="clip-${o.name}"><rect x="${x0}" y="${yTop}" width="${x1 - x0}" height="${yBottom - yTop}"/></clipPath>`);
    parts.push(`<line class="mark fit" clip-path="url(#clip-${o.name})" x1="${px(x(a))}" y1="${px(y(ya))}" x2="${px(x(b))}" y2="${px(y(yb))}" stroke="${PALETTE.ink}" stroke-width="1.6"/>`);
  }
  parts.push(`<rect x="${x0 + 6}" y="${yTop + 4}" width="${Math.min(x1 - x0 - 12, o.statText.length * 6.4 + 12)}" height="20" fill="#ffffff" fill-opacity="0.85"/>`);
  parts.push(svgText(x0 + 12, yTop + 18, o.statText, 'class="stat"'));
  const note = step > 1 ? `${o.note ? `${o.note} ` : ''}Every ${step}th of ${o.points.length} points drawn; the statistics use all.` : o.note;
  return chartFrame({ name: o.name, title: o.title, ...(note ? { note } : {}), width, height, body: parts.join('') });
}
