import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runSeries, type RunSeriesOptions } from '../../src/io/run-series.js';
import { parseBinSpec } from '../../src/series/bin-spec.js';
import { parseCsv } from '../support/csv.js';
import { runCli } from '../support/run-cli.js';
import { writeScoresSidecar } from '../support/scores-sidecar.js';
import { tempFolder } from '../support/temp-files.js';

// Issue 21: a scores file without its `.meta.json` was binned with every column treated as a
// `count` score (word-weighted), so a VADER compound silently changed (-0.3902 became -0.3931).

const tmp = tempFolder('lexichron-series-sources-');
const HEADER = 'entry_id,person,time_utc,zone,time_local,words,v.compound';
// Two entries on one day: the entry mean of the compound is (-0.5 + 0.1) / 2 = -0.2; the
// word-weighted mean the old fallback used is (-0.5 * 9 + 0.1 * 1) / 10 = -0.44 (hand arithmetic).
const ROWS = `${HEADER}\ne1,p1,2026-05-01T10:00:00.000Z,UTC,,9,-0.5\ne2,p1,2026-05-01T12:00:00.000Z,UTC,,1,0.1\n`;

function options(scores: string | string[], out: string): RunSeriesOptions {
  return { scores, out, bin: parseBinSpec('1d'), dayStart: 0, minWords: 1, fill: 'none', maxFill: 1, detrend: false };
}

describe('a scores file is read with its sidecar, never without', () => {
  it('refuses a scores file without its .meta.json, saying to keep the sidecar beside it or score again, and writes nothing', async () => {
    const scores = tmp.write('alone.csv', ROWS);
    const outDir = `${tmp.dir}/alone-out`;
    await expect(runSeries(options(scores, `${outDir}/series.csv`))).rejects.toThrow(
      /`alone\.csv` has no sidecar `alone\.csv\.meta\.json`.*Keep the `\.meta\.json` written by `lexichron score` beside the scores file, or score the text again/,
    );
    expect(existsSync(outDir) ? readdirSync(outDir) : []).toEqual([]);
  });

  it('refuses a sidecar that is not the JSON written by `score`, naming it', async () => {
    const scores = tmp.write('broken.csv', ROWS);
    tmp.write('broken.csv.meta.json', '{"columns": 3');
    await expect(runSeries(options(scores, `${tmp.dir}/broken-out/series.csv`))).rejects.toThrow(/`broken\.csv\.meta\.json` is not the sidecar written by `lexichron score`/);
  });

  it('with the sidecar, bins a VADER compound by the entry mean (its aggregation), not as a count', async () => {
    const scores = writeScoresSidecar(tmp.write('with.csv', ROWS), [{ name: 'v.compound', aggregation: 'vader' }]);
    const result = await runSeries(options(scores, `${tmp.dir}/with-out/series.csv`));
    expect(result.columns).toMatchObject([{ name: 'v.compound', aggregation: 'vader', reducer: 'mean' }]);
    const long = readFileSync(result.longPath, 'utf8');
    expect(long).toContain('-0.2');
    expect(long).not.toContain('-0.44');
  });

  it('on the command line, a scores file without its sidecar exits 2 with the way to proceed', async () => {
    const scores = tmp.write('cli-alone.csv', ROWS);
    const { code, stderr } = await runCli('series', scores, '--bin', '1d', '--out', `${tmp.dir}/cli-out/series.csv`);
    expect(code).toBe(2);
    expect(stderr).toMatch(/no sidecar `cli-alone\.csv\.meta\.json`/);
    expect(existsSync(`${tmp.dir}/cli-out/series.csv`)).toBe(false);
  });
});

