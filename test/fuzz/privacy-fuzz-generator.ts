/**
 * Seeded generator of the privacy fuzz suite (test/fuzz/privacy-fuzz.test.ts): small donated
 * exports in every format lexichron reads, holding the participant's messages and other people's,
 * each message carrying a marker word, and byte-level faults applied to them. Every case is
 * reproduced from its seed alone.
 *
 * Markers: the participant's texts hold `ownsecret<n>x`, other people's `tpsecret<n>x`, diary
 * entries `diarysecret<n>x`; no marker (nor the word `secret`) may appear in any diagnostic, and no
 * `tpsecret` in any kept text.
 */
import { random, type RandomSource } from '../../src/stats/random.js';

export interface FuzzCase {
  seed: number;
  /** The export as written, before the fault. */
  clean: Buffer;
  /** The export with its fault. */
  bytes: Buffer;
  /** What was done to it, to name the case when it fails. */
  fault: string;
}

const pick = <T>(rand: RandomSource, items: readonly T[]): T => items[Math.floor(rand() * items.length)] as T;
const int = (rand: RandomSource, n: number): number => Math.floor(rand() * n);

const WORDS = ['morning', 'walk', 'tired', 'happy', 'coffee', 'work', 'rain', 'call', 'later', 'fine', 'see', 'you', 'a', 'the', 'and', 'so'];

function sentence(rand: RandomSource, marker: string): string {
  const words = Array.from({ length: 2 + int(rand, 6) }, () => pick(rand, WORDS));
  words.splice(int(rand, words.length + 1), 0, marker);
  return words.join(' ');
}

/**
 * One fault, as a single corruption in a file would be: a flipped byte, an inserted NUL, an
 * invalid UTF-8 byte, a bare CR or an extra LF, a deleted byte, or the file cut short. Faults
 * are aimed at line starts half of the time (where headers are).
 */
export function applyFault(rand: RandomSource, clean: Buffer): { bytes: Buffer; fault: string } {
  if (clean.length === 0) return { bytes: clean, fault: 'none' };
  const lineStarts = [0];
  for (let i = 0; i < clean.length - 1; i++) if (clean[i] === 10) lineStarts.push(i + 1);
  const at = rand() < 0.5 ? Math.min(clean.length - 1, (pick(rand, lineStarts) as number) + int(rand, 24)) : int(rand, clean.length);
  const kind = pick(rand, ['flip', 'flip', 'flip', 'nul', 'invalid-utf8', 'cr', 'lf', 'delete', 'truncate'] as const);
  const before = clean.subarray(0, at);
  const after = clean.subarray(at);
  switch (kind) {
    case 'flip': {
      const bytes = Buffer.from(clean);
      bytes[at] = (bytes[at] as number) ^ (1 << int(rand, 8));
      return { bytes, fault: `flip bit of byte ${at}` };
    }
    case 'nul':
      return { bytes: Buffer.concat([before, Buffer.from([0]), after]), fault: `NUL at ${at}` };
    case 'invalid-utf8':
      return { bytes: Buffer.concat([before, Buffer.from([pick(rand, [0xff, 0xc3, 0x80, 0xe2])]), after]), fault: `invalid UTF-8 at ${at}` };
    case 'cr':
      return { bytes: Buffer.concat([before, Buffer.from([13]), after]), fault: `CR at ${at}` };
    case 'lf':
      return { bytes: Buffer.concat([before, Buffer.from([10]), after]), fault: `LF at ${at}` };
    case 'delete':
      return { bytes: Buffer.concat([before, clean.subarray(at + 1)]), fault: `delete byte ${at}` };
    default:
      return { bytes: Buffer.from(before), fault: `truncate at ${at}` };
  }
}

function fuzzCase(seed: number, build: (rand: RandomSource) => string): FuzzCase {
  const rand = random(seed);
  const clean = Buffer.from(build(rand), 'utf8');
  const { bytes, fault } = applyFault(rand, clean);
  return { seed, clean, bytes, fault };
}

/** A chat-lines export (dash or bracket form, 24-hour or 12-hour clock) of the participant `Ann Lee` and others. */
export function chatLinesCase(seed: number): FuzzCase {
  return fuzzCase(seed, (rand) => {
    const bracket = rand() < 0.5;
    const twelve = rand() < 0.3;
    const lines: string[] = [];
    let minute = 0;
    for (let m = 0; m < 6 + int(rand, 10); m++) {
      minute += 1 + int(rand, 50);
      const day = 13 + Math.floor(minute / 1440);
      const h = Math.floor(minute / 60) % 24;
      const mm = String(minute % 60).padStart(2, '0');
      const clock = twelve ? `${((h + 11) % 12) + 1}:${mm} ${h < 12 ? 'AM' : 'PM'}` : `${String(h).padStart(2, '0')}:${mm}`;
      const date = `${day}/03/2024`;
      const own = rand() < 0.5;
      const sender = own ? 'Ann Lee' : pick(rand, ['Bob', 'Cleo Marsh', 'Dev']);
      const marker = `${own ? 'own' : 'tp'}secret${m}x`;
      if (rand() < 0.1) lines.push(bracket ? `[${date}, ${clock}] Bob joined` : `${date}, ${clock} - Bob joined`);
      lines.push(bracket ? `[${date}, ${clock}] ${sender}: ${sentence(rand, marker)}` : `${date}, ${clock} - ${sender}: ${sentence(rand, marker)}`);
      for (let k = int(rand, 3); k > 0; k--) lines.push(sentence(rand, marker));
    }
    return `${lines.join(rand() < 0.2 ? '\r\n' : '\n')}\n`;
  });
}

