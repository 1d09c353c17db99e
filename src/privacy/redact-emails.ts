/** A matched address: where it starts and ends in the text. */
interface Span {
  start: number;
  end: number;
}

const ATEXT_ASCII = /[A-Za-z0-9!#$%&'*+/=?^_`{|}~-]/;
const LETTER_OR_DIGIT = /[\p{L}\p{N}]/u;
const LETTER = /\p{L}/u;

/** True when the code unit at `i` is a letter or digit (the halves of a surrogate pair count as one). */
function isLetterOrDigit(text: string, i: number): boolean {
  const c = text.charCodeAt(i);
  if (c < 0x80) return (c >= 48 && c <= 57) || ((c | 32) >= 97 && (c | 32) <= 122);
  if (c >= 0xd800 && c <= 0xdfff) return true;
  return LETTER_OR_DIGIT.test(text[i] as string);
}

/** atext of RFC 5322 section 3.2.3, with letters and digits of any script (RFC 6531). */
function isAtext(text: string, i: number): boolean {
  const c = text.charCodeAt(i);
  return c < 0x80 ? ATEXT_ASCII.test(text[i] as string) : isLetterOrDigit(text, i);
}

function isLabelChar(text: string, i: number): boolean {
  return text.charCodeAt(i) === 0x2d || isLetterOrDigit(text, i);
}

function isSpace(c: number): boolean {
  return c === 0x20 || c === 0x09 || c === 0x0a || c === 0x0d || c === 0x0c || c === 0x0b || c === 0xa0 || c === 0x2028 || c === 0x2029 || c === 0x202f || c === 0x3000 || (c >= 0x2000 && c <= 0x200a);
}

/** True when the quote at `i` is escaped by an odd number of backslashes. */
function isEscaped(text: string, i: number): boolean {
  let k = i - 1;
  while (k >= 0 && text.charCodeAt(k) === 0x5c) k--;
  return (i - 1 - k) % 2 === 1;
}

/**
 * Index of the unescaped `"` that opens the quoted string closed at `close`, on the same line and
 * not before `floor`; -1 when there is none.
 */
function openingQuote(text: string, close: number, floor: number): number {
  for (let k = close - 1; k >= floor; k--) {
    const c = text.charCodeAt(k);
    if (c === 0x0a || c === 0x0d) return -1;
    if (c === 0x22 && !isEscaped(text, k)) return k;
  }
  return -1;
}

/**
 * End of the domain after an `@` at `at`: a domain literal `[…]`, or dot-separated labels (each
 * starting and ending with a letter or digit) ending in a top-level label that starts with a
 * letter and is at least two characters long, as in the pattern this scanner replaces. -1 when
 * no domain follows.
 */
function domainEnd(text: string, at: number): number {
  const n = text.length;
  let i = at + 1;
  if (text.charCodeAt(i) === 0x5b) {
    let j = i + 1;
    while (j < n && text.charCodeAt(j) !== 0x5d && text.charCodeAt(j) !== 0x5b && !isSpace(text.charCodeAt(j))) j++;
    return j < n && text.charCodeAt(j) === 0x5d && j > i + 1 ? j + 1 : -1;
  }
  // labels one by one: the domain ends after the last label that can be the top-level one while
  // every label before it starts and ends with a letter or digit
  let best = -1;
  let prefixValid = true;
  for (let k = 0; prefixValid; k++) {
    const start = i;
    while (i < n && isLabelChar(text, i)) i++;
    if (i === start) break;
    if (k >= 1) {
      const first = text.charCodeAt(start);
      const letter = first >= 0xd800 && first <= 0xdbff ? true : LETTER.test(text[start] as string);
      let last = i;
      while (last > start && text.charCodeAt(last - 1) === 0x2d) last--;
      if (letter && last - start >= 2) best = last;
    }
    prefixValid = text.charCodeAt(start) !== 0x2d && text.charCodeAt(i - 1) !== 0x2d;
    if (text.charCodeAt(i) === 0x2e && i + 1 < n && isLabelChar(text, i + 1)) i++;
    else break;
  }
  return best;
}

/** Start of the local part before an `@` at `at` (dot-atom or quoted string), not before `floor`; -1 when none. */
function localStart(text: string, at: number, floor: number): number {
  if (at - 1 >= floor && text.charCodeAt(at - 1) === 0x22 && !isEscaped(text, at - 1)) {
    const open = openingQuote(text, at - 1, floor);
    return open >= 0 && open < at - 2 ? open : -1;
  }
  let k = at - 1;
  while (k >= floor && (isAtext(text, k) || text.charCodeAt(k) === 0x2e)) k--;
  let start = k + 1;
  // a dot-atom holds no empty atom: start after the last `..`, and not on a dot
  for (let j = at - 1; j > start; j--) {
    if (text.charCodeAt(j) === 0x2e && text.charCodeAt(j - 1) === 0x2e) {
      start = j + 1;
      break;
    }
  }
  while (start < at && text.charCodeAt(start) === 0x2e) start++;
  return start < at ? start : -1;
}

/** The address around the `@` at `at`, widened to its angle brackets, obsolete route and quoted display name. */
function addressAround(text: string, at: number, floor: number): Span | undefined {
  const end = domainEnd(text, at);
  if (end === -1) return undefined;
  let start = localStart(text, at, floor);
  if (start === -1) return undefined;
  let stop = end;
  if (text.charCodeAt(stop) === 0x3e) {
    let open = -1;
    if (start - 1 >= floor && text.charCodeAt(start - 1) === 0x3c) open = start - 1;
    else if (start - 1 >= floor && text.charCodeAt(start - 1) === 0x3a) {
      // obsolete route: <@host,@host:local@domain>
      let r = start - 2;
      while (r >= floor && !isSpace(text.charCodeAt(r)) && ![0x3a, 0x3c, 0x3e].includes(text.charCodeAt(r))) r--;
      if (r >= floor && text.charCodeAt(r) === 0x3c && text.charCodeAt(r + 1) === 0x40 && start - 2 > r + 1) open = r;
    }
    if (open >= 0) {
      start = open;
      stop = end + 1;
      let k = start - 1;
      while (k >= floor && isSpace(text.charCodeAt(k)) && text.charCodeAt(k) !== 0x0a && text.charCodeAt(k) !== 0x0d) k--;
      if (k >= floor && text.charCodeAt(k) === 0x22 && !isEscaped(text, k)) {
        const quote = openingQuote(text, k, floor);
        if (quote >= 0) start = quote;
      }
    }
  }
  return { start, end: stop };
}

/**
 * Replaces e-mail addresses with `token`, in the forms of RFC 5322 section 3.4: dot-atom and
 * quoted local parts, domain names and domain literals, angle addresses with an optional quoted
 * display name and an obsolete route (section 4.4); letters and digits of any script (RFC 6531).
 *
 * A scanner rather than a regular expression: it starts from each `@` and looks left for the
 * local part and right for the domain, never past the previous address or the next `@`, so
 * every character is looked at a bounded number of times and the time is linear in the text's
 * length (a backtracking pattern took quadratic time on long runs of address characters).
 */
export function redactEmails(text: string, token: string): string {
  let at = text.indexOf('@');
  if (at === -1) return text;
  let out = '';
  let last = 0;
  while (at !== -1) {
    const span = addressAround(text, at, last);
    if (span) {
      out += text.slice(last, span.start) + token;
      last = span.end;
      at = text.indexOf('@', span.end);
    } else {
      at = text.indexOf('@', at + 1);
    }
  }
  return out + text.slice(last);
}