describe('several scores files are binned into one series', () => {
  const XH = 'entry_id,person,time_utc,zone,time_local,words,x.valence,x.valence.n';
  const X = [{ name: 'x.valence', aggregation: 'count' as const }];
  // Invented: `ana` writes in both exports on 1 May; `ben` only in the first, `cleo` only in the second.
  const first = `${XH}\na1,ana,2026-05-01T08:00:00.000Z,UTC,,5,1,1\na2,ben,2026-05-01T09:00:00.000Z,UTC,,4,2,1\n`;
  const second = `${XH}\nb1,ana,2026-05-01T20:00:00.000Z,UTC,,5,3,1\nb2,cleo,2026-05-02T09:00:00.000Z,UTC,,2,4,1\nb3,cleo,2026-05-02T10:00:00.000Z,UTC,,five,4,1\n`;

  it('combines persons across files, bins one person\'s entries from both files together, and records rows read = binned + rejected per file', async () => {
    const a = writeScoresSidecar(tmp.write('diary-a.csv', first), X);
    const b = writeScoresSidecar(tmp.write('chat-b.csv', second), X);
    const result = await runSeries(options([a, b], `${tmp.dir}/two-out/series.csv`));
    expect(result.persons).toBe(3);
    expect(result.entries).toBe(4);
    expect(result.rejected).toEqual({ bad_score_row: 1 });
    // ana's day: word-weighted mean of 1 (5 words) and 3 (5 words) = 2 (hand arithmetic).
    const ana = parseCsv(readFileSync(result.longPath, 'utf8')).filter((r) => r.person === 'ana');
    expect(ana.map((r) => r['x.valence'])).toEqual(['2']);
    const meta = JSON.parse(readFileSync(`${result.longPath}.meta.json`, 'utf8')) as { sources: Array<{ path: string; rows: number; entries: number; rejected: Record<string, number> }>; scores: Array<{ path: string }> };
    expect(meta.sources.map(({ path, rows, entries, rejected }) => ({ path, rows, entries, rejected }))).toEqual([
      { path: 'diary-a.csv', rows: 2, entries: 2, rejected: {} },
      { path: 'chat-b.csv', rows: 3, entries: 2, rejected: { bad_score_row: 1 } },
    ]);
    for (const s of meta.sources) expect(s.rows).toBe(s.entries + Object.values(s.rejected).reduce((x, n) => x + n, 0));
    expect(meta.scores.map((s) => s.path)).toEqual(['diary-a.csv', 'chat-b.csv']);
    // The rejects file names the file each rejected row came from.
    expect(readFileSync(result.rejectsPath, 'utf8')).toContain('chat-b.csv,4,series,bad_score_row');
  });

  it('refuses files scored with different lexicons, naming both files, and writes nothing', async () => {
    const a = writeScoresSidecar(tmp.write('lex-a.csv', first), X, [{ name: 'x', version: '1' }]);
    const b = writeScoresSidecar(tmp.write('lex-b.csv', second), X, [{ name: 'x', version: '2' }]);
    const outDir = `${tmp.dir}/lex-out`;
    await expect(runSeries(options([a, b], `${outDir}/series.csv`))).rejects.toThrow(/Cannot bin `lex-a\.csv` and `lex-b\.csv` together: the lexicons differ \(x 1 .* against x 2 .*\).*Score every file with the same lexicons/);
    expect(existsSync(outDir)).toBe(false);
  });

  it('refuses files whose score columns differ (name or aggregation), naming both files', async () => {
    const a = writeScoresSidecar(tmp.write('col-a.csv', first), X);
    const b = writeScoresSidecar(tmp.write('col-b.csv', second), [{ name: 'x.valence', aggregation: 'sum' }]);
    await expect(runSeries(options([a, b], `${tmp.dir}/col-out/series.csv`))).rejects.toThrow(/Cannot bin `col-a\.csv` and `col-b\.csv` together: the score columns differ \(x\.valence \(count\) against x\.valence \(sum\)\)/);
  });

  it('refuses a file named twice', async () => {
    const a = writeScoresSidecar(tmp.write('twice.csv', first), X);
    await expect(runSeries(options([a, a], `${tmp.dir}/twice-out/series.csv`))).rejects.toThrow(/`twice\.csv` is named twice; name each scores file once/);
  });

  it('on the command line, `series a.csv b.csv --out` bins both and reports each file\'s rows', async () => {
    const a = writeScoresSidecar(tmp.write('cli-a.csv', first), X);
    const b = writeScoresSidecar(tmp.write('cli-b.csv', second), X);
    const { code, stderr } = await runCli('series', a, b, '--bin', '1d', '--out', `${tmp.dir}/cli-two/series.csv`);
    expect(code).toBe(0);
    expect(stderr).toContain('cli-b.csv: 3 rows read, 2 binned, 1 rejected');
    expect(stderr).toMatch(/^3 persons/m);
  });
});
