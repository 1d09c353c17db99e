/** The date and clock time at the start of a chat line, as written (the date order is settled later). */
export interface ChatStamp {
  /** The three numbers of the date in the order written, and the digits of the first and last. */
  parts: [number, number, number];
  firstDigits: number;
  lastDigits: number;
  hour: number;
  minute: number;
  second: number;
  /** `am`/`pm` when the clock is a 12-hour one. */
  meridiem?: 'am' | 'pm';
}

/** One physical line of a line-based chat export. */
export type ChatLine =
  | { kind: 'message'; stamp: ChatStamp; sender: string; text: string }
  | { kind: 'system'; stamp: ChatStamp }
  | { kind: 'damaged' }
  | { kind: 'continuation'; text: string };

const S = '[\\s\\u00a0\\u202f]';
const DATE = '(\\d{1,4})([./-])(\\d{1,2})\\2(\\d{1,4})';
const TIME = `(\\d{1,2})[:.](\\d{2})(?:[:.](\\d{2}))?(?:${S}*([ap])\\.?${S}?m\\.?(?![a-z]))?`;
/** `[31/12/2021, 23:59:10] Ann: …` (bracketed) or `31/12/2021, 23:59 - Ann: …` (dash). */
const BRACKETED = new RegExp(`^\\[${DATE},?${S}+${TIME}\\]${S}*(.*)$`, 'is');
const DASHED = new RegExp(`^${DATE},?${S}+${TIME}${S}+[-\\u2013\\u2014]${S}+(.*)$`, 'is');
/** Marks that exports put before lines or around names: LRM/RLM, embeddings and isolates, byte-order mark. */
const INVISIBLE = /[\u200e\u200f\u202a-\u202e\u2066-\u2069\ufeff]/g;
const SENDER = /^([^:\n]{1,120}?):(?:[\s\u00a0]+|$)([\s\S]*)$/;

/** A sender name as compared: invisible marks removed, Unicode NFC, white space folded, trimmed, lower case. */
export function normalizeSender(name: string): string {
  return name.replace(INVISIBLE, '').normalize('NFC').replace(/[\s\u00a0\u202f]+/g, ' ').trim().toLowerCase();
}

/** A header of either form inside a line (not at its start), with a sender: where a lost line break joined two messages. */
const EMBEDDED = [
  new RegExp(`(?<![\\d\\[])\\[${DATE},?${S}+${TIME}\\]${S}*[^:\\n\\[\\]]{1,120}?:`, 'gis'),
  new RegExp(`(?<!\\d)${DATE},?${S}+${TIME}${S}+[-\\u2013\\u2014]${S}+[^:\\n]{1,120}?:`, 'gis'),
];

/**
 * Splits a line where a whole message header (date, time and sender) stands inside it: a line
 * break lost or damaged (a flipped byte, a CR read as text) joins two messages into one line, and
 * the text after the inner header is not the first message's author's. Returns the line itself
 * when it holds no inner header. Participants rarely type `31/12/2024, 21:05 - Name:` mid-sentence;
 * when they do, the part after it is treated as another message, which errs on the safe side.
 */
export function splitEmbeddedHeaders(line: string): string[] {
  const starts: number[] = [];
  for (const pattern of EMBEDDED) {
    pattern.lastIndex = 1;
    for (let m = pattern.exec(line); m !== null; m = pattern.exec(line)) {
      if (m.index > 0) starts.push(m.index);
      pattern.lastIndex = m.index + 1;
    }
  }
  if (starts.length === 0) return [line];
  starts.sort((a, b) => a - b);
  const parts: string[] = [];
  let from = 0;
  for (const start of starts) {
    if (start <= from) continue;
    parts.push(line.slice(from, start));
    from = start;
  }
  parts.push(line.slice(from));
  return parts;
}

/** Leading characters skipped before a line is judged: white space, controls and invisible marks. */
const LEADING_NOISE = /^[\s\u0000-\u001f\u007f\u200e\u200f\u202a-\u202e\u2066-\u2069\ufeff]+/;

/**
 * True when a line that is not a readable header still looks like one: after white space,
 * control characters and invisible marks, a digit comes within the first three characters and
 * the first 32 characters hold at least 6 digits (a date and a clock time hold 7 or more). Such a
 * line is most likely a header damaged by a flipped byte, a NUL or invalid UTF-8, so its author
 * is unknown. Ordinary message lines rarely start this way; phone numbers and dated lists can.
 */
export function looksLikeChatHeader(line: string): boolean {
  const text = line.replace(LEADING_NOISE, '');
  const head = text.slice(0, 32);
  const first = head.search(/\d/);
  if (first === -1 || first > 2) return false;
  let digits = 0;
  for (let i = 0; i < head.length; i++) {
    const c = head.charCodeAt(i);
    if (c >= 48 && c <= 57) digits++;
  }
  return digits >= 6;
}

/**
 * Parses one line of a line-based chat export ("chat-lines"):
 * `date, time - sender: message` or `[date, time] sender: message`, where
 * - the date is three numbers separated by `/`, `.` or `-` in an order settled per file (settleDateOrder);
 * - the time is `H:mm` or `H:mm:ss` (also with dots), on a 24-hour clock or with an AM/PM marker
 *   (`PM`, `pm`, `p.m.`, `p. m.`), which may follow a space, a no-break space U+00A0 or the narrow
 *   no-break space U+202F that recent Unicode CLDR locale data puts before it;
 * - a dated line without `sender: ` is a system line;
 * - a line that looks like a header but cannot be read (looksLikeChatHeader) is `damaged`: its
 *   author is unknown, so neither it nor the lines after it may join anyone's message;
 * - any other line continues the previous message (a message with line breaks).
 * Direction marks and other invisible characters at the start are ignored.
 */
export function parseChatLine(line: string): ChatLine {
  const text = line.replace(/^[\u200e\u200f\u202a-\u202e\u2066-\u2069\ufeff]+/, '');
  const m = BRACKETED.exec(text) ?? DASHED.exec(text);
  if (!m) return looksLikeChatHeader(line) ? { kind: 'damaged' } : { kind: 'continuation', text: line };
  const stamp: ChatStamp = {
    parts: [Number(m[1]), Number(m[3]), Number(m[4])],
    firstDigits: (m[1] as string).length,
    lastDigits: (m[4] as string).length,
    hour: Number(m[5]),
    minute: Number(m[6]),
    second: Number(m[7] ?? 0),
  };
  if (m[8]) stamp.meridiem = (m[8] as string).toLowerCase() === 'a' ? 'am' : 'pm';
  const rest = (m[9] as string).replace(/^[\u200e\u200f]+/, '');
  const s = SENDER.exec(rest);
  if (!s) return { kind: 'system', stamp };
  return { kind: 'message', stamp, sender: (s[1] as string).replace(INVISIBLE, '').trim(), text: (s[2] as string).replace(/^[\u200e\u200f]+/, '') };
}
