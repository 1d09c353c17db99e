import { describe, expect, it } from 'vitest';
import { ratingsReconciliationFrom } from '../../../src/report/data/ratings-reconciliation-from.js';

// Common practice (no published source): every self-report row read is kept or left out with a
// reason, and the counts add up; these cases check that each recorded count lands in its place.

describe('ratingsReconciliationFrom', () => {
  it('splits the rejected codes into whole rows and single ratings, and the further problems into not paired and other', () => {
    const json = {
      reconciliation: { read: 50, kept: 46, rejected: { bad_time: 3, no_zone: 1, rating_out_of_scale: 2, rating_not_numeric: 1 } },
      counts: { ratings: 46, rows: 40, rowsWithText: 35, persons: 4 },
      diagnostics: { bad_time: 3, no_zone: 1, rating_out_of_scale: 2, rating_not_numeric: 1, rating_person_not_in_series: 5, rating_outside_series: 2, bad_series_row: 1 },
    };
    expect(ratingsReconciliationFrom(json, undefined)).toEqual({
      read: 50,
      kept: 46,
      rowsLeftOut: { bad_time: 3, no_zone: 1 },
      valuesLeftOut: { rating_out_of_scale: 2, rating_not_numeric: 1 },
      notPaired: { rating_person_not_in_series: 5, rating_outside_series: 2 },
      other: { bad_series_row: 1 },
      occasions: 40,
      occasionsWithText: 35,
      persons: 4,
      more: [],
    });
  });

  it('reads the run manifest\'s validation stage when validation.json has no reconciliation (an output of an older version)', () => {
    const r = ratingsReconciliationFrom({ counts: { rows: 3, rowsWithText: 3, persons: 1 }, diagnostics: { rating_out_of_scale: 2 } }, { reconciliation: { read: 9, kept: 9, rejected: { rating_out_of_scale: 2 } } });
    expect(r).toMatchObject({ read: 9, kept: 9, rowsLeftOut: {}, valuesLeftOut: { rating_out_of_scale: 2 }, notPaired: {}, other: {} });
  });

  it('keeps counts it has no row for under their own names, so nothing recorded goes unshown', () => {
    const r = ratingsReconciliationFrom({ reconciliation: { read: 10, kept: 10, rejected: {}, missing: { NA: 4, '-99': 1 }, prompts: 12 }, counts: { rows: 8 } }, undefined);
    expect(r?.more).toEqual([
      { name: 'missing', value: { NA: 4, '-99': 1 } },
      { name: 'prompts', value: 12 },
    ]);
  });

  it('counts prompts with no rating at all apart from the problems, since they are kept for the window but never paired', () => {
    const r = ratingsReconciliationFrom({ reconciliation: { read: 10, kept: 10, rejected: {} }, diagnostics: { rating_unanswered: 3, bad_series_row: 1 } }, undefined);
    expect(r).toMatchObject({ unanswered: 3, other: { bad_series_row: 1 }, notPaired: {} });
  });

  it('is undefined when neither output records how the self-reports were read, and ignores values that are not counts', () => {
    expect(ratingsReconciliationFrom(undefined, undefined)).toBeUndefined();
    expect(ratingsReconciliationFrom({ pairs: [] }, { pairs: [] })).toBeUndefined();
    expect(ratingsReconciliationFrom({ reconciliation: { read: -1, kept: 'x', rejected: { bad_time: Number.NaN, no_zone: 2 } } }, undefined)).toMatchObject({ rowsLeftOut: { no_zone: 2 } });
  });
});
