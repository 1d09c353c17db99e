import { escapeHtml } from './escape-html.js';

const isPlainObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

function scalar(v: unknown): string {
  if (v === null || v === undefined) return '<span class="muted">–</span>';
  if (typeof v === 'string') return `<code>${escapeHtml(v)}</code>`;
  return `<code>${escapeHtml(String(v))}</code>`;
}

/** Plain words for a nested value: `key: value; key: value`, lists comma-separated (no JSON syntax). */
function inlineText(v: unknown): string {
  if (Array.isArray(v)) return v.length === 0 ? 'none' : v.map((x) => (isPlainObject(x) ? `(${inlineText(x)})` : inlineText(x))).join(', ');
  if (isPlainObject(v)) {
    const entries = Object.entries(v);
    return entries.length === 0 ? 'none' : entries.map(([k, x]) => `${k}: ${inlineText(x)}`).join('; ');
  }
  return v === null || v === undefined ? '–' : String(v);
}

function compact(v: unknown): string {
  if (isPlainObject(v) || Array.isArray(v)) return `<code>${escapeHtml(inlineText(v))}</code>`;
  return scalar(v);
}

/**
 * Any JSON value as readable HTML: objects as definition lists (keys in file order), arrays of
 * objects as tables (one column per key seen), arrays of scalars as comma lists, scalars as code.
 * Nested deeper than `maxDepth` levels is shown on one line as `key: value; …`. All text is escaped.
 */
export function jsonView(value: unknown, depth = 0, maxDepth = 3): string {
  if (Array.isArray(value)) {
    if (value.length === 0) return '<span class="muted">none</span>';
    if (value.every(isPlainObject)) {
      const columns: string[] = [];
      for (const row of value) for (const k of Object.keys(row)) if (!columns.includes(k)) columns.push(k);
      const head = columns.map((c) => `<th>${escapeHtml(c)}</th>`).join('');
      const body = value.map((row) => `<tr>${columns.map((c) => `<td>${depth + 1 >= maxDepth ? compact(row[c]) : isPlainObject(row[c]) || Array.isArray(row[c]) ? jsonView(row[c], depth + 1, maxDepth) : scalar(row[c])}</td>`).join('')}</tr>`).join('');
      return `<table class="json"><thead><tr>${head}</tr></thead><tbody>${body}</tbody></table>`;
    }
    return value.map((v) => (isPlainObject(v) || Array.isArray(v) ? compact(v) : scalar(v))).join(', ');
  }
  if (isPlainObject(value)) {
    const entries = Object.entries(value);
    if (entries.length === 0) return '<span class="muted">none</span>';
    if (depth >= maxDepth) return compact(value);
    return `<dl class="json">${entries.map(([k, v]) => `<dt>${escapeHtml(k)}</dt><dd>${jsonView(v, depth + 1, maxDepth)}</dd>`).join('')}</dl>`;
  }
  return scalar(value);
}
