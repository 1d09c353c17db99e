import { existsSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runSeries, type RunSeriesOptions } from '../../src/io/run-series.js';
import { parseBinSpec } from '../../src/series/bin-spec.js';
import { runCli } from '../support/run-cli.js';
import { writeScoresSidecar } from '../support/scores-sidecar.js';
import { tempFolder } from '../support/temp-files.js';

// Before issue 19: one stray timestamp decades from the rest made a series of tens of thousands
// of bins per person (36,555 daily bins; gigabytes with hourly bins) with no warning or limit.

const tmp = tempFolder('lexichron-bounds-');
const HEADER = 'entry_id,person,time_utc,zone,time_local,words,x.valence,x.valence.n';

/** A scores file with the sidecar `score` writes beside it (the series stage refuses one without). */
function scoresFile(name: string, content: string): string {
  return writeScoresSidecar(tmp.write(name, content), [{ name: 'x.valence', aggregation: 'count' }]);
}

function options(scores: string, out: string, over: Partial<RunSeriesOptions> = {}): RunSeriesOptions {
  return { scores, out, bin: parseBinSpec('1h'), dayStart: 0, minWords: 1, fill: 'none', maxFill: 1, detrend: false, ...over };
}

const STRAY = `${HEADER}\ne1,p1,2026-05-01T10:00:00.000Z,UTC,,5,1,1\nstray,p1,2020-01-01T10:00:00.000Z,UTC,,5,1,1\ne3,p1,2026-05-02T10:00:00.000Z,UTC,,5,1,1\ne4,p2,2026-05-01T10:00:00.000Z,UTC,,5,1,1\n`;

describe('series are bounded', () => {
  it('stops with an error naming the person and the entries at the ends when a series needs more bins than --max-bins', async () => {
    const scores = scoresFile('stray.csv', STRAY);
    const dir = `${tmp.dir}/stray-out`;
    const run = runSeries(options(scores, `${dir}/series.csv`, { maxBins: 10_000 }));
    await expect(run).rejects.toThrow(/person `p1`.*more than --max-bins 10000.*`stray` \(2020-01-01, line 3 of stray\.csv\) and `e3` \(2026-05-02, line 4/);
    expect(readdirSync(dir)).toEqual([]);
  });

  it('leaves earlier outputs as they were when a run fails (nothing is renamed into place before the whole series is built)', async () => {
    const dir = `${tmp.dir}/keep-out`;
    mkdirSync(dir, { recursive: true });
    const names = ['series.csv', 'series.wide.csv', 'series.events.csv', 'series.rejects.csv', 'series.csv.meta.json', 'datapackage.json'];
    for (const name of names) writeFileSync(`${dir}/${name}`, 'earlier run\n');
    const scores = scoresFile('stray2.csv', STRAY);
    await expect(runSeries(options(scores, `${dir}/series.csv`, { maxBins: 10_000, dataPackage: { path: `${dir}/datapackage.json`, name: 'n', title: 't' } }))).rejects.toThrow(/--max-bins/);
    for (const name of names) expect(readFileSync(`${dir}/${name}`, 'utf8'), name).toBe('earlier run\n');
    expect(readdirSync(dir).sort()).toEqual([...names].sort());
  });

  it('warns about a person whose entries span more than --warn-span-days, naming the entries at the ends', async () => {
    const scores = scoresFile('span.csv', STRAY);
    const result = await runSeries(options(scores, `${tmp.dir}/span-out/series.csv`, { bin: parseBinSpec('1d'), warnSpanDays: 365 }));
    expect(result.warnings).toHaveLength(1);
    expect(result.warnings[0]).toMatch(/person `p1`: the entries span 2314 days.*`stray`.*`e3`/);
    expect(existsSync(`${tmp.dir}/span-out/series.csv`)).toBe(true);
  });

  it('the series command exits 3 on a series over --max-bins and writes no series file or data package', async () => {
    const scores = scoresFile('cli-stray.csv', STRAY);
    const out = `${tmp.dir}/cli-out/series.csv`;
    const { code, stderr } = await runCli('series', scores, '--bin', '1h', '--max-bins', '5000', '-o', out);
    expect(code).toBe(3);
    expect(stderr).toMatch(/person `p1`/);
    expect(existsSync(out)).toBe(false);
    expect(existsSync(`${tmp.dir}/cli-out/datapackage.json`)).toBe(false);
  });

  it('rejects a scores row whose time_utc lies at the edge of ECMA-262\'s range as bad_score_row instead of crashing', async () => {
    const scores = scoresFile('edge.csv', `${HEADER}\ne1,p1,2026-05-01T10:00:00.000Z,Europe/Brussels,,5,1,1\ne2,p1,+275760-09-13T00:00:00.000Z,Europe/Brussels,,5,1,1\n`);
    const result = await runSeries(options(scores, `${tmp.dir}/edge-out/series.csv`, { bin: parseBinSpec('1d') }));
    expect(result.rejected).toEqual({ bad_score_row: 1 });
    expect(result.entries).toBe(1);
  });
});
