import type { CoverageData } from '../report-data.js';
import { chartFrame } from './chart-frame.js';
import { escapeHtml } from './escape-html.js';
import { formatDate } from './format-date.js';
import { groupThousands } from './format-value.js';
import { MISSING_STYLE, PALETTE } from './palette.js';
import { px, svgText } from './svg-text.js';
import { wordClasses, wordColour } from './word-classes.js';

/** Persons above this count get compact rows without per-cell tooltips (keeps the page light). */
const DETAILED_PERSONS = 80;

/**
 * The person × local-day heatmap: one row per person, one column per local date, each day
 * coloured by the words written that day (five lightness classes) or, when no bin of the day was
 * observed, by the reason it is missing; clock-change days get a reddish-purple outline. Equal
 * neighbouring cells are merged into one rectangle, so 500 persons stay a light page.
 */
export function coverageHeatmap(data: CoverageData): string {
  const n = data.persons.length;
  const detailed = n <= DETAILED_PERSONS;
  const rowH = n <= 40 ? 14 : n <= DETAILED_PERSONS ? 9 : n <= 200 ? 4 : 2;
  const labelW = detailed ? 70 : 40;
  const plotW = 820;
  const cellW = plotW / Math.max(1, data.dates.length);
  const top = 30;
  const plotH = rowH * n;
  const legendY = top + plotH + 28;
  const height = legendY + 46;
  const width = labelW + plotW + 20;
  const dateIndex = new Map(data.dates.map((d, i) => [d, i]));
  const observedWords = data.persons.flatMap((p) => p.cells.filter((c) => !c.missing).map((c) => c.words));
  const classes = wordClasses(observedWords);
  const parts: string[] = [
    `<defs><pattern id="hatch-no-text" width="4" height="4" patternUnits="userSpaceOnUse" patternTransform="rotate(45)"><rect width="4" height="4" fill="#ffffff"/><line x1="0" y1="0" x2="0" y2="4" stroke="#8a949e" stroke-width="1.2"/></pattern></defs>`,
    `<rect x="${labelW}" y="${top}" width="${px(plotW)}" height="${px(plotH)}" fill="#f3f4f5"/>`,
  ];
  const fillOf = (missing: string | undefined, words: number): string =>
    missing ? (missing === 'no_text' ? 'url(#hatch-no-text)' : (MISSING_STYLE[missing]?.fill ?? '#bfc5cb')) : wordColour(words, classes);
  const clockMarks: string[] = [];
  data.persons.forEach((p, row) => {
    const y = top + row * rowH;
    if (detailed || row % Math.ceil(n / 25) === 0) parts.push(svgText(labelW - 6, y + rowH - 2, p.person, `text-anchor="end" class="tick${detailed ? '' : ' small'}"`));
    const cells = [...p.cells].sort((a, b) => (a.date < b.date ? -1 : 1));
    let run: { start: number; end: number; fill: string } | undefined;
    const flush = (): void => {
      if (run) parts.push(`<rect class="mark" x="${px(labelW + run.start * cellW)}" y="${px(y)}" width="${px((run.end - run.start + 1) * cellW)}" height="${px(rowH - (rowH > 3 ? 1 : 0))}" fill="${run.fill}"/>`);
      run = undefined;
    };
    for (const c of cells) {
      const i = dateIndex.get(c.date);
      if (i === undefined) continue;
      const fill = fillOf(c.missing, c.words);
      if (detailed) {
        const what = c.missing ? `missing: ${MISSING_STYLE[c.missing]?.label ?? c.missing}` : `${groupThousands(c.words)} words in ${c.observedBins} of ${c.bins} bins`;
        parts.push(
          `<rect class="mark" x="${px(labelW + i * cellW)}" y="${px(y)}" width="${px(Math.max(1, cellW - 1))}" height="${px(rowH - 1)}" fill="${fill}"><title>${escapeHtml(`${p.person} · ${formatDate(c.date)} · ${what}${c.hours !== undefined ? ` · ${c.hours} h day` : ''}`)}</title></rect>`,
        );
      } else if (run && run.fill === fill && run.end === i - 1) run.end = i;
      else {
        flush();
        run = { start: i, end: i, fill };
      }
      if (c.hours !== undefined) clockMarks.push(`<rect class="clock" x="${px(labelW + i * cellW + 0.5)}" y="${px(y + 0.5)}" width="${px(Math.max(1, cellW - 2))}" height="${px(Math.max(1, rowH - 2))}" fill="none" stroke="${PALETTE.clock}" stroke-width="${rowH > 6 ? 1.5 : 1}"/>`);
    }
    flush();
  });
  parts.push(...clockMarks);
  const step = Math.max(1, Math.ceil(data.dates.length / 12));
  data.dates.forEach((d, i) => {
    if (i % step === 0) parts.push(svgText(labelW + (i + 0.5) * cellW, top - 8, formatDate(d), 'text-anchor="middle" class="tick"'));
  });
  parts.push(svgText(labelW + plotW / 2, height - 2, 'Local calendar date of each person (rows: persons)', 'text-anchor="middle" class="axis-title"'));
  // legend: word classes, then missing reasons, then clock-change outline
  let lx = labelW;
  parts.push(svgText(lx, legendY - 6, 'Words per day', 'class="legend-title"'));
  classes.colours.forEach((colour, i) => {
    const low = i === 0 ? 0 : (classes.bounds[i - 1] as number) + 1;
    const high = classes.bounds[i];
    const label = high === undefined ? `${groupThousands(low)}+` : `${groupThousands(low)}–${groupThousands(high)}`;
    parts.push(`<rect x="${lx}" y="${legendY}" width="14" height="10" fill="${colour}"/>`, svgText(lx + 18, legendY + 9, label, 'class="tick"'));
    lx += 30 + label.length * 6;
  });
  lx += 16;
  parts.push(svgText(lx, legendY - 6, 'Missing days, by reason', 'class="legend-title"'));
  // Only the reasons that occur in the drawn cells (a legend entry with no cell is noise).
  const occurring = new Set(data.persons.flatMap((p) => p.cells.map((c) => c.missing ?? '')));
  for (const [reason, style] of Object.entries(MISSING_STYLE)) {
    if (!occurring.has(reason)) continue;
    parts.push(`<rect x="${lx}" y="${legendY}" width="14" height="10" fill="${reason === 'no_text' ? 'url(#hatch-no-text)' : style.fill}" stroke="#8a949e" stroke-width="0.5"/>`, svgText(lx + 18, legendY + 9, reason.replace(/_/g, ' '), 'class="tick"'));
    lx += 34 + reason.length * 6;
  }
  parts.push(`<rect x="${lx}" y="${legendY}" width="14" height="10" fill="none" stroke="${PALETTE.clock}" stroke-width="1.5"/>`, svgText(lx + 18, legendY + 9, 'clock change (23/25 h)', 'class="tick"'));
  return chartFrame({
    name: 'coverage-heatmap',
    title: `Words written per person and local day (${n} persons × ${data.dates.length} days)`,
    note: 'Darker blue = more words; patterned or coloured cells are days without a usable bin, coloured by the reason from series-long.csv.',
    width: Math.max(width, lx + 160),
    height,
    body: parts.join(''),
  });
}
