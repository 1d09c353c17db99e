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

const ATEXT = "[\\p{L}\\p{N}!#$%&'*+/=?^_`{|}~-]";
const DOT_ATOM = `${ATEXT}+(?:\\.${ATEXT}+)*`;
const QUOTED = '"(?:[^"\\\\\\r\\n]|\\\\.)*"';
const DOMAIN = '(?:(?:[\\p{L}\\p{N}](?:[\\p{L}\\p{N}-]*[\\p{L}\\p{N}])?\\.)+\\p{L}[\\p{L}\\p{N}-]*[\\p{L}\\p{N}]|\\[[^\\]\\s]+\\])';
const ADDR_SPEC = `(?:${DOT_ATOM}|${QUOTED})@${DOMAIN}`;
/** A quoted display name with its angle address, an angle address (with an obsolete route), or a bare addr-spec (RFC 5322 section 3.4). */
const EMAIL = new RegExp(`(?:${QUOTED}\\s*)?<(?:@[^:<>\\s]+:)?${ADDR_SPEC}>|${ADDR_SPEC}`, 'gu');
const URL = /\b(?:[a-z][a-z0-9+.-]*:\/\/|www\.)[^\s<>"]+/giu;
const HANDLE = /(?<![\p{L}\p{N}_@.])@[\p{L}\p{N}_](?:[\p{L}\p{N}_.]*[\p{L}\p{N}_])?/gu;
/** A run of digits and the separators people write inside phone numbers, starting with +, 00, ( or a digit. */
const PHONE = /(?<![\p{L}\p{N}+])(?:\+|\(\+?)?\d[\d \u00a0().\/-]{4,}\d(?![\p{L}\p{N}])/gu;
const DATE_LIKE = /^(?:\d{1,2}[./-]\d{1,2}[./-]\d{2,4}|\d{4}[./-]\d{1,2}[./-]\d{1,2})$/;
const NANP = /^(?:\+?1[ .-]?)?\(?\d{3}\)?[ .-]?\d{3}[ .-]\d{4}$/;

/**
 * Decides whether a digit run is a phone number:
 * - international (leading `+` or `00`): 7 to 15 digits in all, the ITU-T E.164 maximum of 15 digits
 *   including the country code;
 * - national: 7 to 13 digits starting with the trunk prefix 0 (`020 7946 0958`, `06 12 34 56 78`,
 *   `030 1234567`), or the North American plan's 3-3-4 shape (`(201) 555-0123`, `201-555-0123`);
 * - not a calendar date (`01.02.2021`, `2021-02-01`) nor groups of three after dots (`1.234.567`).
 */
function isPhone(candidate: string): boolean {
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

/** Index of the next digit group after a space in `run` (or its length). */
function nextGroup(run: string, from: number): number {
  const space = run.slice(from).search(/[ \u00a0]+[+(\d]/);
  if (space === -1) return run.length;
  let i = from + space;
  while (run[i] === ' ' || run[i] === '\u00a0') i++;
  return i;
}

function escapeRegExp(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

/**
 * Creates a redactor for text the tool keeps (entries, rejects, samples). In this order it replaces:
 * URLs (`scheme://…`, `www.…`) with `[url]`; e-mail addresses in the forms of RFC 5322 section 3.4
 * (dot-atom and quoted local parts, domain literals, angle addresses with an optional quoted display
 * name, obsolete routes; also non-ASCII addresses as RFC 6531 allows) with `[email]`; `@handles` with
 * `[handle]`; phone numbers (see isPhone: ITU-T E.164 international and common national forms) with
 * `[phone]`; and the supplied names as whole words, ignoring case, with `[name]`.
 *
 * Redaction is a safeguard, not a guarantee: names not on the list, addresses written in words or
 * numbers in unusual shapes pass through.
 */
export function createRedactor(options: RedactOptions = {}): (text: string) => string {
  const names = [...new Set((options.names ?? []).map((n) => n.trim()).filter((n) => n !== ''))].sort((a, b) => b.length - a.length);
  const nameRe = names.length > 0 ? new RegExp(`(?<![\\p{L}\\p{N}_])(?:${names.map(escapeRegExp).join('|')})(?![\\p{L}\\p{N}_])`, 'giu') : undefined;
  return (text) => {
    let out = text;
    if (options.urls !== false) {
      out = out.replace(URL, (url) => {
        const trail = /[.,;:!?)\]'"]+$/.exec(url)?.[0] ?? '';
        return REDACTION_TOKENS.url + trail;
      });
    }
    if (options.emails !== false) out = out.replace(EMAIL, REDACTION_TOKENS.email);
    if (options.handles !== false) out = out.replace(HANDLE, REDACTION_TOKENS.handle);
    if (options.phones !== false) {
      out = out.replace(PHONE, (run) => {
        const core = run.replace(/[ \u00a0.\/-]+$/, '');
        // the run may begin with an unrelated number ("room 12 020 7946 0958"): try each group start
        for (let i = 0; i < core.length; i = nextGroup(core, i)) {
          if (isPhone(core.slice(i))) return run.slice(0, i) + REDACTION_TOKENS.phone + run.slice(core.length);
        }
        return run;
      });
    }
    if (nameRe) out = out.replace(nameRe, REDACTION_TOKENS.name);
    return out;
  };
}
