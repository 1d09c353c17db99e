import dns from 'node:dns';
import { existsSync, mkdirSync, readFileSync } from 'node:fs';
import http from 'node:http';
import https from 'node:https';
import net from 'node:net';
import tls from 'node:tls';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { tempFolder } from '../support/temp-files.js';

const tmp = tempFolder();
const attempts: string[] = [];
const restore: Array<() => void> = [];

/** Replaces a method so that any call is recorded and fails, as a machine without network would. */
function guard<T extends object>(target: T, name: keyof T & string, label: string): void {
  const original = target[name];
  (target as Record<string, unknown>)[name] = (..._args: unknown[]) => {
    attempts.push(label);
    throw new Error(`network use is not allowed: ${label}`);
  };
  restore.push(() => {
    (target as Record<string, unknown>)[name] = original;
  });
}

beforeAll(() => {
  guard(net.Socket.prototype, 'connect', 'net.Socket.connect');
  guard(net, 'connect', 'net.connect');
  guard(net, 'createConnection', 'net.createConnection');
  guard(tls, 'connect', 'tls.connect');
  guard(dns, 'lookup', 'dns.lookup');
  guard(dns, 'resolve', 'dns.resolve');
  guard(dns.promises, 'lookup', 'dns.promises.lookup');
  guard(http, 'request', 'http.request');
  guard(http, 'get', 'http.get');
  guard(https, 'request', 'https.request');
  guard(https, 'get', 'https.get');
  guard(globalThis, 'fetch', 'fetch');
});
afterAll(() => {
  for (const undo of restore.reverse()) undo();
});

/** Runs the command line in this process (the guards above are in place) and returns the exit code and stderr. */
async function cli(...args: string[]): Promise<{ code: number; stderr: string }> {
  const { main } = await import('../../src/cli/main.js'); // loaded after the guards, so module start-up is covered too
  let stderr = '';
  const spy = vi.spyOn(process.stderr, 'write').mockImplementation((chunk: string | Uint8Array) => {
    stderr += String(chunk);
    return true;
  });
  try {
    const code = await main(['node', 'lexichron', ...args]);
    return { code, stderr };
  } finally {
    spy.mockRestore();
    process.exitCode = undefined;
  }
}

const MBOX = [
  'From ann@example.org Mon Mar  3 09:00:00 2025',
  'From: Ann <ann@example.org>',
  'Date: Mon, 3 Mar 2025 09:00:00 +0100',
  '',
  'So happy today! Call me on +44 20 7946 0958 or see https://example.org/x.',
  '',
  'From bob@example.org Mon Mar  3 09:05:00 2025',
  'From: Bob <bob@example.org>',
  'Date: Mon, 3 Mar 2025 09:05:00 +0100',
  '',
  'Bob wrote this and it must not be kept.',
  '',
  'From ann@example.org Mon Mar  3 10:00:00 2025',
  'From: Ann <ann@example.org>',
  '',
  'No date here, Bob.',
  '',
].join('\n');

