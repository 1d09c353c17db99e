/** One mailbox of an address header: the display name (may be empty) and the address. */
export interface Mailbox {
  name: string;
  /** addr-spec with comments and folding white space removed, e.g. `quillon@silly.test`. */
  address: string;
}

/**
 * Parses an address header value (From, To, Cc…) into mailboxes, following RFC 5322
 * section 3.4 and the obsolete forms of section 4.4:
 * - name-addr (`Mary Smith <mary@x.test>`, `"Giant; \"Big\" Box" <sysservices@example.net>`) and bare addr-spec;
 * - comments anywhere, nested and with quoted pairs (`Quillon(A nice \) chap) <quillon(his account)@silly.test(his host)>`);
 * - groups (`A Group:Ed Jones <c@a.test>,joe@where.test;`), whose members are returned;
 * - obsolete routes (`<@node.test:mary@example.net>`), empty list elements and white space around dots.
 * Encoded words (RFC 2047) in names are left encoded. Elements without `@` (such as an empty group) give nothing.
 */
export function parseAddressList(value: string): Mailbox[] {
  const out: Mailbox[] = [];
  let phrase = '';
  let spec = '';
  let angle: string | undefined;
  let inAngle = false;
  const flush = (): void => {
    let address = (angle ?? spec).trim();
    if (angle !== undefined && address.startsWith('@')) address = address.slice(address.indexOf(':') + 1);
    if (address.includes('@')) out.push({ name: angle !== undefined ? phrase.replace(/\s+/g, ' ').trim() : '', address });
    phrase = '';
    spec = '';
    angle = undefined;
  };
  let i = 0;
  while (i < value.length) {
    const c = value[i] as string;
    if (c === '(') {
      let depth = 0;
      for (; i < value.length; i++) {
        const d = value[i];
        if (d === '\\') i++;
        else if (d === '(') depth++;
        else if (d === ')' && --depth === 0) break;
      }
      i++;
      phrase += ' ';
      continue;
    }
    if (c === '"') {
      let text = '';
      let rawText = '"';
      for (i++; i < value.length && value[i] !== '"'; i++) {
        if (value[i] === '\\' && i + 1 < value.length) {
          rawText += value[i];
          i++;
        }
        text += value[i];
        rawText += value[i];
      }
      i++;
      rawText += '"';
      if (inAngle) angle = (angle ?? '') + rawText;
      else {
        phrase += text;
        spec += rawText;
      }
      continue;
    }
    if (inAngle) {
      if (c === '>') inAngle = false;
      else if (!/\s/.test(c)) angle = (angle ?? '') + c;
      i++;
      continue;
    }
    if (c === '<') {
      inAngle = true;
      angle = '';
    } else if (c === ',' || c === ';') {
      flush();
    } else if (c === ':') {
      // a group's display name ends here; its members follow
      phrase = '';
      spec = '';
    } else {
      phrase += c;
      if (!/\s/.test(c)) spec += c;
    }
    i++;
  }
  flush();
  return out;
}

/**
 * The comparable form of an address: lower case, so that `John.Doe@Example.COM` and
 * `john.doe@example.com` match. (RFC 5321 lets a host treat local parts case-sensitively,
 * but no common mail service does, and participants type their addresses in any case.)
 */
export function normalizeAddress(address: string): string {
  return address.trim().toLowerCase();
}