/** An mbox of messages from ann@example.org (the participant) and others. */
export function mboxCase(seed: number): FuzzCase {
  return fuzzCase(seed, (rand) => {
    const parts: string[] = [];
    for (let m = 0; m < 3 + int(rand, 5); m++) {
      const own = rand() < 0.5;
      const from = own ? 'ann@example.org' : pick(rand, ['bob@example.org', 'cleo@example.net']);
      const marker = `${own ? 'own' : 'tp'}secret${m}x`;
      const body = Array.from({ length: 1 + int(rand, 3) }, () => sentence(rand, marker)).join('\n');
      parts.push(`From ${from} Mon Mar  3 09:${String(10 + m).padStart(2, '0')}:00 2025\nFrom: ${from}\nTo: someone@example.com\nDate: Mon, 3 Mar 2025 09:${String(10 + m).padStart(2, '0')}:00 +0100\nSubject: note ${m}\n\n${body}\n\n`);
    }
    return parts.join('');
  });
}

/** A diary with ISO date headings; every entry is the participant's. */
export function diaryCase(seed: number): FuzzCase {
  return fuzzCase(seed, (rand) => {
    const lines: string[] = [];
    for (let d = 1; d <= 3 + int(rand, 6); d++) {
      lines.push(`# 2025-04-${String(d).padStart(2, '0')}`);
      for (let k = 1 + int(rand, 3); k > 0; k--) lines.push(sentence(rand, `diarysecret${d}x`));
      lines.push('');
    }
    return lines.join('\n');
  });
}

/** A chat table (CSV with quoted texts, or JSON Lines) of `Ann` (the participant) and others. */
export function chatTableCase(seed: number, format: 'csv' | 'jsonl'): FuzzCase {
  return fuzzCase(seed, (rand) => {
    const rows: Array<[string, string, string]> = [];
    for (let m = 0; m < 4 + int(rand, 10); m++) {
      const own = rand() < 0.5;
      const text = sentence(rand, `${own ? 'own' : 'tp'}secret${m}x`) + (rand() < 0.3 ? ', "quoted", and more' : '');
      rows.push([own ? 'Ann' : pick(rand, ['Bob', 'Cleo']), `2025-03-0${1 + int(rand, 9)}T1${int(rand, 10)}:${10 + int(rand, 50)}:00Z`, text]);
    }
    if (format === 'jsonl') return `${rows.map(([sender, time, text]) => JSON.stringify({ sender, time, text })).join('\n')}\n`;
    const q = (v: string) => (/[",\n]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v);
    return `sender,time,text\n${rows.map((r) => r.map(q).join(',')).join('\n')}\n`;
  });
}

/** A table of entries to score (CSV or JSON Lines) with person, time and text. */
export function entriesCase(seed: number, format: 'csv' | 'jsonl'): FuzzCase {
  return fuzzCase(seed, (rand) => {
    const rows: Array<[string, string, string]> = [];
    for (let m = 0; m < 4 + int(rand, 10); m++) {
      rows.push([pick(rand, ['p01', 'p02']), `2025-03-0${1 + int(rand, 9)} 1${int(rand, 10)}:${10 + int(rand, 50)}`, sentence(rand, `ownsecret${m}x`) + (rand() < 0.3 ? ', "quoted"' : '')]);
    }
    if (format === 'jsonl') return `${rows.map(([person, time, text]) => JSON.stringify({ person, time, text })).join('\n')}\n`;
    const q = (v: string) => (/[",\n]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v);
    return `person,time,text\n${rows.map((r) => r.map(q).join(',')).join('\n')}\n`;
  });
}

/**
 * A numeric table as lexichron's side readers take it (self-reports, a long series), where some
 * cells hold text instead of a number (`tpsecret…`, a note typed into a rating column).
 */
export function numericTableCase(seed: number, kind: 'ratings' | 'series'): FuzzCase {
  return fuzzCase(seed, (rand) => {
    const rows: string[] = [kind === 'ratings' ? 'person,time,mood,stress' : 'person,t,bin_start,lag_valid,mood'];
    for (let m = 0; m < 4 + int(rand, 10); m++) {
      const value = (): string => (rand() < 0.2 ? `note tpsecret${m}x` : (1 + int(rand, 7)).toString());
      rows.push(kind === 'ratings' ? `p01,2025-03-0${1 + int(rand, 9)}T10:00:00Z,${value()},${value()}` : `p01,${rand() < 0.1 ? `tpsecret${m}x` : m},2025-03-0${1 + int(rand, 9)}T00:00:00+01:00,1,${value()}`);
    }
    return `${rows.join('\n')}\n`;
  });
}
