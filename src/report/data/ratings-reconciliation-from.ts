import type { RatingsReconciliation } from '../report-data.js';

type Json = Record<string, unknown>;
const isObject = (v: unknown): v is Json => typeof v === 'object' && v !== null && !Array.isArray(v);
const count = (v: unknown): number | undefined => (typeof v === 'number' && Number.isFinite(v) && v >= 0 ? v : undefined);

/** Codes of a single rating left out while its row is kept (src/validate/rating-values.ts). */
const VALUE_CODES = new Set(['rating_not_numeric', 'rating_out_of_scale']);
/** Codes of a self-report that found no text to pair with (src/validate/align-ratings-to-bins.ts, validate-series.ts). */
const NOT_PAIRED_CODES = new Set(['rating_person_not_in_series', 'rating_outside_series']);
/** Code of a prompt whose every rating is missing: kept for the study window, never paired (src/validate/). */
const UNANSWERED_CODE = 'rating_unanswered';
/** Fields of the reconciliation and the counts that have their own rows. */
const KNOWN_RECONCILIATION = new Set(['read', 'kept', 'rejected']);
const KNOWN_COUNTS = new Set(['ratings', 'rows', 'rowsWithText', 'persons']);

/** `{code: n}` with only non-negative finite counts; undefined when `v` is not such a map. */
function codeCounts(v: unknown): Record<string, number> | undefined {
  if (!isObject(v)) return undefined;
  const out: Record<string, number> = {};
  for (const [k, n] of Object.entries(v)) {
    const c = count(n);
    if (c !== undefined) out[k] = c;
  }
  return out;
}

/**
 * The ratings reconciliation of a validate stage, from what its outputs record: the reconciliation
 * (`{read, kept, rejected: {code: n}}`, in validation.json, or in the run manifest's
 * `stages.validation`), the counts of aligned occasions, and the stage's problems by code
 * (validation.json `diagnostics`). Rejected codes of single ratings go to `valuesLeftOut`, the
 * others to `rowsLeftOut`; problems beyond the rejected ones are self-reports not paired or other
 * problems. Any further count recorded goes to `more` under its own name. Undefined when neither
 * input holds a reconciliation or counts. Pure.
 */
export function ratingsReconciliationFrom(validationJson: unknown, manifestStage: unknown): RatingsReconciliation | undefined {
  const json = isObject(validationJson) ? validationJson : {};
  const stage = isObject(manifestStage) ? manifestStage : {};
  const rec = isObject(json.reconciliation) ? json.reconciliation : isObject(stage.reconciliation) ? stage.reconciliation : undefined;
  const counts = isObject(json.counts) ? json.counts : isObject(stage.counts) ? stage.counts : undefined;
  if (!rec && !counts) return undefined;
  const out: RatingsReconciliation = { rowsLeftOut: {}, valuesLeftOut: {}, notPaired: {}, other: {}, more: [] };
  const read = count(rec?.read);
  const kept = count(rec?.kept);
  if (read !== undefined) out.read = read;
  if (kept !== undefined) out.kept = kept;
  const rejected = codeCounts(rec?.rejected) ?? {};
  for (const [code, n] of Object.entries(rejected)) (VALUE_CODES.has(code) ? out.valuesLeftOut : out.rowsLeftOut)[code] = n;
  for (const [code, n] of Object.entries(codeCounts(json.diagnostics) ?? {})) {
    const beyond = n - (rejected[code] ?? 0);
    if (beyond <= 0) continue;
    if (code === UNANSWERED_CODE) out.unanswered = beyond;
    else if (NOT_PAIRED_CODES.has(code)) out.notPaired[code] = beyond;
    else if (VALUE_CODES.has(code)) out.valuesLeftOut[code] = (out.valuesLeftOut[code] ?? 0) + beyond;
    else out.other[code] = beyond;
  }
  const occasions = count(counts?.rows);
  const withText = count(counts?.rowsWithText);
  const persons = count(counts?.persons);
  if (occasions !== undefined) out.occasions = occasions;
  if (withText !== undefined) out.occasionsWithText = withText;
  if (persons !== undefined) out.persons = persons;
  const further = (from: Json | undefined, known: Set<string>): void => {
    for (const [name, v] of Object.entries(from ?? {})) {
      if (known.has(name)) continue;
      const n = count(v);
      const byCode = codeCounts(v);
      if (n !== undefined) out.more.push({ name, value: n });
      else if (byCode && Object.keys(byCode).length > 0) out.more.push({ name, value: byCode });
    }
  };
  further(rec, KNOWN_RECONCILIATION);
  further(counts, KNOWN_COUNTS);
  return out;
}
