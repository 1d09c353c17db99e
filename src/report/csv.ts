/**
 * True when a cell would start a formula in a spreadsheet program: its first character is `=`,
 * `+`, `-`, `@`, a tab or a carriage return (OWASP, "CSV Injection"), or a NUL (OWASP ASVS 5.0,
 * requirement 1.2.10), possibly after single quotes (see neutralizeCell); plain decimal numbers
 * such as `-0.5` and `+1e-7` are not formulas.
 */
function startsFormula(value: string): boolean {
  let i = 0;
  while (value.charCodeAt(i) === 0x27) i++;
  if (!isFormulaStart(value.charCodeAt(i))) return false;
  return i > 0 || !NUMBER.test(value);
}

/** True for the code units that open a formula in a spreadsheet cell (see startsFormula): `=`, `+`, `-`, `@`, tab, CR, NUL. */
export function isFormulaStart(code: number): boolean {
  return code === 0x3d || code === 0x2b || code === 0x2d || code === 0x40 || code === 0x09 || code === 0x0d || code === 0x00;
}

const NUMBER = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

/**
 * Neutralises spreadsheet formula injection in one cell, as OWASP's "CSV Injection" guidance
 * advises: a cell that starts with `=`, `+`, `-`, `@`, a tab, a carriage return or a NUL gets a
 * single quote in front, which spreadsheet programs read as "this is text". Numbers are left as
 * they are (`-0.5` stays `-0.5`). A cell that already starts with single quotes before such a
 * character gets one more, so that restoreCell gives back exactly the value written.
 */
export function neutralizeCell(value: string): string {
  return startsFormula(value) ? `'${value}` : value;
}

/**
 * Undoes neutralizeCell on a cell read back from a file this tool wrote (a person or entry id
 * that started with `-` or `=`): one leading single quote is removed when quotes precede a
 * formula character.
 */
export function restoreCell(value: string): string {
  return value.charCodeAt(0) === 0x27 && startsFormula(value) ? value.slice(1) : value;
}

/**
 * One CSV field, quoted per RFC 4180: fields holding a comma, a double quote, CR or LF are
 * enclosed in double quotes, and quotes inside are doubled. A field that could start a
 * spreadsheet formula is neutralised (neutralizeCell) and always enclosed in double quotes, as
 * OWASP's "CSV Injection" guidance advises.
 */
export function csvField(value: string): string {
  if (startsFormula(value)) return `"'${value.replace(/"/g, '""')}"`;
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
