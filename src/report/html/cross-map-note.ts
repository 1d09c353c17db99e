import type { DynamicsData } from '../report-data.js';

/**
 * How to read the cross-mapping verdicts, with the count of directions that passed against those
 * tested (from the `dynamics-ccm.csv` table), or undefined when cross mapping did not run.
 */
export function crossMapNote(dynamics: DynamicsData): string | undefined {
  const table = dynamics.tables.find((t) => /(^|\/)dynamics-ccm\.csv$/.test(t.title));
  const column = table?.columns.indexOf('verdict') ?? -1;
  if (!table || column < 0) return undefined;
  const count = (verdict: string) => table.rows.filter((r) => r[column] === verdict).length;
  const tested = table.rows.filter((r) => r[column] !== '').length;
  const shown = table.omitted ? ` (of the ${table.rows.length} rows shown)` : '';
  return (
    `<p class="note">Cross mapping${shown}: ${count('drives')} of ${tested} tested directions show evidence that the cause drives the effect (<code>verdict = drives</code>: the skill grows with the library more than for surrogates of the cause that keep its autocorrelation, and beats them and its calendar rhythm); ` +
    `${count('same_bin')} more peak at lag 0 or later in the lag scan (<code>same_bin</code>: a common driver within the bin explains them as well). About 5% of directions pass by chance: compare the count with that, and treat single directions as exploratory.</p>`
  );
}
