import { readFileSync } from 'node:fs';
import Papa from 'papaparse';
import { DuckDBInstance } from '@duckdb/node-api';
import { describe, expect, it } from 'vitest';
import { writeParquet } from '../../src/io/write-parquet.js';
import { runCli } from '../support/run-cli.js';
import { tempFolder } from '../support/temp-files.js';

// Parquet copies read back with the same library (DuckDB's Node bindings) and compared with the
// CSV they were made from, across the 2026 clock changes of Europe/Brussels (29 March) and
// America/New_York (8 March), dates from the IANA tz database.
const tmp = tempFolder('lexichron-parquet-');
const zones = tmp.write('zones.csv', 'person,zone\nann,Europe/Brussels\nbo,America/New_York\n');
const lines = ['person,time,text'];
for (const [p, days] of [['ann', ['2026-03-28', '2026-03-29', '2026-03-30']], ['bo', ['2026-03-07', '2026-03-08', '2026-03-09']]] as const) {
  for (const d of days) {
    lines.push(`${p},${d}T09:30:00,"a calm, happy morning with the bees, glad and relaxed ""today"""`);
    lines.push(`${p},${d}T21:15:00,worried and sad in the evening after a tense day`);
  }
}
const input = tmp.write('diary.csv', `${lines.join('\n')}\n`);

async function readParquet(path: string): Promise<Array<Record<string, unknown>>> {
  const db = await DuckDBInstance.create(':memory:', { autoinstall_known_extensions: 'false' });
  const c = await db.connect();
  // Epoch milliseconds for instants; wall-clock times as text (no zone applied).
  const r = await c.runAndReadAll(`SELECT * REPLACE (epoch_ms(time_utc) AS time_utc, strftime(time_local, '%Y-%m-%dT%H:%M:%S.%g') AS time_local) FROM read_parquet('${path}')`);
  const rows = r.getRowObjectsJS() as Array<Record<string, unknown>>;
  const types = Object.fromEntries(r.columnNames().map((n, i) => [n, r.columnTypes()[i]?.toString()]));
  c.closeSync();
  db.closeSync();
  return rows.map((row) => ({ ...row, __types: types }));
}

describe('Parquet outputs (--parquet)', () => {
  it('reads the column names with papaparse, so a quoted name holding a comma becomes one column (RFC 4180 section 2 rule 6)', async () => {
    const csv = tmp.write('quoted-names.csv', 'entry_id,person,"mine.a,b",words\ne1,p1,1.5,3\n');
    const out = await writeParquet(csv, 'scores');
    const db = await DuckDBInstance.create(':memory:', { autoinstall_known_extensions: 'false' });
    const c = await db.connect();
    const r = await c.runAndReadAll(`SELECT * FROM read_parquet('${out}')`);
    expect(r.columnNames()).toEqual(['entry_id', 'person', 'mine.a,b', 'words']);
    expect(r.getRowObjectsJS().map((row) => ({ ...row, words: Number(row.words) }))).toEqual([{ entry_id: 'e1', person: 'p1', 'mine.a,b': 1.5, words: 3 }]);
    c.closeSync();
    db.closeSync();
  });
  it('score --parquet writes the scores with the UTC instant, the wall-clock time and the zone as separate columns, equal to the CSV', async () => {
    const out = tmp.path('s/scores.csv');
    const r = await runCli('score', input, '--zones', zones, '--out', out, '--parquet', '--workers', '0', '--lexicon', 'afinn-165', '--lexicon', 'vader');
    expect(r.code, r.stderr).toBe(0);
    const csv = Papa.parse<Record<string, string>>(readFileSync(out, 'utf8'), { header: true, skipEmptyLines: true }).data;
    const pq = await readParquet(tmp.path('s/scores.parquet'));
    expect(pq).toHaveLength(csv.length);
    expect(csv.length).toBe(12);
    expect(pq[0]?.__types).toMatchObject({ time_utc: 'BIGINT', zone: 'VARCHAR', words: 'BIGINT', 'vader.compound': 'DOUBLE', 'afinn-165.valence.n': 'BIGINT' });
    for (let i = 0; i < csv.length; i++) {
      const c = csv[i] as Record<string, string>;
      const p = pq[i] as Record<string, unknown>;
      expect(Number(p.time_utc)).toBe(Date.parse(c.time_utc as string));
      expect(p.time_local).toBe((c.time_local as string).slice(0, 23));
      expect(p.zone).toBe(c.zone);
      expect(p.person).toBe(c.person);
      expect(Number(p.words)).toBe(Number(c.words));
      for (const col of ['afinn-165.valence', 'vader.compound', 'vader.pos']) expect(p[col]).toBe(c[col] === '' ? null : Number(c[col]));
    }
    // The clock change shows: the same 09:30 wall-clock time is 08:30Z before and 07:30Z after 29 March in Brussels.
    const ann = csv.filter((c) => c.person === 'ann' && c.time_local?.includes('T09:30'));
    expect(ann.map((c) => c.time_utc)).toEqual(['2026-03-28T08:30:00.000Z', '2026-03-29T07:30:00.000Z', '2026-03-30T07:30:00.000Z']);
  });

  it('series --parquet writes the long series with bin starts as wall-clock times and UTC instants, equal to the CSV', async () => {
    const out = tmp.path('s/series-long.csv');
    const r = await runCli('series', tmp.path('s/scores.csv'), '--bin', '1d', '--out', out, '--parquet');
    expect(r.code, r.stderr).toBe(0);
    const csv = Papa.parse<Record<string, string>>(readFileSync(out, 'utf8'), { header: true, skipEmptyLines: true }).data;
    const db = await DuckDBInstance.create(':memory:', { autoinstall_known_extensions: 'false' });
    const c = await db.connect();
    const rows = (await c.runAndReadAll(`SELECT person, t, strftime(bin_start, '%Y-%m-%dT%H:%M:%S') AS wall, epoch_ms(bin_start_utc) AS instant, CAST(local_date AS VARCHAR) AS local_date, bin_hours, missing, "vader.compound" AS v FROM read_parquet('${tmp.path('s/series-long.parquet')}')`)).getRowObjectsJS();
    c.closeSync();
    db.closeSync();
    expect(rows).toHaveLength(csv.length);
    for (let i = 0; i < csv.length; i++) {
      const x = csv[i] as Record<string, string>;
      const y = rows[i] as Record<string, unknown>;
      expect(y.person).toBe(x.person);
      expect(Number(y.t)).toBe(Number(x.t));
      expect(y.wall).toBe((x.bin_start as string).slice(0, 19));
      expect(Number(y.instant)).toBe(Date.parse(x.bin_start as string));
      expect(y.local_date).toBe(x.local_date);
      expect(y.bin_hours).toBe(Number(x.bin_hours));
      expect(y.missing).toBe(x.missing === '' ? null : x.missing);
      expect(y.v).toBe(x['vader.compound'] === '' ? null : Number(x['vader.compound']));
    }
    // 23-hour day of the spring clock change (IANA tz: Europe/Brussels, 29 March 2026).
    expect(csv.find((x) => x.person === 'ann' && x.local_date === '2026-03-29')?.bin_hours).toBe('23');
  });
});
