import { random, type RandomSource } from '../../src/stats/random.js';

/**
 * The seeded generator of the input fuzz suite: each case is a class of input damage and a seed;
 * the same seed always gives the same bytes (xoshiro128** from src/stats/random.ts). Every case
 * starts from a valid input and mutates it.
 */

/** Classes of input damage, one generator each. */
export const CASE_CLASSES = [
  'byte_flip',
  'truncate',
  'invalid_utf8',
  'bom',
  'nul',
  'mixed_breaks',
  'extreme_years',
  'epoch_lengths',
  'deep_json',
  'jsonl_flip',
  'duplicate_header',
  'utf16',
  'ratings',
  'chat_table',
] as const;
export type CaseClass = (typeof CASE_CLASSES)[number];

/** One generated case: the file to read, how to read it, and what must hold beyond the common checks. */
export interface FuzzCase {
  seed: number;
  kind: CaseClass;
  /** File name (its extension tells the format). */
  name: string;
  bytes: Buffer;
  /** The same input undamaged, when the damage must not change what is read (metamorphic cases). */
  same?: Buffer;
  /** The command must stop with exit code 3 (bad input data). */
  expectInputError?: boolean;
}

const WORDS = ['calm', 'happy', 'tired', 'walked', 'the', 'dog', 'rain', 'good', 'bad', 'coffee', 'friend', 'not', 'very', 'work', 'sleep'];

function pick<T>(rng: RandomSource, items: readonly T[]): T {
  return items[Math.floor(rng() * items.length)] as T;
}

function int(rng: RandomSource, n: number): number {
  return Math.floor(rng() * n);
}

function sentence(rng: RandomSource): string {
  return Array.from({ length: 1 + int(rng, 8) }, () => pick(rng, WORDS)).join(' ');
}

function isoTime(rng: RandomSource): string {
  const day = 1 + int(rng, 28);
  return `2026-0${1 + int(rng, 9)}-${String(day).padStart(2, '0')}T${String(int(rng, 24)).padStart(2, '0')}:${String(int(rng, 60)).padStart(2, '0')}:00Z`;
}

/** A valid CSV of persons, times and texts (some quoted, with commas, quotes and line breaks). */
export function validCsv(rng: RandomSource, rows = 5 + int(rng, 20)): string {
  const lines = ['person,time,text'];
  for (let i = 0; i < rows; i++) {
    let text = sentence(rng);
    if (rng() < 0.2) text = `"${text}, ""quoted"" ${rng() < 0.5 ? '\n' : ''}${sentence(rng)}"`;
    lines.push(`p${int(rng, 4)},${isoTime(rng)},${text}`);
  }
  return `${lines.join('\n')}\n`;
}

/** A valid JSON Lines file with the same fields. */
export function validJsonl(rng: RandomSource, rows = 5 + int(rng, 20)): string {
  const lines: string[] = [];
  for (let i = 0; i < rows; i++) lines.push(JSON.stringify({ person: `p${int(rng, 4)}`, time: isoTime(rng), text: sentence(rng), extra: { n: i } }));
  return `${lines.join('\n')}\n`;
}

/** Times that were read wrongly or crashed before issue 19, and their neighbours. */
const EXTREME_TIMES = [
  '+275760-09-13T00:00:00Z', '-271821-04-20T00:00:00Z', '+275760-09-13T00:00:01Z', '8640000000000001', '-8640000000000001', '8640000000000000',
  '0026-03-01 10:00', '0099-12-31T10:00:00Z', '0000-01-01T00:00:00Z', '9999-12-31T23:59:59Z', '1969-12-31T23:59:59Z', '1500-01-01T10:00:00',
  '1700000000000000', '1700000000000000000', '99999999999', '999999999999', '2026-02-30T10:00:00Z', '2026-03-29 02:30', '10000-01-01T00:00:00Z',
  '2026-03-01T10:00:00+24:00', '2026-03-01T10:00:00.9999999999Z', '2026-12-31T23:59:60Z',
];

