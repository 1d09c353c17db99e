import { describe, expect, it } from 'vitest';
import { parseSeriesCsv } from '../../src/dynamics/parse-series-csv.js';

const header = 'person,t,bin_start,bin_end,local_date,day,bin_of_day,bin_hours,hours_since_prev,entries,words,missing,lag_valid,vader.neu,vader.neu.n,vader.neu.person_mean,vader.neu.within,vader.neu.lag1,vader.neu.within_lag1,mood';

describe('parseSeriesCsv', () => {
  it('keeps raw score columns only, indexes bins by t and turns bins absent from the file into missing bins with invalid lags', () => {
    const text = [
      header,
      'A,0,,,,1,1,1,,1,5,,0,0.5,1,,,,,3',
      'A,1,,,,1,2,1,,1,5,,1,0.7,1,,,,,4',
      'A,3,,,,1,4,1,,0,0,no_text,0,,0,,,,,',
      'B,0,,,,1,1,1,,1,5,,0,abc,1,,,,,2',
    ].join('\n');
    const parsed = parseSeriesCsv(text, 'series-long.csv');
    expect(parsed.scores).toEqual(['vader.neu', 'mood']);
    const a = parsed.persons[0]!;
    expect(a.values['vader.neu']).toEqual([0.5, 0.7, undefined, undefined]);
    expect(a.lagValid).toEqual([false, true, false, false]);
    expect(a.missing).toEqual(['', '', 'absent', 'no_text']);
    expect(a.binOfDay).toBeUndefined(); // bin 2 is absent, so no complete bin-of-day track
    expect(parsed.diagnostics).toEqual([
      { code: 'bad_number', message: '`vader.neu` is a value of 3 characters shaped `aaa`, not a number; treated as missing', source: { file: 'series-long.csv', line: 5 }, stage: 'dynamics' },
    ]);
  });

  it('refuses a file without the lag_valid column, saying what is expected', () => {
    expect(() => parseSeriesCsv('person,t,mood\nA,0,1\n', 'x.csv')).toThrow(/Cannot read `x.csv`: no column `lag_valid`; expected a long series file written by `lexichron series`/);
  });
});
