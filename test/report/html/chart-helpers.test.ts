import { describe, expect, it } from 'vitest';
import { offsetMinutes } from '../../../src/report/data/offset-minutes.js';
import { wallClock } from '../../../src/report/data/wall-clock.js';
import { escapeHtml } from '../../../src/report/html/escape-html.js';
import { formatValue, groupThousands } from '../../../src/report/html/format-value.js';
import { linePath } from '../../../src/report/html/line-path.js';
import { niceTicks } from '../../../src/report/html/nice-ticks.js';
import { wordClasses, wordColour } from '../../../src/report/html/word-classes.js';

describe('niceTicks', () => {
  it('uses steps of 1, 2 or 5 × 10^k (Heckbert 1990, "Nice numbers for graph labels")', () => {
    expect(niceTicks(0, 97, 5)).toEqual({ ticks: [0, 20, 40, 60, 80, 100], domain: [0, 100] });
    expect(niceTicks(-0.83, 0.47, 5)).toEqual({ ticks: [-1, -0.5, 0, 0.5], domain: [-1, 0.5] });
    expect(niceTicks(1, 7, 5).ticks).toEqual([0, 2, 4, 6, 8]);
  });

  it('widens a zero-width range so a constant series still has an axis', () => {
    expect(niceTicks(3, 3, 4).domain[0]).toBeLessThan(3);
    expect(niceTicks(3, 3, 4).domain[1]).toBeGreaterThan(3);
  });
});

describe('wordClasses', () => {
  it('splits at the 20/40/60/80% quantiles, type 7 (R quantile(1:10, c(.2,.4,.6,.8)) = 2.8, 4.6, 6.4, 8.2; from memory of R\'s default)', () => {
    const classes = wordClasses([1, 2, 3, 4, 5, 6, 7, 8, 9, 10]);
    expect(classes.bounds).toEqual([3, 5, 6, 8]);
    expect(wordColour(3, classes)).toBe(classes.colours[0]);
    expect(wordColour(9, classes)).toBe(classes.colours[4]);
  });

  it('keeps bounds strictly increasing when many days share a count', () => {
    expect(wordClasses([5, 5, 5, 5, 5]).bounds).toEqual([5, 6, 7, 8]);
  });
});

describe('text helpers', () => {
  it('escapes the five HTML special characters', () => {
    expect(escapeHtml(`<a href="x">'&'</a>`)).toBe('&lt;a href=&quot;x&quot;&gt;&#39;&amp;&#39;&lt;/a&gt;');
  });

  it('formats numbers with a true minus sign and groups thousands without a locale', () => {
    expect(formatValue(-0.456)).toBe('−0.46');
    expect(formatValue(-0.001)).toBe('0.00');
    expect(formatValue(undefined)).toBe('–');
    expect(groupThousands(1234567)).toBe('1,234,567');
  });

  it('reads wall-clock time and UTC offset of RFC 3339 local times (RFC 3339 §5.6)', () => {
    expect(wallClock('2026-03-29T04:00:00+02:00')).toBe(Date.UTC(2026, 2, 29, 4));
    expect(offsetMinutes('2026-03-29T04:00:00+02:00')).toBe(120);
    expect(offsetMinutes('2026-11-01T01:30:00-05:00')).toBe(-300);
    expect(offsetMinutes('2026-03-29T04:00:00Z')).toBe(0);
    expect(offsetMinutes('2026-03-29')).toBeUndefined();
  });

  it('lifts the pen at missing values so lines never bridge a gap', () => {
    expect(linePath([{ x: 0, y: 1 }, { x: 1, y: 2 }, { x: 2, y: undefined }, { x: 3, y: 4 }])).toBe('M0 1L1 2M3 4');
  });
});