function mutateTimes(rng: RandomSource, csv: string, make: () => string): string {
  return csv.split('\n').map((line, i) => {
    if (i === 0 || line === '' || rng() < 0.4) return line;
    const parts = line.split(',');
    if (parts.length < 3 || !/^\d{4}-/.test(parts[1] ?? '')) return line;
    parts[1] = make();
    return parts.join(',');
  }).join('\n');
}

function insertAt(bytes: Buffer, at: number, extra: Buffer): Buffer {
  return Buffer.concat([bytes.subarray(0, at), extra, bytes.subarray(at)]);
}

/** Case `seed` of class `kind` (by default the class is chosen by the seed). */
export function fuzzCase(seed: number, kind: CaseClass = CASE_CLASSES[seed % CASE_CLASSES.length] as CaseClass): FuzzCase {
  const rng = random(seed);
  switch (kind) {
    case 'byte_flip': {
      const bytes = Buffer.from(validCsv(rng));
      for (let k = 1 + int(rng, 5); k > 0; k--) {
        const at = int(rng, bytes.length);
        bytes[at] = (bytes[at] as number) ^ (1 << int(rng, 8));
      }
      return { seed, kind, name: 'flip.csv', bytes };
    }
    case 'truncate': {
      const bytes = Buffer.from(validCsv(rng));
      return { seed, kind, name: 'cut.csv', bytes: bytes.subarray(0, int(rng, bytes.length + 1)) };
    }
    case 'invalid_utf8': {
      let bytes = Buffer.from(validCsv(rng));
      const bad = [[0xff], [0xc3, 0x28], [0x80], [0xe2, 0x82], [0xf0, 0x9f, 0x98], [0xed, 0xa0, 0x80]];
      for (let k = 1 + int(rng, 4); k > 0; k--) bytes = insertAt(bytes, int(rng, bytes.length), Buffer.from(pick(rng, bad)));
      return { seed, kind, name: 'bad-utf8.csv', bytes };
    }
    case 'bom': {
      const text = rng() < 0.5 ? validCsv(rng) : validJsonl(rng);
      const name = text.startsWith('person,') ? 'bom.csv' : 'bom.jsonl';
      const same = Buffer.from(text);
      const form = int(rng, 3);
      const bytes = form === 0 ? Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), same]) : form === 1 ? Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(text, 'utf16le')]) : Buffer.concat([Buffer.from([0xfe, 0xff]), Buffer.from(text, 'utf16le').swap16()]);
      return { seed, kind, name, bytes, same };
    }
    case 'nul': {
      let bytes = Buffer.from(validCsv(rng));
      for (let k = 1 + int(rng, 6); k > 0; k--) bytes = insertAt(bytes, int(rng, bytes.length), Buffer.from([0]));
      return { seed, kind, name: 'nul.csv', bytes };
    }
    case 'mixed_breaks': {
      const text = validCsv(rng);
      // Only the breaks between records change (quoted breaks are part of the text, RFC 4180 rule 6).
      let quoted = false;
      let out = '';
      for (const ch of text) {
        if (ch === '"') quoted = !quoted;
        out += ch === '\n' && !quoted ? pick(rng, ['\n', '\r', '\r\n']) : ch;
      }
      return { seed, kind, name: 'breaks.csv', bytes: Buffer.from(out), same: Buffer.from(text) };
    }
    case 'extreme_years': {
      const make = (): string => (rng() < 0.6 ? pick(rng, EXTREME_TIMES) : `${String(int(rng, 10000)).padStart(4, '0')}-${String(1 + int(rng, 12)).padStart(2, '0')}-${String(1 + int(rng, 31)).padStart(2, '0')}${pick(rng, [' 10:00', 'T10:00:00Z', 'T10:00:00+05:45'])}`);
      return { seed, kind, name: 'years.csv', bytes: Buffer.from(mutateTimes(rng, validCsv(rng), make)) };
    }
    case 'epoch_lengths': {
      const make = (): string => {
        const digits = 1 + int(rng, 19);
        let n = String(1 + int(rng, 9));
        while (n.length < digits) n += String(int(rng, 10));
        return `${rng() < 0.1 ? '-' : ''}${n}${rng() < 0.1 ? `.${int(rng, 1000)}` : ''}`;
      };
      return { seed, kind, name: 'epochs.csv', bytes: Buffer.from(mutateTimes(rng, validCsv(rng), make)) };
    }
    case 'deep_json': {
      const lines = validJsonl(rng).trimEnd().split('\n');
      const depth = pick(rng, [10, 100, 1000, 10_000, 50_000]);
      const at = int(rng, lines.length);
      const open = rng() < 0.5 ? '{"a":' : '[';
      const close = open === '[' ? ']' : '}';
      lines[at] = `{"person":"p9","time":"2026-03-01T10:00:00Z","text":"fine","unused":${open.repeat(depth)}1${close.repeat(depth)}}`;
      return { seed, kind, name: 'deep.jsonl', bytes: Buffer.from(`${lines.join('\n')}\n`) };
    }
    case 'jsonl_flip': {
      const bytes = Buffer.from(validJsonl(rng));
      for (let k = 1 + int(rng, 5); k > 0; k--) {
        const at = int(rng, bytes.length);
        bytes[at] = (bytes[at] as number) ^ (1 << int(rng, 8));
      }
      return { seed, kind, name: 'flip.jsonl', bytes };
    }
    case 'duplicate_header': {
      const [header = '', ...rest] = validCsv(rng).split('\n');
      const columns = header.split(',');
      const copy = columns[int(rng, columns.length)] as string;
      const at = int(rng, columns.length + 1);
      columns.splice(at, 0, copy);
      const rows = rest.map((r) => (r === '' ? r : `${r},x`));
      return { seed, kind, name: 'dup.csv', bytes: Buffer.from([columns.join(','), ...rows].join('\n')), expectInputError: true };
    }
    case 'utf16': {
      const text = validCsv(rng);
      const le = Buffer.from(text, 'utf16le');
      return { seed, kind, name: 'utf16.csv', bytes: rng() < 0.5 ? le : Buffer.from(le).swap16(), same: Buffer.from(text) };
    }
    case 'ratings': {
      const lines = ['person,time,mood,calm'];
      for (let i = 0; i < 5 + int(rng, 20); i++) lines.push(`p${int(rng, 4)},${rng() < 0.3 ? pick(rng, EXTREME_TIMES) : isoTime(rng)},${pick(rng, ['50', 'NA', '-99', '', '101', '7.5', 'x'])},${pick(rng, ['4', 'NA', '9', ''])}`);
      let bytes = Buffer.from(`${lines.join('\n')}\n`);
      if (rng() < 0.5) bytes = insertAt(bytes, int(rng, bytes.length), Buffer.from(pick(rng, [[0xff], [0], [0x0d], [0x22]])));
      return { seed, kind, name: 'ratings.csv', bytes };
    }
    case 'chat_table': {
      const lines = ['sender,time,text'];
      for (let i = 0; i < 5 + int(rng, 20); i++) lines.push(`${pick(rng, ['Ada', 'Bea'])},${rng() < 0.3 ? pick(rng, EXTREME_TIMES) : isoTime(rng)},${sentence(rng)}`);
      let bytes = Buffer.from(`${lines.join(pick(rng, ['\n', '\r\n', '\r']))}\n`);
      if (rng() < 0.5) bytes = insertAt(bytes, int(rng, bytes.length), Buffer.from(pick(rng, [[0xff], [0], [0x0d], [0x22]])));
      return { seed, kind, name: 'chat.csv', bytes };
    }
  }
}

/** A header and one row of `columns` columns (the 10^6-column case). */
export function manyColumns(columns: number): Buffer {
  const names = ['person', 'time', 'text'];
  for (let i = names.length; i < columns; i++) names.push(`c${i}`);
  const row = ['p1', '2026-03-01T10:00:00Z', 'a good day'];
  for (let i = row.length; i < columns; i++) row.push('');
  return Buffer.from(`${names.join(',')}\n${row.join(',')}\n`);
}

/** A CSV whose one text field holds `megabytes` MB (the long run only). */
export function largeField(megabytes: number): Buffer {
  return Buffer.from(`person,time,text\np1,2026-03-01T10:00:00Z,"${'word '.repeat((megabytes * 1024 * 1024) / 5)}"\np2,2026-03-01T11:00:00Z,short\n`);
}
