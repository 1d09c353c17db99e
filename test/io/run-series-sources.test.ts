import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runSeries, type RunSeriesOptions } from '../../src/io/run-series.js';
import { parseBinSpec } from '../../src/series/bin-spec.js';
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
