// Issue 18, item 5: rejects files, stderr and reports give positions, codes and counts, never a
// participant's text, and every message has a bounded length.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readChatTable } from '../../src/ingest/import/read-chat-table.js';
import { readDiary, compileDiaryHeading } from '../../src/ingest/import/read-diary.js';
import { parseMailDate } from '../../src/ingest/import/parse-mail-date.js';
import { parseInstant, DEFAULT_TIME_OPTIONS } from '../../src/ingest/parse-instant.js';
import { readEntries } from '../../src/ingest/read-entries.js';
import { buildZoneTable } from '../../src/ingest/zone-table.js';
import { readRecords } from '../../src/ingest/read-records.js';
import { describeValue } from '../../src/privacy/describe-value.js';
import { diagnosticText } from '../../src/privacy/diagnostic-text.js';
import { ratingValues } from '../../src/validate/rating-values.js';
import { parseSeriesCsv } from '../../src/dynamics/parse-series-csv.js';
import { runCli } from '../support/run-cli.js';
import { collect, tempFolder } from '../support/temp-files.js';
import { tableFile } from '../../src/io/table-file.js';

const tmp = tempFolder();
const SECRET = 'SECRET words about my brother';
const zones = buildZoneTable([], 'zones', 'Europe/Brussels');

async function thrown(run: () => Promise<unknown>): Promise<string> {
  try {
    await run();
  } catch (error) {
    return (error as Error).message;
  }
  throw new Error('expected an error');
}

describe('diagnostics describe values by position, length and shape, never by content', () => {
  it('describeValue gives the length and shape of a value: digits 9, letters a/A, punctuation as is', () => {
    expect(describeValue('2026-13-01 25:00')).toBe('a value of 16 characters shaped `9999-99-99 99:99`');
    expect(describeValue('Déjà vu!')).toBe('a value of 8 characters shaped `Aaaa aa!`');
    expect(describeValue('Europe/Brusels', /^[A-Za-z_]+(?:\/[A-Za-z_]+)*$/)).toBe('`Europe/Brusels`');
  });
  it('diagnosticText removes line breaks and control characters and caps a message at 500 characters', () => {
    expect(diagnosticText('a\nb\r\u0000c')).toBe('a b  c');
    const long = diagnosticText('x'.repeat(5_000_000));
    expect(long.length).toBeLessThan(540);
    expect(long).toMatch(/… \(4999500 more characters\)$/);
  });
  it('does not echo an unreadable time (parseInstant)', () => {
    const result = parseInstant(SECRET, 'Europe/Brussels', DEFAULT_TIME_OPTIONS);
    expect(result.ok).toBe(false);
    expect(JSON.stringify(result)).not.toMatch(/SECRET|brother/);
    const formatted = parseInstant(SECRET, 'Europe/Brussels', { ...DEFAULT_TIME_OPTIONS, format: 'dd.MM.yyyy' });
    expect(JSON.stringify(formatted)).not.toMatch(/SECRET|brother/);
  });
  it('does not echo an unreadable Date header (parseMailDate)', () => {
    expect(JSON.stringify(parseMailDate(SECRET))).not.toMatch(/SECRET|brother/);
  });
  it('does not echo an invalid JSON line nor a JSON array that does not parse (readRecords)', async () => {
    const path = tmp.write('bad.jsonl', `{"person":"p1","time":"2026-03-01T10:00:00Z","text":"ok"}\n${SECRET} {\n{"text": "${SECRET}\n`);
    const items = await collect(readRecords(tableFile(path)));
    expect(items.filter((i) => i.kind === 'reject').map((i) => i.kind === 'reject' && i.diagnostic.code)).toEqual(['bad_json', 'bad_json']);
    expect(JSON.stringify(items.filter((i) => i.kind === 'reject'))).not.toMatch(/SECRET|brother/);
    const array = tmp.write('bad.json', `[{"text": "${SECRET}" "x"}]`);
    expect(await thrown(() => collect(readRecords(tableFile(array))))).not.toMatch(/SECRET|brother/);
  });
  it('does not list the first row of a CSV without a header row, and says to add one', async () => {
    const path = tmp.write('headerless.csv', `p1,2026-03-01T10:00:00Z,${SECRET}\np1,2026-03-01T11:00:00Z,more\n`);
    const message = await thrown(() => collect(readEntries(tableFile(path), { zones })));
    expect(message).not.toMatch(/SECRET|brother/);
    expect(message).toMatch(/header row/);
  });
  it('lists the columns of an ordinary header, at most 30 of 200,000', async () => {
    const named = tmp.write('named.csv', 'participant,sent_at,body\np1,2026-03-01T10:00:00Z,hi\n');
    expect(await thrown(() => collect(readEntries(tableFile(named), { zones })))).toMatch(/`participant`, `sent_at`, `body`/);
    const wide = tmp.write('wide.csv', `${Array.from({ length: 200_000 }, (_, i) => `c${i}`).join(',')}\n`);
    const message = await thrown(() => collect(readEntries(tableFile(wide), { zones })));
    expect(message.length).toBeLessThan(2000);
    expect(message).toMatch(/and 199970 more/);
  }, 60_000);
  it('does not echo a zone or a rating that is text (readEntries, ratingValues)', async () => {
    const path = tmp.write('zone.csv', `person,time,text,zone\np1,2026-03-01T10:00:00Z,hi,${SECRET}\n`);
    const items = await collect(readEntries(tableFile(path), { zones, columns: 'person=person,time=time,text=text,zone=zone' }));
    expect(items[0]?.kind === 'reject' && items[0].diagnostic.code).toBe('unknown_zone');
    expect(JSON.stringify(items)).not.toMatch(/SECRET|brother/);
    const rated = ratingValues({ mood: SECRET }, ['mood'], new Map(), { file: 'r.csv', line: 2 });
    expect(rated.diagnostics[0]?.code).toBe('rating_not_numeric');
    expect(JSON.stringify(rated)).not.toMatch(/SECRET|brother/);
  });
  it('does not echo a diary heading or entry time that cannot be read (readDiary)', async () => {
    const lines = [`== ${SECRET} ==`, 'text', '== 2026-03-01 ==', `${SECRET} - walked`].map((text, i) => ({ line: i + 1, text }));
    const items = await collect(readDiary(lines, { file: 'd.md', person: 'P1', zone: 'UTC', heading: compileDiaryHeading('^== (.+) ==$'), dateFormat: 'yyyy-MM-dd', entryTime: /^(.+) - /u, dst: { gap: 'reject', overlap: 'reject' } }));
    expect(items.filter((i) => i.kind === 'reject').map((i) => i.kind === 'reject' && i.diagnostic.code)).toEqual(['diary_bad_date', 'diary_bad_time']);
    expect(JSON.stringify(items.filter((i) => i.kind === 'reject'))).not.toMatch(/SECRET|brother/);
  });
  it('does not echo a chat table\'s unreadable time (readChatTable)', async () => {
    const path = tmp.write('chat.csv', `sender,time,text\nAnn,${SECRET},hello\n`);
    const items = await collect(readChatTable(readRecords(tableFile(path)), { file: 'chat.csv', person: 'P1', zone: 'UTC', senders: ['Ann'], time: DEFAULT_TIME_OPTIONS }));
    expect(items[0]?.kind).toBe('reject');
    expect(JSON.stringify(items)).not.toMatch(/SECRET|brother/);
  });
  it('does not echo a series value that is not a number (parseSeriesCsv)', () => {
    const parsed = parseSeriesCsv(`person,t,lag_valid,mood\np1,${SECRET},1,0.5\np1,1,1,${SECRET}\n`);
    expect(parsed.diagnostics.map((d) => d.code)).toEqual(['bad_bin_index', 'bad_number']);
    expect(JSON.stringify(parsed.diagnostics)).not.toMatch(/SECRET|brother/);
  });
});

