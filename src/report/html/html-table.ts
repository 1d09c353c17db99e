import { escapeHtml } from './escape-html.js';

/** A column of {@link htmlTable}: header text and whether cells are numbers (right-aligned). */
export interface TableColumn {
  label: string;
  numeric?: boolean;
  /** Header tooltip explaining the column. */
  help?: string;
}

/**
 * A plain HTML table; every cell is escaped text. `caption` says what the table holds;
 * `rowClass` may mark rows (e.g. `not-ready`).
 */
export function htmlTable(columns: readonly TableColumn[], rows: readonly (readonly string[])[], caption?: string, rowClass?: (i: number) => string | undefined): string {
  const head = columns.map((c) => `<th${c.numeric ? ' class="num"' : ''}${c.help ? ` title="${escapeHtml(c.help)}"` : ''}>${escapeHtml(c.label)}</th>`).join('');
  const body = rows
    .map((row, i) => {
      const cls = rowClass?.(i);
      return `<tr${cls ? ` class="${escapeHtml(cls)}"` : ''}>${row.map((cell, j) => `<td${columns[j]?.numeric ? ' class="num"' : ''}>${escapeHtml(cell)}</td>`).join('')}</tr>`;
    })
    .join('');
  return `<table>${caption ? `<caption>${escapeHtml(caption)}</caption>` : ''}<thead><tr>${head}</tr></thead><tbody>${body}</tbody></table>`;
}
