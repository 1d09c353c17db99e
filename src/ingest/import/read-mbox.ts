import { inputError } from '../../errors.js';
import { importReject, type ImportItem } from './import-item.js';
import { normalizeAddress } from './parse-address-list.js';
import { parseMailMessage } from './parse-mail-message.js';
import type { ByteLine } from './split-byte-lines.js';
import { splitMbox } from './split-mbox.js';

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
 * separator is not an mbox and raises an input error. Memory holds one message at a time.
 */
export async function* readMbox(lines: AsyncIterable<ByteLine>, options: MboxOptions): AsyncGenerator<ImportItem> {
  const addresses = new Set(options.addresses.map(normalizeAddress));
  let messages = 0;
  let preamble = 0;
  for await (const part of splitMbox(lines)) {
    if (part.kind === 'preamble') {
      preamble = part.lines;
      if (messages === 0 && preamble > 0) {
        yield importReject(options.file, part.line, 'mbox_preamble', `${part.lines} line(s) before the first \`From \` separator line belong to no message (the file may be cut off at the start)`);
      }
      continue;
    }
    messages++;
    yield await parseMailMessage(part.raw, { file: options.file, line: part.line, person: options.person, zone: options.zone, addresses });
  }
  if (messages === 0) {
    throw inputError(`Cannot read \`${options.file}\` as mbox: no line starts a message (\`From sender Thu Nov 21 09:55:06 1997\`, RFC 4155); check the format or export the mailbox as mbox.`);
  }
}
