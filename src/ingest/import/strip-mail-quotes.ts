/**
 * Lines that introduce a quoted reply: "On Mon, 3 Feb 2025, Ann <a@b.example> wrote:" and its
 * usual counterparts in French, German, Spanish, Dutch, Italian and Portuguese mail programs.
 */
const ATTRIBUTION =
  /^\s*(?:on|le|am|el|op|il|em)\b.{0,300}?\b(?:wrote|a écrit|schrieb|escribió|schreef|ha scritto|escreveu)\s*:?\s*$/i;
const ATTRIBUTION_START = /^\s*(?:on|le|am|el|op|il|em)\s/i;
/** Separator lines that start a forwarded or an included original message. */
const FORWARD =
  /^\s*(?:-{2,}\s*(?:forwarded message|original message|weitergeleitete nachricht|message transféré|mensaje reenviado|doorgestuurd bericht|messaggio inoltrato)\s*-{2,}.*|begin forwarded message:?)\s*$/i;
/** A line of underscores or dashes followed by a header block (`From: … Sent: …`), as written by some desktop programs. */
const RULE = /^\s*(?:_{8,}|-{8,})\s*$/;
const HEADER_LINE = /^\s*(?:from|von|de|van|da)\s*:/i;
const HEADER_FOLLOW = /^\s*(?:sent|date|to|subject|gesendet|datum|an|betreff|envoyé|à|objet|enviado|para|asunto)\s*:/i;
/** The signature delimiter "-- " of RFC 3676 section 4.3 (the trailing space is often lost, so "--" alone counts too). */
const SIGNATURE = /^-- ?$/;
const QUOTED = /^\s*>/;
/** An mbox separator line (`From sender Thu Nov 21 09:55:06 1997`, RFC 4155) with a damaged first word. */
const DAMAGED_SEPARATOR = /^\S{3,6} \S+ .*\b\d{1,2}:\d{2}\b/;
/** An mbox separator line inside a body (its message glued on when the line was damaged after `From `): an address or `-`, then a clock time. */
const SEPARATOR_LIKE = /^From (?:\S*@\S*|-)\s.*\b\d{1,2}:\d{2}/;
/** A device footer that mail programs append on their own ("Sent from my phone"), in a few languages. */
const DEVICE_FOOTER = /^\s*(?:sent from my|sent from|envoyé de mon|gesendet von meinem|verzonden vanaf mijn|enviado desde mi|inviato da)\b.{0,40}$/i;

function isHeaderBlock(lines: readonly string[], at: number): boolean {
  if (!HEADER_LINE.test(lines[at] ?? '')) return false;
  for (let k = at + 1; k < Math.min(lines.length, at + 5); k++) if (HEADER_FOLLOW.test(lines[k] ?? '')) return true;
  return false;
}

/**
 * Keeps only the sender's own words of a plain-text mail body:
 * - cuts at the signature delimiter (RFC 3676 section 4.3) and everything after it;
 * - cuts at a forwarded or original-message block (`---------- Forwarded message ---------`,
 *   `-----Original Message-----`, `Begin forwarded message:`, or any line `From:` followed by `Sent:`,
 *   `Date:`, `To:` or `Subject:` within four lines, two such header fields in a row, or a line
 *   shaped like an mbox separator: an included message, or the next message of an mbox whose
 *   separator line was damaged);
 * - removes reply attributions ("On <date>, <name> wrote:", holding a digit, also when wrapped over two lines) and quoted lines
 *   starting with `>` (RFC 3676 section 4.5); when an attribution is followed by no `>` lines
 *   (quoting lost in an HTML conversion), the rest is taken as the quote and cut;
 * - drops a device footer ("Sent from my phone") standing last;
 * - collapses runs of blank lines and trims.
 * Returns the empty string when nothing of the sender's own remains.
 */
export function stripMailQuotes(body: string): string {
  const lines = body.replace(/\r\n?/g, '\n').split('\n');
  const kept: string[] = [];
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i] as string;
    if (SIGNATURE.test(line)) break;
    if (FORWARD.test(line)) break;
    if (RULE.test(line) && isHeaderBlock(lines, i + 1)) break;
    // a header block anywhere: an included message, or the next message of the mbox glued on when its
    // separator line was damaged (that line, just before the block, goes too: it names the next sender)
    // two header fields in a row (`To:` then `Date:`) or a separator line: another message starts here
    const fields = (HEADER_LINE.test(line) || HEADER_FOLLOW.test(line)) && (HEADER_LINE.test(lines[i + 1] ?? '') || HEADER_FOLLOW.test(lines[i + 1] ?? ''));
    if (isHeaderBlock(lines, i) || fields || SEPARATOR_LIKE.test(line)) {
      if (kept.length > 0 && DAMAGED_SEPARATOR.test(kept[kept.length - 1] as string)) kept.pop();
      break;
    }
    let attributionEnd = -1;
    if (ATTRIBUTION.test(line) && /\d/.test(line)) attributionEnd = i;
    else if (ATTRIBUTION_START.test(line) && i + 1 < lines.length) {
      const joined = `${line} ${lines[i + 1]}`;
      if (ATTRIBUTION.test(joined) && /\d/.test(joined)) attributionEnd = i + 1;
    }
    if (attributionEnd >= 0) {
      const rest = lines.slice(attributionEnd + 1);
      if (!rest.some((l) => QUOTED.test(l))) break;
      i = attributionEnd;
      continue;
    }
    if (QUOTED.test(line)) continue;
    // A device footer on the last non-blank line is the mail program's words, not the sender's.
    if (DEVICE_FOOTER.test(line) && lines.slice(i + 1).every((l) => l.trim() === '' || QUOTED.test(l))) continue;
    kept.push(line.replace(/\s+$/, ''));
  }
  return kept.join('\n').replace(/\n{3,}/g, '\n\n').trim();
}
