import type { ReliabilityCurve, ValidationPair } from '../report-data.js';
import { shownCorrelation, type CorrelationLike } from './shown-correlation.js';

type Json = Record<string, unknown>;
const isObject = (v: unknown): v is Json => typeof v === 'object' && v !== null && !Array.isArray(v);
const num = (v: unknown): number | undefined => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);

function correlation(v: unknown): CorrelationLike {
  if (!isObject(v)) return { ok: false, reason: 'not in the validation output' };
  if (v.ok === false) return { ok: false, reason: typeof v.reason === 'string' ? v.reason : 'not estimable' };
  const r = num(v.r);
  if (r === undefined) return { ok: false, reason: 'not in the validation output' };
  return { ok: true, r, n: num(v.n) ?? 0, df: num(v.df), persons: num(v.persons), ciLow: num(v.ciLow), ciHigh: num(v.ciHigh) };
}

/**
 * Score × rating pairs and reliability curves from the validate stage's JSON (the serialized
 * `ValidationResult` of src/validate/validate-series.ts: `pairs[].{score, rating, analysis}` and
 * `reliability[]`). Unknown or absent fields become "not estimable" entries, never errors.
 */
export function validationFromJson(json: unknown): { pairs: ValidationPair[]; reliability: ReliabilityCurve[] } {
  const root = isObject(json) ? json : {};
  const pairs: ValidationPair[] = [];
  for (const p of Array.isArray(root.pairs) ? root.pairs : []) {
    if (!isObject(p) || typeof p.score !== 'string' || typeof p.rating !== 'string') continue;
    const a = isObject(p.analysis) ? p.analysis : p;
    const verdict = isObject(a.verdict) ? a.verdict : undefined;
    const warnings = Array.isArray(verdict?.warnings) ? verdict.warnings.map((w) => (isObject(w) && typeof w.message === 'string' ? w.message : String(w))) : [];
    const pair: ValidationPair = {
      score: p.score,
      rating: p.rating,
      pairs: num(a.pairs) ?? 0,
      persons: num(a.persons) ?? 0,
      pooled: shownCorrelation(correlation(a.pooled)),
      between: shownCorrelation(correlation(a.between)),
      within: shownCorrelation(correlation(a.within)),
      warnings,
    };
    if (typeof verdict?.text === 'string') pair.verdict = verdict.text;
    pairs.push(pair);
  }
  const reliability: ReliabilityCurve[] = [];
  for (const c of Array.isArray(root.reliability) ? root.reliability : []) {
    if (!isObject(c) || typeof c.column !== 'string') continue;
    const points = (Array.isArray(c.bands) ? c.bands : []).filter(isObject).flatMap((b) => {
      const reliability = num(b.reliability);
      const words = num(b.medianWords) ?? num(b.low);
      if (reliability === undefined || words === undefined || reliability < 0) return [];
      const low = num(b.reliabilityLow);
      const high = num(b.reliabilityHigh);
      return [{ words, reliability, ...(low !== undefined && high !== undefined ? { low, high } : {}), ...(num(b.bins) !== undefined ? { bins: num(b.bins) as number } : {}) }];
    });
    const curve: ReliabilityCurve = { score: c.column, points };
    if (num(c.target) !== undefined) curve.target = num(c.target) as number;
    if (num(c.minWords) !== undefined) curve.recommendedMinWords = num(c.minWords) as number;
    if (typeof c.text === 'string' && c.text) curve.note = typeof c.warning === 'string' && c.warning ? `${c.text} ${c.warning}` : c.text;
    if (points.length) reliability.push(curve);
  }
  return { pairs, reliability };
}
