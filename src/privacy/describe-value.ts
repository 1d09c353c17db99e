/** Longest value shown as it is, when the caller says it may be shown. */
const SHOWN_MAX = 40;
/** Longest shape shown. */
const SHAPE_MAX = 32;

/** Values describeValue may quote as they are: what looks like an IANA zone name. */
export const ZONE_LIKE = /^[A-Za-z][A-Za-z0-9_+-]*(?:\/[A-Za-z0-9_+-]+)*$/;
/** Values describeValue may quote as they are: what looks like a person or entry id. */
export const ID_LIKE = /^[\p{L}\p{N}_.:@#-]+$/u;

/**
 * How a value from a participant's file is described in a diagnostic: never the value itself, but
 * its length and its shape, with every digit written `9`, every lower-case letter `a`, every
 * upper-case letter `A`, white space as a space, ASCII punctuation as it is and any other character
 * as `*` (`2026-13-01 25:00` → `a value of 16 characters shaped 9999-99-99 99:99`). The shape says
 * what is wrong with a time or a number without repeating words. With `show`, a value that matches
 * it and is at most 40 characters long is quoted as it is (an IANA zone name, a person id).
 */
export function describeValue(value: string, show?: RegExp): string {
  if (value === '') return 'an empty value';
  if (show && value.length <= SHOWN_MAX && show.test(value)) return `\`${value}\``;
  const chars = [...value];
  let shape = '';
  for (const ch of chars.slice(0, SHAPE_MAX)) {
    if (ch >= '0' && ch <= '9') shape += '9';
    else if (/\p{Ll}|\p{Lo}|\p{Lm}/u.test(ch)) shape += 'a';
    else if (/\p{Lu}|\p{Lt}/u.test(ch)) shape += 'A';
    else if (/\s/u.test(ch)) shape += ' ';
    else if (/[!-/:-@[-`{-~]/.test(ch) && ch !== '`') shape += ch;
    else shape += '*';
  }
  if (chars.length > SHAPE_MAX) shape += '…';
  return `a value of ${chars.length} character${chars.length === 1 ? '' : 's'} shaped \`${shape}\``;
}

/**
 * A library's explanation of a failure (luxon's `invalidExplanation`, a JSON parser's message)
 * with every occurrence of the value it was given replaced by `…`, so that the explanation can
 * be shown without the value.
 */
export function omitValue(explanation: string, value: string): string {
  const trimmed = value.trim();
  if (trimmed === '') return explanation;
  return explanation.split(value).join('…').split(trimmed).join('…');
}
