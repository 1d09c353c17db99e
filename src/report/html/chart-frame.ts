import { escapeHtml } from './escape-html.js';

/** What {@link chartFrame} wraps. */
export interface ChartFrame {
  /** Machine name of the chart (the `data-chart` attribute the browser test looks for). */
  name: string;
  /** Says what the chart shows, as a sentence-like title. */
  title: string;
  /** Optional reading help below the title (plain text). */
  note?: string;
  width: number;
  height: number;
  /** SVG content; every data mark carries `class="mark"`. */
  body: string;
  /** Extra class for the figure (e.g. `small` for small multiples). */
  className?: string;
}

/**
 * A chart as a `<figure>`: caption with the title and note, then an inline `<svg>` with a
 * `viewBox` (so it scales with the page), `role="img"` and the title as its accessible name.
 */
export function chartFrame(frame: ChartFrame): string {
  const title = escapeHtml(frame.title);
  const note = frame.note ? `<span class="note">${escapeHtml(frame.note)}</span>` : '';
  return (
    `<figure class="chart-figure${frame.className ? ` ${frame.className}` : ''}">` +
    `<figcaption><span class="chart-title">${title}</span>${note}</figcaption>` +
    `<svg class="chart" data-chart="${escapeHtml(frame.name)}" viewBox="0 0 ${frame.width} ${frame.height}" width="${frame.width}" height="${frame.height}" role="img" aria-label="${title}" xmlns="http://www.w3.org/2000/svg">` +
    frame.body +
    `</svg></figure>`
  );
}
