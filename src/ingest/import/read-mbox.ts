import { inputError } from '../../errors.js';
import { importReject, type ImportItem } from './import-item.js';
import { normalizeAddress } from './parse-address-list.js';
import { parseMailMessage } from './parse-mail-message.js';
import type { ByteLine } from './split-byte-lines.js';
import { splitMbox } from './split-mbox.js';

/** Messages decoded at the same time (mailparser waits on the event loop between steps); output order is kept. */
const WINDOW = 8;

/** Options of the mbox importer. */
export interface MboxOptions {
  /** File name used in entry ids and diagnostics. */
  file: string;
  person: string;
  /** The person's IANA zone. */
  zone: string;
  /** The participant's own addresses; only messages From one of them are kept. */
  addresses: readonly string[];
}

/**
 * Reads an mbox (RFC 4155) message by message: splitMbox, then parseMailMessage for each.
 * Lines before the first separator become one `mbox_preamble` reject; a file without any
 * separator is not an mbox and raises an input error. Up to 8 messages are decoded at once, and
 * items come out in file order; memory holds those 8 messages, whatever the size of the file.
 */
export async function* readMbox(lines: AsyncIterable<ByteLine>, options: MboxOptions): AsyncGenerator<ImportItem> {
  const addresses = new Set(options.addresses.map(normalizeAddress));
  let messages = 0;
  let preamble = 0;
  const inFlight: Array<Promise<ImportItem>> = [];
  for await (const part of splitMbox(lines)) {
    if (part.kind === 'preamble') {
      preamble = part.lines;
      if (messages === 0 && preamble > 0) {
        yield importReject(options.file, part.line, 'mbox_preamble', `${part.lines} line(s) before the first \`From \` separator line belong to no message (the file may be cut off at the start)`);
      }
      continue;
    }
    messages++;
    const pending = parseMailMessage(part.raw, { file: options.file, line: part.line, person: options.person, zone: options.zone, addresses });
    pending.catch(() => undefined); // a failure surfaces when its turn comes, not as an unhandled rejection
    inFlight.push(pending);
    if (inFlight.length >= WINDOW) yield await (inFlight.shift() as Promise<ImportItem>);
  }
  while (inFlight.length > 0) yield await (inFlight.shift() as Promise<ImportItem>);
  if (messages === 0) {
    throw inputError(`Cannot read \`${options.file}\` as mbox: no line starts a message (\`From sender Thu Nov 21 09:55:06 1997\`, RFC 4155); check the format or export the mailbox as mbox.`);
  }
}
