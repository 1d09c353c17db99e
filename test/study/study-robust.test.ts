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
