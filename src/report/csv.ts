/**
 * Quotes one CSV field per RFC 4180: fields holding a comma, a double quote, CR or LF are
 * enclosed in double quotes, and quotes inside are doubled.
 */
export function csvField(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}

/** Joins fields into one CSV line (without the line end). Numbers should be pre-formatted with formatNumber. */
export function csvRow(fields: readonly string[]): string {
  return fields.map(csvField).join(',');
}

/** A whole CSV document: header, rows, each ending in `\n`. */
export function csvDocument(header: readonly string[], rows: Iterable<readonly string[]>): string {
  const lines = [csvRow(header)];
  for (const row of rows) lines.push(csvRow(row));
  return lines.join('\n') + '\n';
}
