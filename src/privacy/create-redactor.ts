import { foldForNames } from './fold-for-names.js';
import { redactEmails } from './redact-emails.js';
import { redactPhones } from './redact-phones.js';

/** What a redactor replaces. Every kind is on unless switched off. */
export interface RedactOptions {
  emails?: boolean;
  phones?: boolean;
  urls?: boolean;
  handles?: boolean;
  /** Names (people, places, employers…) replaced wherever they stand as whole words, ignoring case. */
  names?: readonly string[];
}

/** The replacement tokens. */
export const REDACTION_TOKENS = { email: '[email]', phone: '[phone]', url: '[url]', handle: '[handle]', name: '[name]' } as const;

/**
 * A URL: a scheme that does not continue a run of scheme characters (so that each run is tried
 * once, in linear time), or `www.` at a word start; then everything up to white space, `<`, `>` or `"`.
 */
const URL = /(?:(?<![a-z0-9+.-])[a-z][a-z0-9+.-]*:\/\/|\bwww\.)[^\s<>"]+/giu;
/** An @handle: runs of handle characters hold no `@`, so each is read once. */
const HANDLE = /(?<![\p{L}\p{N}_@.])@[\p{L}\p{N}_](?:[\p{L}\p{N}_.]*[\p{L}\p{N}_])?/gu;

function escapeRegExp(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

/**
 * A matcher of the listed names in folded text (foldForNames): longest name first, so that
 * `Jan de Vries` is replaced whole and never leaves `de Vries` behind when `Jan` is listed too.
 */
function nameMatcher(names: readonly string[] | undefined): RegExp | undefined {
  const folded = [...new Set((names ?? []).map((n) => foldForNames(n.trim()).folded.trim()).filter((n) => n !== ''))];
  if (folded.length === 0) return undefined;
  folded.sort((a, b) => b.length - a.length || (a < b ? -1 : a > b ? 1 : 0));
  return new RegExp(`(?<![\\p{L}\\p{N}_])(?:${folded.map(escapeRegExp).join('|')})(?![\\p{L}\\p{N}_])`, 'giu');
}

/** Replaces the names `matcher` finds in the folded text, in the original text. */
function redactNames(text: string, matcher: RegExp): string {
  const { folded, at } = foldForNames(text);
  matcher.lastIndex = 0;
  let out = '';
  let last = 0;
  for (let m = matcher.exec(folded); m !== null; m = matcher.exec(folded)) {
    out += text.slice(last, at[m.index]) + REDACTION_TOKENS.name;
    last = at[m.index + m[0].length] as number;
  }
  return out + text.slice(last);
}

/**
 * Creates a redactor for text the tool keeps (entries, rejects, samples). In this order it replaces:
 * URLs (`scheme://…`, `www.…`) with `[url]`; e-mail addresses in the forms of RFC 5322 section 3.4
 * (dot-atom and quoted local parts, domain literals, angle addresses with an optional quoted display
 * name, obsolete routes; also non-ASCII addresses as RFC 6531 allows; see redactEmails) with
 * `[email]`; `@handles` with `[handle]`; phone numbers (see isPhone: ITU-T E.164 international and
 * common national forms) with `[phone]`; and the supplied names as whole words with `[name]`,
 * longest name first, ignoring case and accents (`Zoe` finds `Zoë` and the other way round),
 * across runs of white space and line breaks (`Jan  de\nVries`), and with curly or straight
 * apostrophes alike (`O’Brien`, `O'Brien`).
 *
 * Time is linear in the text's length for every kind (scanners and patterns that read each run of
 * characters a bounded number of times), so a megabyte-long token cannot stall a run.
 *
 * Redaction is a safeguard, not a guarantee: names not on the list, addresses written in words or
 * numbers in unusual shapes pass through.
 */
export function createRedactor(options: RedactOptions = {}): (text: string) => string {
  const names = nameMatcher(options.names);
  return (text) => {
    let out = text;
    if (options.urls !== false) {
      out = out.replace(URL, (url) => {
        const trail = /[.,;:!?)\]'"]+$/.exec(url)?.[0] ?? '';
        return REDACTION_TOKENS.url + trail;
      });
    }
    if (options.emails !== false) out = redactEmails(out, REDACTION_TOKENS.email);
    if (options.handles !== false) out = out.replace(HANDLE, REDACTION_TOKENS.handle);
    if (options.phones !== false) out = redactPhones(out, REDACTION_TOKENS.phone);
    if (names) out = redactNames(out, names);
    return out;
  };
}
