import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { buildZoneTable } from '../../src/ingest/zone-table.js';
import { runSeries, type RunSeriesOptions } from '../../src/io/run-series.js';
import { parseBinSpec, parseClockTime } from '../../src/series/bin-spec.js';
import { parseStudy } from '../../src/study/parse-study.js';
import { writeScoresSidecar } from '../support/scores-sidecar.js';
import { tempFolder } from '../support/temp-files.js';

const tmp = tempFolder('lexichron-series-');
const HEADER = 'entry_id,person,time_utc,zone,time_local,words,x.valence,x.valence.n';

/** A scores file with the sidecar `score` writes beside it (the series stage refuses one without). */
function scoresFile(name: string, content: string): string {
  return writeScoresSidecar(tmp.write(name, content), [{ name: 'x.valence', aggregation: 'count' }]);
}

function options(scores: string, out: string): RunSeriesOptions {
  return { scores, out, bin: parseBinSpec('1d'), dayStart: 0, minWords: 1, fill: 'none', maxFill: 1, detrend: false };
}

describe('bad input to the series stage gives clear errors naming the problem and the fix', () => {
  it('refuses a scores file not written by `score` (missing columns), naming the columns and the fix, and leaves no file behind', async () => {
    const scores = scoresFile('not-scores.csv', 'person,time,text\np1,2026-05-01T10:00:00Z,hello\n');
    const outDir = `${tmp.dir}/fail`;
    await expect(runSeries(options(scores, `${outDir}/series.csv`))).rejects.toThrow(/Cannot read `not-scores\.csv` as scores: no column `time_utc`, `zone`, `words`\. The series stage reads the output of `lexichron score`; score the text first\./);
    // Atomic writes: a failing run leaves no file at any final path, and no temporary file.
    expect(readdirSync(outDir)).toEqual([]);
  });

  it('rejects a row with an unknown zone as a diagnostic naming the zone and an example, and bins the rest', async () => {
    const scores = scoresFile(
      'zones.csv',
      `${HEADER}\ne1,p1,2026-05-01T10:00:00.000Z,Europe/Brussels,,5,1,1\ne2,p1,2026-05-01T11:00:00.000Z,Europe/Brusels,,5,2,1\ne3,p1,2026-05-01T12:00:00.000Z,Europe/Brussels,,5,3,1\n`,
    );
    const result = await runSeries(options(scores, `${tmp.dir}/zones-out/series.csv`));
    expect(result.entries).toBe(2);
    expect(result.rejected).toEqual({ unknown_zone: 1 });
    const rejects = readFileSync(result.rejectsPath, 'utf8').trim().split('\n');
    expect(rejects[1]).toBe('zones.csv,3,series,unknown_zone,unknown time zone `Europe/Brusels`; expected an IANA name such as `Europe/Brussels` (fix the zone file and score again)');
  });

  it('rejects a row whose words are not a whole number, saying which field is wrong', async () => {
    const scores = scoresFile('words.csv', `${HEADER}\ne1,p1,2026-05-01T10:00:00.000Z,UTC,,five,1,1\ne2,p1,2026-05-01T10:00:00.000Z,UTC,,5,1,1\n`);
    const result = await runSeries(options(scores, `${tmp.dir}/words-out/series.csv`));
    expect(result.rejected).toEqual({ bad_score_row: 1 });
    expect(readFileSync(result.rejectsPath, 'utf8')).toContain('words (a value of 4 characters shaped `aaaa`) is not a whole number ≥ 0');
  });

  it('refuses a bin that is not a positive duration, listing valid forms', () => {
    for (const bin of ['0h', '-1d', 'daily', '1.5h', '']) {
      expect(() => parseBinSpec(bin), bin).toThrow(/is not a positive duration; write a whole number and a unit: 30m, 1h, 3h, 1d or 1w\./);
    }
    expect(() => parseBinSpec('7m')).toThrow(/does not divide a 24-hour day evenly/);
    expect(() => parseBinSpec('2w')).toThrow(/only 1w/);
  });

  it('refuses a day start out of range, with the expected form', () => {
    for (const t of ['24:00', '04:60', '4', '-1:00']) {
      expect(() => parseClockTime(t), t).toThrow(/--day-start `.*` is not a clock time from 00:00 to 23:59; write HH:MM, e\.g\. 04:00\./);
    }
    expect(parseClockTime('04:00')).toBe(240);
  });

  it('refuses overlapping zone-table periods, naming file, line, person and the fix', () => {
    expect(() =>
      buildZoneTable(
        [
          { person: 'p1', zone: 'Europe/Brussels', from: '2026-04-01', line: 2 },
          { person: 'p1', zone: 'America/New_York', from: '2026-04-01', line: 3 },
        ],
        'zones.csv',
      ),
    ).toThrow('Cannot read `zones.csv` on line 3: person `p1` has two zone periods starting 2026-04-01; periods must not overlap: give each a different `from` date');
  });

  it('refuses an unknown zone in the zone table with an IANA example', () => {
    expect(() => buildZoneTable([{ person: 'p1', zone: 'Europe/Brusels', line: 4 }], 'zones.csv')).toThrow(
      'Cannot read `zones.csv` on line 4: unknown time zone `Europe/Brusels`; expected an IANA name such as `Europe/Brussels` or `America/New_York`',
    );
  });

  it('reports a typo in a study-file key with its JSON path and "did you mean"', () => {
    const { study, problems } = parseStudy({ inputs: ['m.csv'], timeZone: 'UTC', out: 'out', seires: { bin: '1d' } });
    expect(study).toBeUndefined();
    expect(problems).toEqual([{ path: '$.seires', message: 'unknown key `seires`; did you mean `series`?' }]);
    const nested = parseStudy({ inputs: ['m.csv'], timeZone: 'UTC', out: 'out', series: { bin: '1d', dayStrat: '04:00' } });
    expect(nested.problems).toEqual([{ path: '$.series.dayStrat', message: 'unknown key `dayStrat`; did you mean `dayStart`?' }]);
    const wrongType = parseStudy({ inputs: ['m.csv'], timeZone: 'UTC', out: 'out', series: { minWords: '10' } });
    expect(wrongType.problems).toEqual([{ path: '$.series.minWords', message: 'expected a whole number ≥ 0' }]);
  });
});
