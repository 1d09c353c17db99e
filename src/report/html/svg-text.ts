import { escapeHtml } from './escape-html.js';

/** Coordinates rounded to 0.1 px: enough for the screen, and keeps pages small and byte-stable. */
export function px(value: number): string {
  const r = Math.round(value * 10) / 10;
  return Object.is(r, -0) ? '0' : String(r);
}

/** An SVG `<text>` element with escaped content; `attrs` are added verbatim (trusted, not user data). */
export function svgText(x: number, y: number, text: string, attrs = ''): string {
  return `<text x="${px(x)}" y="${px(y)}"${attrs ? ` ${attrs}` : ''}>${escapeHtml(text)}</text>`;
}
