import { escapeHtml } from './escape-html.js';

/** A plain notice that a part of the report has no input, with the reason (as a sentence) and what would supply it. */
export function absentNote(what: string, reason: string): string {
  const sentence = reason.charAt(0).toUpperCase() + reason.slice(1);
  return `<p class="absent"><strong>${escapeHtml(what)} not available.</strong> ${escapeHtml(sentence)}</p>`;
}
