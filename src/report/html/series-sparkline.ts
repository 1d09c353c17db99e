import type { PersonTrack } from '../report-data.js';
import { chartFrame } from './chart-frame.js';
import { formatValue } from './format-value.js';
import { linearScale } from './linear-scale.js';
import { linePath } from './line-path.js';
import { PALETTE } from './palette.js';
import { px } from './svg-text.js';
import { valueExtent } from './value-extent.js';

const HOUR = 3_600_000;

/**
 * A small multiple for one person: score (blue) and self-report (dashed vermillion), each on its
 * own unlabelled scale, over the study's shared time range `[xMin, xMax]` (so panels line up by
 * date); missing bins as grey ticks along the bottom, clock-change days as a reddish-purple tick.
 */
export function seriesSparkline(track: PersonTrack, xMin: number, xMax: number, hasRating: boolean): string {
  const width = 280;
  const height = 74;
  const x = linearScale([xMin, xMax], [4, width - 4]);
  const mid = (p: { start: number; hours: number }): number => x(p.start + (p.hours * HOUR) / 2);
  const sExt = valueExtent(track.points.map((p) => p.score)) ?? [0, 1];
  const ys = linearScale(sExt, [height - 12, 6]);
  const parts: string[] = [`<rect x="0" y="0" width="${width}" height="${height}" fill="#ffffff" stroke="${PALETTE.grid}"/>`];
  for (const p of track.points) if (p.missing) parts.push(`<rect class="gap" x="${px(x(p.start))}" y="${height - 6}" width="${px(Math.max(0.5, x(p.start + p.hours * HOUR) - x(p.start)))}" height="4" fill="#9aa3ab"/>`);
  for (const c of track.clockChanges) parts.push(`<rect x="${px(x(c.start) - 1)}" y="0" width="2" height="5" fill="${PALETTE.clock}"/>`);
  const scorePts = track.points.map((p) => ({ x: mid(p), y: p.score === undefined ? undefined : ys(p.score) }));
  const scorePath = linePath(scorePts);
  if (scorePath) parts.push(`<path class="mark" d="${scorePath}" fill="none" stroke="${PALETTE.score}" stroke-width="1.2"/>`);
  else parts.push(`<text class="mark tick" x="${width / 2}" y="${height / 2}" text-anchor="middle">no observed bins</text>`);
  // An observed bin with no observed neighbour has no line segment: a dot shows it.
  scorePts.forEach((p, i) => {
    if (p.y !== undefined && scorePts[i - 1]?.y === undefined && scorePts[i + 1]?.y === undefined) parts.push(`<circle class="mark" cx="${px(p.x)}" cy="${px(p.y)}" r="1.6" fill="${PALETTE.score}"/>`);
  });
  if (hasRating) {
    const rExt = valueExtent(track.points.map((p) => p.rating));
    if (rExt) {
      const yr = linearScale(rExt, [height - 12, 6]);
      const rated = track.points.filter((p) => p.rating !== undefined).map((p) => ({ x: mid(p), y: yr(p.rating as number) }));
      parts.push(`<path class="mark" d="${linePath(rated)}" fill="none" stroke="${PALETTE.rating}" stroke-width="1" stroke-dasharray="3 2"/>`);
    }
  }
  const bins = track.points.length;
  const missing = track.points.filter((p) => p.missing).length;
  return chartFrame({
    name: `series-small-${track.person}`,
    title: `${track.person} · ${formatValue(bins ? (100 * missing) / bins : undefined, 0)}% missing`,
    width,
    height,
    body: parts.join(''),
    className: 'small',
  });
}
