import { describe, expect, it } from 'vitest';
import { validationFromJson } from '../../../src/report/data/validation-from-json.js';
import { RELIABILITY_AXIS_TITLE, reliabilityChart } from '../../../src/report/html/reliability-chart.js';

describe('reliabilityChart', () => {
  const curve = { score: 'joy', points: [{ words: 20, reliability: 0.3, low: 0.1, high: 0.45 }, { words: 80, reliability: 0.6, low: 0.5, high: 0.7 }], target: 0.7, recommendedMinWords: 150 };
  const svg = reliabilityChart(curve);
  it('writes an axis title short enough to fit the plot height when rotated (238 px at about 7 px a character, 12 px bold; common practice)', () => {
    expect(svg).toContain(RELIABILITY_AXIS_TITLE);
    expect(RELIABILITY_AXIS_TITLE.length * 7).toBeLessThan(238);
    const titles = [...svg.matchAll(/class="axis-title"[^>]*>([^<]*)</g)].map((m) => m[1] as string);
    for (const t of titles) expect(t.length * 7).toBeLessThan(238);
  });
  it('draws the interval of the estimates as a band', () => {
    expect(svg).toMatch(/class="mark band"/);
  });
  it('never draws a negative reliability read from an older validation.json', () => {
    const data = validationFromJson({ reliability: [{ column: 'joy', target: 0.7, bands: [{ low: 0, medianWords: 10, reliability: -1.127 }, { low: 25, medianWords: 40, reliability: 0.5, reliabilityLow: 0.3, reliabilityHigh: 0.6 }] }] });
    expect(data.reliability[0]?.points).toEqual([{ words: 40, reliability: 0.5, low: 0.3, high: 0.6 }]);
  });
});