describe('rejects files and stderr hold no participant text (CLI)', () => {
  it('score writes no text of a bad JSON line or a bad time into scores.rejects.csv or stderr', async () => {
    tmp.write('in.jsonl', [`{"person":"p1","time":"2026-03-01T10:00:00Z","text":"a good day"}`, `not json ${SECRET}`, `{"person":"p1","time":"${SECRET}","text":"x"}`, ''].join('\n'));
    const { code, stderr } = await runCli('score', tmp.path('in.jsonl'), '--time-zone', 'UTC', '-l', 'afinn-165', '-o', tmp.path('out.csv'), '--max-rejects', 'none');
    expect(code).toBe(0);
    const rejects = readFileSync(tmp.path('out.rejects.csv'), 'utf8');
    expect(rejects).toMatch(/bad_json/);
    expect(rejects + stderr).not.toMatch(/SECRET|brother/);
  });
  it('caps a lexicon problem about a 5 MB line', async () => {
    const head = ['## lexichron lexicon 1', '## name\tmine', '## version\t1', '## license\tCC0-1.0', '## source\tmine', '## language\ten', '## category\tworry\tcount', 'term\tcategory\tweight'];
    tmp.write('big.lex.tsv', [...head, `worry\tworry\t${'9x'.repeat(2_500_000)}`, ''].join('\n'));
    tmp.write('in.csv', 'person,time,text\np1,2026-03-01T10:00:00Z,hi\n');
    const { code, stderr } = await runCli('score', tmp.path('in.csv'), '--time-zone', 'UTC', '-l', tmp.path('big.lex.tsv'), '-o', tmp.path('big.csv'));
    expect(code).toBe(2);
    expect(stderr).toMatch(/weight/);
    expect(stderr.length).toBeLessThan(9000);
  });
});
