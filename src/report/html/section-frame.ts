import { escapeHtml } from './escape-html.js';

/**
 * A numbered report section: `<section id>` with its heading, a one-line purpose, and the body.
 * `body` is trusted HTML built by the renderers.
 */
export function sectionFrame(id: string, number: number, heading: string, purpose: string, body: string): string {
  return `<section id="${escapeHtml(id)}" class="report-section"><h2><span class="section-number">${number}</span>${escapeHtml(heading)}</h2><p class="purpose">${escapeHtml(purpose)}</p>${body}</section>`;
}
