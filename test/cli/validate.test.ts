import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { main } from '../../src/cli/main.js';

let dir: string;
beforeAll(async () => {
  dir = await mkdtemp(path.join(tmpdir(), 'lexichron-validate-cli-'));
  await writeFile(path.join(dir, 'series.csv'), 'person,t,bin_start,bin_end,local_date,day,bin_of_day,bin_hours,hours_since_prev,entries,words,missing,lag_valid,s\np1,0,2026-03-01T00:00:00+00:00,2026-03-02T00:00:00+00:00,2026-03-01,1,1,24,,1,10,,0,0.5\n');
  await writeFile(path.join(dir, 'reports.csv'), 'person,time,mood\np1,2026-03-01T12:00:00Z,50\n');
  await writeFile(path.join(dir, 'offsets.csv'), 'person,time,mood\np1,2026-03-01T13:00:00+01:00,50\np1,2026-03-01T08:00:00-05:00,60\n');
  await writeFile(path.join(dir, 'wall.csv'), 'person,time,mood\np1,2026-03-01 12:00,50\n');
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

describe('lexichron validate', () => {
  it('is registered and exits with 2 when no scale is declared', async () => {
    const stderr = vi.spyOn(process.stderr, 'write').mockImplementation(() => true);
    const code = await main(['node', 'lexichron', 'validate', path.join(dir, 'series.csv'), '--ratings', path.join(dir, 'reports.csv'), '--out', path.join(dir, 'out')]);
    const written = stderr.mock.calls.map((c) => String(c[0])).join('');
    stderr.mockRestore();
    expect(code).toBe(2);
    expect(written).toMatch(/Declare the scale of each rating with --scale/);
  });
  it('runs on a single occasion and says in words why nothing can be estimated', async () => {
    const stderr = vi.spyOn(process.stderr, 'write').mockImplementation(() => true);
    const code = await main(['node', 'lexichron', 'validate', path.join(dir, 'series.csv'), '--ratings', path.join(dir, 'reports.csv'), '--scale', 'mood=0:100', '--time-zone', 'UTC', '--replicates', '0', '--out', path.join(dir, 'out')]);
    const written = stderr.mock.calls.map((c) => String(c[0])).join('');
    stderr.mockRestore();
    expect(code).toBe(0);
    expect(written).toMatch(/The within-person association could not be estimated: no person has two or more complete pairs/);
  });
  it('needs no zone option when every self-report time carries an offset (RFC 3339 section 5.6)', async () => {
    const stderr = vi.spyOn(process.stderr, 'write').mockImplementation(() => true);
    const code = await main(['node', 'lexichron', 'validate', path.join(dir, 'series.csv'), '--ratings', path.join(dir, 'offsets.csv'), '--scale', 'mood=0:100', '--replicates', '0', '--out', path.join(dir, 'out-offsets')]);
    const written = stderr.mock.calls.map((c) => String(c[0])).join('');
    stderr.mockRestore();
    expect(written).not.toMatch(/has no time zone/);
    expect(code).toBe(0);
  });
  it('says why when no self-report is usable (wall-clock times, no time zone given)', async () => {
    const stderr = vi.spyOn(process.stderr, 'write').mockImplementation(() => true);
    const code = await main(['node', 'lexichron', 'validate', path.join(dir, 'series.csv'), '--ratings', path.join(dir, 'wall.csv'), '--scale', 'mood=0:100', '--out', path.join(dir, 'out')]);
    const written = stderr.mock.calls.map((c) => String(c[0])).join('');
    stderr.mockRestore();
    expect(code).toBe(3);
    expect(written).toMatch(/holds no usable self-reports. The first problem, on line 2: person `p1` has no time zone; list them in --zones or pass --time-zone/);
  });
  it('rejects an unknown --random-slopes choice and names the accepted ones', async () => {
    const stderr = vi.spyOn(process.stderr, 'write').mockImplementation(() => true);
    const code = await main(['node', 'lexichron', 'validate', path.join(dir, 'series.csv'), '--ratings', path.join(dir, 'reports.csv'), '--scale', 'mood=0:100', '--time-zone', 'UTC', '--random-slopes', 'maybe', '--out', path.join(dir, 'out')]);
    const written = stderr.mock.calls.map((c) => String(c[0])).join('');
    stderr.mockRestore();
    expect(code).toBe(2);
    expect(written).toMatch(/auto, always, never/);
  });
  it('rejects a malformed --window with the accepted forms', async () => {
    const stderr = vi.spyOn(process.stderr, 'write').mockImplementation(() => true);
    const code = await main(['node', 'lexichron', 'validate', '--align', 'window', '--window', 'soon', '--ratings', path.join(dir, 'reports.csv'), '--scale', 'mood=0:100', '--out', path.join(dir, 'out')]);
    const written = stderr.mock.calls.map((c) => String(c[0])).join('');
    stderr.mockRestore();
    expect(code).toBe(2);
    expect(written).toMatch(/--window `soon` is not a positive duration; write e.g. 90m, 3h or 1d/);
  });
});
