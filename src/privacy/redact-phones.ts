/**
 * A run of digits and the separators people write inside phone numbers, starting with +, (+, (
 * or a digit that does not follow a letter, digit or +. Nothing follows the run in the pattern,
 * so each run is matched once, in time linear in its length.
 */
const RUN = /(?<![\p{L}\p{N}+])(?:\+|\(\+?)?\d[\d \u00a0().\/-]*/gu;
const LETTER_OR_DIGIT = /[\p{L}\p{N}]/u;
const DATE_LIKE = /^(?:\d{1,2}[./-]\d{1,2}[./-]\d{2,4}|\d{4}[./-]\d{1,2}[./-]\d{1,2})$/;
const NANP = /^(?:\+?1[ .-]?)?\(?\d{3}\)?[ .-]?\d{3}[ .-]\d{4}$/;
/** The most digits a phone number holds: 15 (ITU-T E.164) after an international prefix 00. */
const MAX_DIGITS = 17;
/** Longest stretch tried as one phone number: 17 digits with generous separators. */
const MAX_CHARS = 64;

/**
 * Decides whether a digit run is a phone number:
 * - international (leading `+` or `00`): 7 to 15 digits in all, the ITU-T E.164 maximum of 15 digits
 *   including the country code;
 * - national: 7 to 13 digits starting with the trunk prefix 0 (`020 7946 0958`, `06 12 34 56 78`,
 *   `030 1234567`), or the North American plan's 3-3-4 shape (`(201) 555-0123`, `201-555-0123`);
 * - not a calendar date (`01.02.2021`, `2021-02-01`) nor groups of three after dots (`1.234.567`).
 */
export function isPhone(candidate: string): boolean {
  const digits = candidate.replace(/\D/g, '');
  const trimmed = candidate.trim();
  if (DATE_LIKE.test(trimmed)) return false;
  if (/^\d{1,3}(?:\.\d{3})+$/.test(trimmed)) return false;
  if (trimmed.startsWith('+') || trimmed.startsWith('(+') || trimmed.startsWith('00')) {
    const international = trimmed.startsWith('00') ? digits.slice(2) : digits;
    return international.length >= 7 && international.length <= 15;
  }
  if (NANP.test(trimmed)) return true;
  return (trimmed.startsWith('0') || trimmed.startsWith('(0')) && digits.length >= 7 && digits.length <= 13;
}

function isDigit(c: number): boolean {
  return c >= 48 && c <= 57;
}

/**
 * Where the phone number in `run` ends: after its last digit, or, when the run is glued to a
 * letter or digit (`0958x`), after the last digit that a separator follows. -1 when none.
 */
function runEnd(run: string, glued: boolean): number {
  let end = run.length;
  if (glued) {
    while (end > 0 && isDigit(run.charCodeAt(end - 1))) end--;
  }
  while (end > 0 && !isDigit(run.charCodeAt(end - 1))) end--;
  return end === 0 ? -1 : end;
}

/**
 * Where the phone number in `core` starts: the first group start (the run's start, or a `+`,
 * `(` or digit after spaces) from which the rest isPhone accepts; -1 when none does. Only the
 * last MAX_DIGITS digits and MAX_CHARS characters can hold a phone number, so earlier starts are
 * skipped without a look: the search is linear in the run's length.
 */
function phoneStart(core: string): number {
  let digitsAfter = 0;
  for (let k = 0; k < core.length; k++) if (isDigit(core.charCodeAt(k))) digitsAfter++;
  for (let i = 0; i < core.length; ) {
    if (digitsAfter <= MAX_DIGITS && core.length - i <= MAX_CHARS && isPhone(core.slice(i))) return i;
    // next group start: a +, ( or digit after a space or no-break space
    let j = i + 1;
    for (; j < core.length; j++) {
      const c = core.charCodeAt(j);
      const before = core.charCodeAt(j - 1);
      if ((before === 0x20 || before === 0xa0) && (isDigit(c) || c === 0x2b || c === 0x28)) break;
    }
    for (let k = i; k < j; k++) if (isDigit(core.charCodeAt(k))) digitsAfter--;
    i = j;
  }
  return -1;
}

/**
 * Replaces phone numbers (see isPhone: ITU-T E.164 international and common national forms) with
 * `token`. A run may begin with an unrelated number (`room 12 020 7946 0958`): each group start is
 * tried. Linear in the text's length: each run is read a bounded number of times.
 */
export function redactPhones(text: string, token: string): string {
  RUN.lastIndex = 0;
  let out = '';
  let last = 0;
  for (let m = RUN.exec(text); m !== null; m = RUN.exec(text)) {
    const run = m[0];
    const after = m.index + run.length;
    const glued = after < text.length && LETTER_OR_DIGIT.test(String.fromCodePoint(text.codePointAt(after) as number));
    const end = runEnd(run, glued);
    const firstDigit = run.search(/\d/);
    if (end === -1 || end - firstDigit < 6) {
      RUN.lastIndex = after;
      continue;
    }
    const start = phoneStart(run.slice(0, end));
    if (start >= 0) {
      out += text.slice(last, m.index + start) + token;
      last = m.index + end;
    }
    RUN.lastIndex = m.index + end;
  }
  return last === 0 ? text : out + text.slice(last);
}
