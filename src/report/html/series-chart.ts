import type { PersonTrack } from '../report-data.js';
import { axisBottom } from './axis-bottom.js';
import { axisVertical } from './axis-vertical.js';
import { chartFrame } from './chart-frame.js';
import { dateTicks } from './date-ticks.js';
import { formatValue } from './format-value.js';
import { linearScale } from './linear-scale.js';
import { linePath } from './line-path.js';
import { niceTicks } from './nice-ticks.js';
import { PALETTE } from './palette.js';
import { px, svgText } from './svg-text.js';
import { valueExtent } from './value-extent.js';

const HOUR = 3_600_000;

/** What {@link seriesChart} draws. */
export interface SeriesChartOptions {
  score: string;
  rating?: string;
  /** Hours per bin, for the axis title. */
  binHours: number;
}

/**
 * The large view of one person: the text score (left scale, solid blue line with dots) and the
 * self-report (right scale, dashed vermillion line with squares) against local time; missing bins
 * are grey bands the lines do not cross, and clock-change days are marked with a dotted
 * reddish-purple line labelled with the day's hours.
 */
export function seriesChart(track: PersonTrack, options: SeriesChartOptions): string {
  const width = 920;
  const height = 330;
  const left = 72;
  const right = options.rating ? 72 : 24;
  const top = 44;
  const bottom = 52;
  const x0 = left;
  const x1 = width - right;
  const yTop = top;
  const yBottom = height - bottom;
  const first = track.points[0];
  const last = track.points[track.points.length - 1];
  const xMin = first?.start ?? 0;
  const xMax = last ? last.start + last.hours * HOUR : 1;
  const x = linearScale([xMin, xMax], [x0, x1]);
  const mid = (p: { start: number; hours: number }): number => x(p.start + (p.hours * HOUR) / 2);
  const sExt = valueExtent(track.points.map((p) => p.score)) ?? [0, 1];
  const sTicks = niceTicks(sExt[0], sExt[1], 5);
  const ys = linearScale(sTicks.domain, [yBottom, yTop]);
  const parts: string[] = [];
  // gaps first, under everything
  for (const p of track.points) {
    if (!p.missing) continue;
    parts.push(`<rect class="mark gap" x="${px(x(p.start))}" y="${yTop}" width="${px(Math.max(0.6, x(p.start + p.hours * HOUR) - x(p.start)))}" height="${yBottom - yTop}" fill="#e9ebed"/>`);
  }
  parts.push(axisVertical({ ticks: sTicks.ticks.map((v) => ({ value: v, label: formatValue(v, Math.abs(sTicks.ticks[1]! - sTicks.ticks[0]!) < 1 ? 2 : 0) })), scale: ys, x: x0, y0: yTop, y1: yBottom, title: `${options.score} (score per bin)`, side: 'left', colour: PALETTE.score, gridTo: x1 }));
  parts.push(axisBottom(dateTicks(xMin, xMax, 10), x, yBottom, x0, x1, `Local date and time (bins of ${options.binHours} h)`));
  for (const c of track.clockChanges) {
    const cx = x(c.start);
    parts.push(`<line class="mark clock" x1="${px(cx)}" x2="${px(cx)}" y1="${yTop - 4}" y2="${yBottom}" stroke="${PALETTE.clock}" stroke-width="1.5" stroke-dasharray="2 3"/>`);
    parts.push(svgText(cx + 3, yTop - 6, `${formatValue(c.hours, 0)} h day`, `class="tick" fill="${PALETTE.clock}"`));
  }
  const scorePts = track.points.map((p) => ({ x: mid(p), y: p.score === undefined ? undefined : ys(p.score) }));
  parts.push(`<path class="mark" d="${linePath(scorePts)}" fill="none" stroke="${PALETTE.score}" stroke-width="1.6" stroke-linejoin="round"/>`);
  const observed = scorePts.filter((p) => p.y !== undefined);
  // Every observed bin as a dot in short series; in long ones at least each isolated bin (no
  // observed neighbour), which the line cannot show.
  const isolated = (i: number): boolean => scorePts[i - 1]?.y === undefined && scorePts[i + 1]?.y === undefined;
  scorePts.forEach((p, i) => {
    if (p.y !== undefined && (observed.length <= 400 || isolated(i))) parts.push(`<circle class="mark" cx="${px(p.x)}" cy="${px(p.y)}" r="2.4" fill="${PALETTE.score}"/>`);
  });
  if (options.rating) {
    const rExt = valueExtent(track.points.map((p) => p.rating)) ?? [0, 1];
    const rTicks = niceTicks(rExt[0], rExt[1], 5);
    const yr = linearScale(rTicks.domain, [yBottom, yTop]);
    parts.push(axisVertical({ ticks: rTicks.ticks.map((v) => ({ value: v, label: formatValue(v, Math.abs(rTicks.ticks[1]! - rTicks.ticks[0]!) < 1 ? 2 : 0) })), scale: yr, x: x1, y0: yTop, y1: yBottom, title: `${options.rating} (self-report, own units)`, side: 'right', colour: PALETTE.rating }));
    const ratingPts = track.points.map((p) => ({ x: mid(p), y: p.rating === undefined ? undefined : yr(p.rating) }));
    parts.push(`<path class="mark" d="${linePath(ratingPts)}" fill="none" stroke="${PALETTE.rating}" stroke-width="1.4" stroke-dasharray="5 3"/>`);
    for (const p of ratingPts) if (p.y !== undefined) parts.push(`<rect class="mark" x="${px(p.x - 2.5)}" y="${px(p.y - 2.5)}" width="5" height="5" fill="${PALETTE.rating}"/>`);
  }
  // legend
  const ly = 16;
  parts.push(`<line x1="${x0}" x2="${x0 + 24}" y1="${ly}" y2="${ly}" stroke="${PALETTE.score}" stroke-width="2"/>`, svgText(x0 + 30, ly + 4, `${options.score} (left scale)`, 'class="legend"'));
  let lx = x0 + 60 + options.score.length * 6.5 + 70;
  if (options.rating) {
    parts.push(`<line x1="${px(lx)}" x2="${px(lx + 24)}" y1="${ly}" y2="${ly}" stroke="${PALETTE.rating}" stroke-width="2" stroke-dasharray="5 3"/>`, svgText(lx + 30, ly + 4, `${options.rating} (right scale)`, 'class="legend"'));
    lx += 60 + options.rating.length * 6.5 + 80;
  }
  parts.push(`<rect x="${px(lx)}" y="${ly - 6}" width="14" height="12" fill="#e9ebed"/>`, svgText(lx + 20, ly + 4, 'missing bin', 'class="legend"'));
  lx += 100;
  parts.push(`<line x1="${px(lx)}" x2="${px(lx)}" y1="${ly - 7}" y2="${ly + 7}" stroke="${PALETTE.clock}" stroke-width="1.5" stroke-dasharray="2 3"/>`, svgText(lx + 6, ly + 4, 'clock change', 'class="legend"'));
  return chartFrame({
    name: 'series-selected',
    title: `Person ${track.person}: ${options.score}${options.rating ? ` and self-reported ${options.rating}` : ''} over local time`,
    note: options.rating ? 'Two vertical scales: the text score on the left, the self-report on the right; levels are not comparable across scales.' : 'No self-report was aligned to these bins.',
    width,
    height,
    body: parts.join(''),
  });
}
