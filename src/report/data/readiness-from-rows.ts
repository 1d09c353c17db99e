import { DEFAULT_MIN_LAG_PAIRS, personVariableSummary } from '../../dynamics/person-variable-summary.js';
import type { ReadinessData } from '../report-data.js';
import { groupRowsByPerson } from './group-rows-by-person.js';
import { longestGap } from './longest-gap.js';
import type { SeriesRow } from './series-row.js';

/**
 * Dynamics readiness per person for one score: bins, % missing, longest gap, valid lag pairs,
 * lag-1 autocorrelation (Pearson correlation of valid lag pairs) and MSSD, computed with the
 * dynamics stage's own `personVariableSummary` so the numbers agree with `lexichron dynamics`.
 * A person is ready when the lag pairs reach `minLagPairs` (default 50, common practice).
 */
export function readinessFromRows(rows: readonly SeriesRow[], score: string, minLagPairs = DEFAULT_MIN_LAG_PAIRS): ReadinessData {
  const persons = [...groupRowsByPerson(rows)].map(([person, list]) => {
    const summary = personVariableSummary(
      { values: list.map((r) => (r.missing ? undefined : r.values[score])), lagValid: list.map((r) => r.lagValid) },
      { minLagPairs },
    );
    const gap = longestGap(list.map((r) => ({ missing: r.missing || (r.values[score] === undefined ? 'no_score' : ''), hours: r.binHours })));
    return {
      person,
      bins: summary.bins,
      observed: summary.observed,
      percentMissing: summary.percentMissing,
      longestGapBins: gap.bins,
      longestGapHours: gap.hours,
      lagPairs: summary.lagPairs,
      autocorrelation: summary.autocorrelationPearson,
      mssd: summary.mssd,
      ready: summary.ready,
    };
  });
  return { variable: score, minLagPairs, persons };
}
