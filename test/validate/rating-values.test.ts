import { describe, expect, it } from 'vitest';
import { ratingColumns } from '../../src/validate/rating-columns.js';
import { parseRatingScales } from '../../src/validate/rating-scale.js';
import { ratingValues } from '../../src/validate/rating-values.js';

const source = { file: 'reports.csv', line: 7 };

describe('parseRatingScales', () => {
  it('reads NAME=MIN:MAX pairs', () => {
    expect([...parseRatingScales('mood=0:100,calm=1:7')]).toEqual([['mood', { min: 0, max: 100 }], ['calm', { min: 1, max: 7 }]]);
  });
  it('rejects a malformed scale with an example of the right form', () => {
    expect(() => parseRatingScales('mood=0-100')).toThrow(/NAME=MIN:MAX; for example --scale mood=0:100/);
    expect(() => parseRatingScales('mood=7:1')).toThrow(/minimum 7 must be below the maximum 1/);
  });
});

describe('ratingValues', () => {
  const scales = parseRatingScales('mood=0:100,calm=1:7');
  it('keeps in-scale values, leaves empty ones missing without a diagnostic', () => {
    const { values, diagnostics } = ratingValues({ mood: '55.5', calm: '' }, ['mood', 'calm'], scales, source);
    expect(values).toEqual({ mood: 55.5, calm: undefined });
    expect(diagnostics).toEqual([]);
  });
  it('rejects out-of-scale and non-numeric values with a reason and the row’s source', () => {
    const { values, diagnostics } = ratingValues({ mood: '101', calm: 'very' }, ['mood', 'calm'], scales, source);
    expect(values).toEqual({ mood: undefined, calm: undefined });
    expect(diagnostics.map((d) => d.code)).toEqual(['rating_out_of_scale', 'rating_not_numeric']);
    expect(diagnostics[0]?.message).toBe('rating `mood` is 101, outside its declared scale 0 to 100; the value is left out');
    expect(diagnostics[0]?.source).toEqual(source);
  });
});

describe('ratingColumns', () => {
  const scales = parseRatingScales('mood=0:100,calm=1:7');
  it('takes every column but person, time, zone and id', () => {
    expect(ratingColumns(['person', 'time', 'mood', 'calm'], ['person', 'time', 'zone', 'id'], undefined, scales, 'r.csv')).toEqual(['mood', 'calm']);
  });
  it('asks for a scale for every rating', () => {
    expect(() => ratingColumns(['person', 'time', 'mood', 'energy'], ['person', 'time'], undefined, scales, 'r.csv')).toThrow(/No scale declared for rating `energy`; declare each with --scale/);
  });
  it('names a --rating column the file lacks', () => {
    expect(() => ratingColumns(['person', 'time', 'mood'], ['person', 'time'], ['calm'], scales, 'r.csv')).toThrow(/no rating column `calm`/);
  });
});
