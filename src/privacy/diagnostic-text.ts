/** Longest diagnostic message written to a rejects file or a table (common practice: a line a person reads). */
export const DIAGNOSTIC_MAX_CHARS = 500;
/** Longest error message printed on stderr (a list of a lexicon's problems may run over many lines). */
export const ERROR_MAX_CHARS = 8000;

// C0 and C1 controls, DEL, and the Unicode line and paragraph separators
const CONTROL = /[\u0000-\u0008\u000b-\u001f\u007f-\u009f\u2028\u2029]/g;
const CONTROL_OR_NEWLINE = /[\u0000-\u001f\u007f-\u009f\u2028\u2029]/g;

/**
 * A diagnostic or error message as it may be written or printed: control characters (and, unless
 * `lines` is set, line breaks and tabs) replaced by a space, so that a message cannot forge lines
 * of a rejects file or a terminal, and at most `limit` characters long, cut at a character
 * boundary with `… (N more characters)` after it. Diagnostics describe positions, codes and counts,
 * never participants' text (see describeValue); this is the last guard on their size.
 */
export function diagnosticText(message: string, limit = DIAGNOSTIC_MAX_CHARS, lines = false): string {
  let text = message.replace(lines ? CONTROL : CONTROL_OR_NEWLINE, ' ');
  if (text.length <= limit) return text;
  let cut = limit;
  const c = text.charCodeAt(cut - 1);
  if (c >= 0xd800 && c <= 0xdbff) cut--;
  text = `${text.slice(0, cut)}… (${text.length - cut} more characters)`;
  return text;
}