describe('lexichron import', () => {
  it('has network guards that do catch a connection attempt (so their silence below means something)', async () => {
    expect(() => net.connect(80, '192.0.2.1')).toThrow(/network use is not allowed/);
    expect(() => dns.lookup('example.org', () => undefined)).toThrow(/network use is not allowed/);
    await expect(async () => fetch('http://192.0.2.1/')).rejects.toThrow(/network use is not allowed/);
    expect(attempts).toEqual(['net.connect', 'dns.lookup', 'fetch']);
    attempts.length = 0;
  });

  it('imports an mbox: own messages kept and redacted, third-party dropped, rejects and counts written, no network used', async () => {
    const input = tmp.write('inbox.mbox', MBOX);
    const names = tmp.write('names.txt', '# people\nBob\n');
    const out = tmp.path('mail/entries.jsonl');
    const { code, stderr } = await cli('import', 'mbox', input, '--person', 'P01', '--address', 'ann@example.org', '--time-zone', 'Europe/Brussels', '--redact-names', names, '--out', out);
    expect(code).toBe(0);
    expect(readFileSync(out, 'utf8')).toBe('{"id":"inbox.mbox:1","person":"P01","time":"2025-03-03T09:00:00+01:00","zone":"Europe/Brussels","text":"So happy today! Call me on [phone] or see [url]."}\n');
    expect(readFileSync(`${out}.rejects.csv`, 'utf8')).toBe('file,line,code,message\ninbox.mbox,13,mail_no_date,"the message has no Date header, so its time is unknown"\n');
    const meta = JSON.parse(readFileSync(`${out}.meta.json`, 'utf8'));
    expect(meta.reconciliation).toEqual({ read: 3, kept: 1, rejected: { mail_no_date: 1 }, dropped: { third_party: 1 }, notes: {} });
    expect(stderr).toContain('read 3: kept 1');
    expect(stderr).toContain('dropped 1: third_party 1');
    for (const file of [out, `${out}.rejects.csv`, `${out}.meta.json`]) expect(readFileSync(file, 'utf8')).not.toMatch(/Bob wrote|must not be kept/);
    expect(attempts).toEqual([]);
  });

  it('pseudonymizes the person id with the key from LEXICHRON_PSEUDONYM_KEY and never writes the key', async () => {
    const input = tmp.write('chat.txt', '21/03/2025, 08:00 - Ann: Good morning\n21/03/2025, 08:01 - Ann: again\n21/03/2025, 08:30 - Bob: hi Ann\n');
    const out = tmp.path('chat.jsonl');
    const key = 'correct horse battery staple 42';
    vi.stubEnv('LEXICHRON_PSEUDONYM_KEY', key);
    try {
      const { code, stderr } = await cli('import', 'chat-lines', input, '--person', 'P01', '--sender', 'Ann', '--time-zone', 'Europe/Brussels', '--merge-burst', '5', '--out', out);
      expect(code).toBe(0);
      expect(stderr).toContain('date order: dmy');
    } finally {
      vi.unstubAllEnvs();
    }
    const { createPseudonymizer } = await import('../../src/privacy/create-pseudonymizer.js');
    const pseudonyms = createPseudonymizer(new TextEncoder().encode(key));
    const lines = readFileSync(out, 'utf8').trim().split('\n').map((l) => JSON.parse(l));
    // The entry id is keyed too (no file name beside the pseudonym), and the entry carries the key's check value.
    expect(lines).toEqual([{ id: pseudonyms.entryId('chat.txt:1'), person: pseudonyms.person('P01'), pseudonym_key: pseudonyms.keyCheck, time: '2025-03-21T08:00:00+01:00', zone: 'Europe/Brussels', text: 'Good morning\nagain' }]);
    expect(lines[0].id).toMatch(/^e[0-9a-f]{16}$/);
    for (const file of [out, `${out}.rejects.csv`, `${out}.meta.json`]) {
      const text = readFileSync(file, 'utf8');
      expect(text).not.toContain(key);
      expect(text).not.toContain('P01');
      expect(text).not.toContain('chat.txt');
    }
    expect(attempts).toEqual([]);
  });

  it('exits with code 2 and a message naming the fix when the chat file cannot settle day and month, leaving no output', async () => {
    const input = tmp.write('ambiguous.txt', '03/04/2025, 08:00 - Ann: hi\n');
    const out = tmp.path('ambiguous.jsonl');
    const { code, stderr } = await cli('import', 'chat-lines', input, '--person', 'P01', '--sender', 'Ann', '--time-zone', 'Europe/Brussels', '--out', out);
    expect(code).toBe(2);
    expect(stderr).toMatch(/pass --date-order dmy/);
    expect(existsSync(out)).toBe(false);
  });

  it('exits with code 2 when mbox is imported without --address', async () => {
    const { code, stderr } = await cli('import', 'mbox', tmp.write('x.mbox', MBOX), '--person', 'P01', '--time-zone', 'UTC', '--out', tmp.path('x.jsonl'));
    expect(code).toBe(2);
    expect(stderr).toMatch(/--address ADDR/);
  });

  it('imports a diary with --heading and --date-format and rejects a heading with an impossible date', async () => {
    const input = tmp.write('diary.md', '## 3 March 2025\nA good day.\n## 30 February 2025\nNever happened.\n');
    const out = tmp.path('diary.jsonl');
    const { code } = await cli('import', 'diary', input, '--person', 'P02', '--time-zone', 'America/New_York', '--heading', '^## (.+)$', '--date-format', 'd MMMM yyyy', '--out', out);
    expect(code).toBe(0);
    expect(readFileSync(out, 'utf8')).toBe('{"id":"diary.md:1","person":"P02","time":"2025-03-03T12:00:00-05:00","zone":"America/New_York","text":"A good day."}\n');
    expect(readFileSync(`${out}.rejects.csv`, 'utf8')).toMatch(/diary\.md,3,diary_bad_date,/);
  });

  it('splits a diary day into timed entries with --entry-time and --entry-time-format (IANA tz: New York on EST, -05:00, before 9 March 2025)', async () => {
    const input = tmp.write('timed.md', '## 3 March 2025\n[9.05] Coffee.\n[21.40] Bed early.\n');
    const out = tmp.path('timed.jsonl');
    const { code } = await cli('import', 'diary', input, '--person', 'P02', '--time-zone', 'America/New_York', '--heading', '^## (.+)$', '--date-format', 'd MMMM yyyy', '--entry-time', '^\\[(\\d{1,2}\\.\\d{2})\\] ', '--entry-time-format', 'H.mm', '--out', out);
    expect(code).toBe(0);
    expect(readFileSync(out, 'utf8')).toBe(
      '{"id":"timed.md:2","person":"P02","time":"2025-03-03T09:05:00-05:00","zone":"America/New_York","text":"Coffee."}\n' + '{"id":"timed.md:3","person":"P02","time":"2025-03-03T21:40:00-05:00","zone":"America/New_York","text":"Bed early."}\n',
    );
  });

  it('runs a whole study (score, series, validation, dynamics, term audit, report) without any network use', async () => {
    const rows = ['person,time,text'];
    const ratings = ['person,time,mood'];
    for (let d = 1; d <= 9; d++) {
      for (const [p, mood] of [['a', 20 + d * 5], ['b', 70 - d * 3], ['c', 40 + (d % 3) * 10]] as const) {
        rows.push(`${p},2026-03-0${d}T09:00:00+01:00,"a ${mood > 50 ? 'good happy' : 'sad tired'} day with friends, worried a little"`);
        ratings.push(`${p},2026-03-0${d}T20:00:00+01:00,${mood}`);
      }
    }
    mkdirSync(tmp.path('net'), { recursive: true });
    tmp.write('net/texts.csv', rows.join('\n') + '\n');
    tmp.write('net/ratings.csv', ratings.join('\n') + '\n');
    tmp.write('net/study.json', JSON.stringify({ inputs: ['texts.csv'], timeZone: 'Europe/Brussels', lexicons: ['afinn-165', 'vader', 'daily-constructs'], ratings: { path: 'ratings.csv', scales: { mood: [0, 100] }, replicates: 50 }, dynamics: { surrogates: 5, libraries: 5 }, out: 'out' }));
    const { code, stderr } = await cli('run', tmp.path('net/study.json'));
    expect(code, stderr).toBe(0);
    expect(readFileSync(tmp.path('net/out/report.html'), 'utf8')).toContain('<svg');
    expect(attempts).toEqual([]);
  });
});
