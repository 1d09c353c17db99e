import { describe, expect, it } from 'vitest';
import { parseStudy } from '../../src/study/parse-study.js';

const base = { inputs: [{ path: 'messages.csv' }], timeZone: 'UTC', out: 'out' };

describe('study files carry the time window, epoch units, series bounds and missing-value codes', () => {
  it('accepts time.window, epoch us/ns, series.maxBins/warnSpanDays and ratings.missing', () => {
    const { study, problems } = parseStudy({
      ...base,
      time: { window: '1990-01-01/2030-12-31', epoch: 'ns' },
      series: { bin: '1h', maxBins: 5000, warnSpanDays: 365 },
      ratings: { path: 'ratings.csv', scales: { mood: [0, 100] }, missing: ['NA', '-99'] },
    });
    expect(problems).toEqual([]);
    expect(study?.time).toMatchObject({ window: '1990-01-01/2030-12-31', epoch: 'ns' });
    expect(study?.series).toMatchObject({ maxBins: 5000, warnSpanDays: 365 });
  });

  it('names the JSON path of a wrong value', () => {
    const { problems } = parseStudy({
      ...base,
      time: { window: 1990, epoch: 'minutes' },
      series: { maxBins: 0 },
      ratings: { path: 'ratings.csv', scales: { mood: [0, 100] }, missing: 'NA' },
    });
    expect(problems.map((p) => p.path).sort()).toEqual(['$.ratings.missing', '$.series.maxBins', '$.time.epoch', '$.time.window']);
  });
});

describe('study files switch the optional stages on with true', () => {
  it('reads true as the default settings and false as skipping the stage, and names any other value', () => {
    const on = parseStudy({ ...base, dynamics: true, audit: true, report: true });
    const defaults = parseStudy({ ...base, dynamics: {}, audit: {}, report: {} });
    expect(on.problems).toEqual([]);
    expect([on.study?.dynamics, on.study?.audit, on.study?.report]).toEqual([defaults.study?.dynamics, defaults.study?.audit, defaults.study?.report]);
    expect(on.study?.report).not.toBe(false);
    const off = parseStudy({ ...base, dynamics: false, audit: false, report: false });
    expect([off.study?.dynamics, off.study?.audit, off.study?.report]).toEqual([false, false, false]);
    const wrong = parseStudy({ ...base, report: 'yes' });
    expect(wrong.problems).toEqual([{ path: '$.report', message: 'expected an object of settings, true for the default settings, or false to skip the stage' }]);
  });
});
