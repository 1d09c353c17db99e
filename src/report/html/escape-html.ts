/**
 * Escapes text for HTML element content and attribute values (`&`, `<`, `>`, `"`, `'`), so that
 * person ids, terms and file names from user data can never inject markup into the report.
 */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => (c === '&' ? '&amp;' : c === '<' ? '&lt;' : c === '>' ? '&gt;' : c === '"' ? '&quot;' : '&#39;'));
}
