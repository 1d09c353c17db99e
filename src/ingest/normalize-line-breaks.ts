/** Where normalizeLineBreaks left off: inside a quoted field or not, and the last character it passed. */
export interface LineBreakState {
  quoted: boolean;
  /** The last character passed ('' at the start of the file). */
  last: string;
  /** A `"` or CR at the end of the previous piece, held back until the next character is known. */
  held: string;
}

/** A fresh state for the start of a file. */
export function lineBreakState(): LineBreakState {
  return { quoted: false, last: '', held: '' };
}

/**
 * Turns every line break outside quoted fields of delimited text into LF: CRLF, a lone LF and
 * a lone CR alike (files that mix them, or old Mac files with CR only, are read row by row).
 * Line breaks inside a quoted field are kept as written (RFC 4180 section 2 rule 6). Quotes
 * follow RFC 4180: a field is quoted when it starts with `"`, and `""` inside it is a quote.
 * Text is handed in pieces as read (`final` for the last): a `"` or CR at the end of a piece is
 * held back until the next piece shows what follows it. Quote-free, CR-free text is passed
 * through untouched (found with indexOf, so the common file costs almost nothing).
 */
export function normalizeLineBreaks(piece: string, delimiter: string, state: LineBreakState, final = false): string {
  const text = state.held + piece;
  state.held = '';
  if (text === '') return '';
  const out: string[] = [];
  let from = 0;
  let quote = text.indexOf('"');
  let cr = text.indexOf('\r');
  let at = 0;
  while (quote !== -1 || cr !== -1) {
    const i = quote === -1 ? cr : cr === -1 ? quote : Math.min(quote, cr);
    if (i === text.length - 1 && !final) {
      // What follows decides: `""` or a closing quote, CRLF or a lone CR.
      state.held = text[i] as string;
      out.push(text.slice(from, i));
      if (i > 0) state.last = text[i - 1] as string;
      return out.join('');
    }
    if (i === quote) {
      if (state.quoted) {
        if (text[i + 1] === '"') at = i + 2; // an escaped quote
        else {
          state.quoted = false;
          at = i + 1;
        }
      } else {
        const before = i > 0 ? (text[i - 1] as string) : state.last;
        if (before === '' || before === '\n' || before === '\r' || before === delimiter || text.startsWith(delimiter, i - delimiter.length)) state.quoted = true;
        at = i + 1;
      }
    } else {
      at = i + 1;
      if (!state.quoted) {
        out.push(text.slice(from, i));
        if (text[i + 1] === '\n') from = i + 1; // CRLF: keep the LF
        else {
          out.push('\n');
          from = i + 1;
        }
      }
    }
    if (quote !== -1 && quote < at) quote = text.indexOf('"', at);
    if (cr !== -1 && cr < at) cr = text.indexOf('\r', at);
  }
  state.last = text[text.length - 1] as string;
  if (from === 0) return text;
  out.push(text.slice(from));
  return out.join('');
}
