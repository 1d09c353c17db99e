/**
 * Spearman–Brown prophecy (Spearman 1910; Brown 1910): the reliability of a measure made
 * `factor` times as long from parallel parts, ρ* = f·ρ / (1 + (f − 1)·ρ).
 * With `factor` = 2 it corrects a split-half correlation to full length.
 *
 * Returns `undefined` when the inputs are outside their domain (ρ not in [0, 1], f ≤ 0): a
 * negative correlation of parts is not a reliability and is never stepped up.
 */
export function spearmanBrown(reliability: number, factor: number): number | undefined {
  if (!Number.isFinite(reliability) || !Number.isFinite(factor) || factor <= 0 || reliability > 1 || reliability < 0) return undefined;
  const denominator = 1 + (factor - 1) * reliability;
  if (denominator <= 0) return undefined;
  return (factor * reliability) / denominator;
}

/**
 * The inverse prophecy: by what factor a measure of reliability ρ must be lengthened to reach
 * `target`, f = ρ*(1 − ρ) / (ρ(1 − ρ*)). Returns `undefined` unless 0 < ρ < 1 and 0 < ρ* < 1.
 */
export function spearmanBrownFactor(reliability: number, target: number): number | undefined {
  if (!(reliability > 0 && reliability < 1 && target > 0 && target < 1)) return undefined;
  return (target * (1 - reliability)) / (reliability * (1 - target));
}
