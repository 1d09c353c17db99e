import type { ReadinessData } from '../report-data.js';
import { axisVertical } from './axis-vertical.js';
import { chartFrame } from './chart-frame.js';
import { escapeHtml } from './escape-html.js';
import { groupThousands } from './format-value.js';
import { linearScale } from './linear-scale.js';
import { niceTicks } from './nice-ticks.js';
import { PALETTE } from './palette.js';
import { px, svgText } from './svg-text.js';

/**
 * One bar per person, sorted from most to fewest usable lag pairs, against the readiness
 * threshold (dashed line): bars that reach it are blue, the rest orange (Okabe–Ito).
 */
export function lagPairsChart(r: ReadinessData): string {
  const persons = [...r.persons].sort((a, b) => b.lagPairs - a.lagPairs || (a.person < b.person ? -1 : 1));
  const width = 900;
  const height = 320;
  const x0 = 70;
  const x1 = width - 16;
  const yTop = 20;
  const yBottom = height - 100;
  const yt = niceTicks(0, Math.max(r.minLagPairs, ...persons.map((p) => p.lagPairs)), 5);
  const y = linearScale(yt.domain, [yBottom, yTop]);
  const bw = (x1 - x0) / Math.max(1, persons.length);
  const parts: string[] = [axisVertical({ ticks: yt.ticks.map((v) => ({ value: v, label: groupThousands(v) })), scale: y, x: x0, y0: yTop, y1: yBottom, title: 'Usable lag pairs (count)', side: 'left', gridTo: x1 })];
  persons.forEach((p, i) => {
    const h = yBottom - y(p.lagPairs);
    parts.push(`<rect class="mark" x="${px(x0 + i * bw + (bw > 3 ? 0.5 : 0))}" y="${px(yBottom - Math.max(h, 0.8))}" width="${px(Math.max(0.6, bw - (bw > 3 ? 1 : 0)))}" height="${px(Math.max(h, 0.8))}" fill="${p.ready ? PALETTE.score : PALETTE.flag}"><title>${escapeHtml(`${p.person}: ${p.lagPairs} lag pairs`)}</title></rect>`);
  });
  // Person labels under the bars: every bar when there is room, else every k-th (all are in the table below).
  const every = Math.max(1, Math.ceil(11 / bw));
  persons.forEach((p, i) => {
    if (i % every !== 0) return;
    const cx = x0 + (i + 0.5) * bw;
    parts.push(`<text x="${px(cx)}" y="${yBottom + 6}" transform="rotate(-60 ${px(cx)} ${yBottom + 6})" text-anchor="end" class="tick">${escapeHtml(p.person.length > 14 ? `${p.person.slice(0, 13)}…` : p.person)}</text>`);
  });
  const ty = y(r.minLagPairs);
  parts.push(`<line x1="${x0}" x2="${x1}" y1="${px(ty)}" y2="${px(ty)}" stroke="${PALETTE.ink}" stroke-dasharray="6 4"/>`, svgText(x1 - 4, ty - 5, `threshold ${r.minLagPairs}`, 'text-anchor="end" class="tick"'));
  parts.push(`<line x1="${x0}" x2="${x1}" y1="${yBottom}" y2="${yBottom}" stroke="${PALETTE.muted}"/>`, svgText((x0 + x1) / 2, height - 12, `Persons, sorted by usable lag pairs (${persons.length} persons${persons.length > Math.floor((x1 - x0) / 11) ? '; some labels left out, all are in the table' : ''})`, 'text-anchor="middle" class="axis-title"'));
  const ready = persons.filter((p) => p.ready).length;
  return chartFrame({
    name: 'lag-pairs',
    title: `Usable lag pairs of ${r.variable} per person: ${ready} of ${persons.length} reach ${r.minLagPairs}`,
    note: 'A lag pair is two adjacent observed bins; pairs never span a gap or excluded hours. Orange bars fall short of the threshold.',
    width,
    height,
    body: parts.join(''),
  });
}
