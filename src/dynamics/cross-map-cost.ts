import type { CrossMapSettings } from './person-cross-maps.js';
import type { PersonSeriesInput } from './types.js';

/**
 * Nanoseconds of one thread per work unit of {@link crossMapWork}, measured on the 2-core
 * development machine with one person × 2,016 hourly bins × 3 variables and the defaults
 * (docs/performance.md): 10.2–11.2 s of CPU for 468 million units, 22–24 ns each.
 */
export const CROSS_MAP_NS_PER_UNIT = 24;

/**
 * A rough count of the arithmetic cross mapping will do for each person, for estimates of the run
 * time before it starts: per effect series of n bins, n²·(maxE + 2) for choosing E and the
 * neighbour table, plus n·(E + 1) per cross map made (libraries × causes, and each cause's
 * surrogates at the full and the test libraries), with E taken as maxE when it is chosen.
 */
export function crossMapWork(person: PersonSeriesInput, settings: CrossMapSettings): number {
  const ccm = settings.ccm;
  const maxE = ccm.E ?? ccm.maxE ?? 8;
  const k = maxE + 1;
  const samples = ccm.samples ?? 100;
  const sizes = ccm.librarySizeCount ?? 10;
  const surrogates = ccm.surrogates ?? 99;
  const testLibraries = Math.min(samples, ccm.testLibraries ?? 20);
  const causesOf = new Map<string, Set<string>>();
  for (const [a, b] of settings.pairs) {
    causesOf.set(b, (causesOf.get(b) ?? new Set()).add(a));
    causesOf.set(a, (causesOf.get(a) ?? new Set()).add(b));
  }
  let work = 0;
  for (const [effect, causes] of causesOf) {
    let n = 0;
    for (const v of person.values[effect] ?? []) if (v !== undefined) n++;
    const maps = samples * sizes * causes.size + causes.size * surrogates * (testLibraries + 2);
    work += n * n * (maxE + 2) + n * k * maps;
  }
  return work;
}
