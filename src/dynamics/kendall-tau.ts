import { normalCdf } from '../stats/distributions.js';
import { notEstimable, type StatResult } from '../stats/stat-result.js';

/** Kendall's τ_b with a one-sided test of τ > 0. */
export interface KendallTau {
  tau: number;
  n: number;
  /** S = n_c − n_d. */
  s: number;
  /**
   * One-sided p-value of H₀ "no association" against τ > 0: exact (the permutation distribution
   * of S, Kendall 1938) when there are no ties and n ≤ 60; otherwise the normal approximation
   * z = (S − 1)/√(n(n−1)(2n+5)/18) with continuity correction, without tie correction.
   */
  pIncreasing: number;
}

/**
 * Kendall's rank correlation τ_b (Kendall 1945, Biometrika 33:239–251) between paired values:
 *
 *   τ_b = (n_c − n_d) / √((n₀ − n₁)(n₀ − n₂))
 *
 * with n_c, n_d the concordant and discordant pairs, n₀ = n(n−1)/2 and n₁, n₂ the pairs tied in
 * x and in y. O(n²), meant for short vectors such as skill over library sizes. Not estimable with
 * fewer than 2 pairs or when either side is constant.
 */
export function kendallTau(x: readonly number[], y: readonly number[]): StatResult<KendallTau> {
  const n = Math.min(x.length, y.length);
  if (n < 2) return notEstimable('too_few_values', 'Kendall τ needs at least two pairs');
  let concordant = 0;
  let discordant = 0;
  let tiesX = 0;
  let tiesY = 0;
  for (let i = 0; i < n; i++)
    for (let j = i + 1; j < n; j++) {
      const dx = Math.sign((x[j] as number) - (x[i] as number));
      const dy = Math.sign((y[j] as number) - (y[i] as number));
      if (dx === 0 && dy === 0) {
        tiesX++;
        tiesY++;
      } else if (dx === 0) tiesX++;
      else if (dy === 0) tiesY++;
      else if (dx === dy) concordant++;
      else discordant++;
    }
  const n0 = (n * (n - 1)) / 2;
  const denominator = Math.sqrt((n0 - tiesX) * (n0 - tiesY));
  if (!(denominator > 0)) return notEstimable('zero_variance', 'one side is constant');
  const s = concordant - discordant;
  return { ok: true, tau: s / denominator, n, s, pIncreasing: tiesX + tiesY === 0 && n <= 60 ? exactUpperTail(n, s) : normalUpperTail(n, s) };
}

/** P(S ≥ s) under H₀ from the distribution of inversions of a random permutation (Mahonian numbers). */
function exactUpperTail(n: number, s: number): number {
  // counts[d] = permutations of m items with d discordant pairs, built up m = 1 … n.
  let counts = [1];
  for (let m = 2; m <= n; m++) {
    const next = new Array<number>(counts.length + m - 1).fill(0);
    for (let d = 0; d < counts.length; d++) for (let add = 0; add < m; add++) next[d + add] = (next[d + add] as number) + (counts[d] as number);
    counts = next;
  }
  const pairs = (n * (n - 1)) / 2;
  // S = pairs − 2·discordant, so S ≥ s ⇔ discordant ≤ (pairs − s) / 2.
  const maxDiscordant = Math.floor((pairs - s) / 2 + 1e-9);
  let tail = 0;
  let total = 0;
  counts.forEach((c, d) => {
    total += c;
    if (d <= maxDiscordant) tail += c;
  });
  return Math.min(1, tail / total);
}

function normalUpperTail(n: number, s: number): number {
  const sd = Math.sqrt((n * (n - 1) * (2 * n + 5)) / 18);
  const z = (s - Math.sign(s)) / sd;
  return 1 - normalCdf(z);
}
