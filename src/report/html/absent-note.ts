import { escapeHtml } from './escape-html.js';

/** A plain notice that a part of the report has no input, with the reason and what would supply it. */
export function absentNote(what: string, reason: string): string {
  return `<p class="absent"><strong>${escapeHtml(what)} not available.</strong> ${escapeHtml(reason)}</p>`;
}
