/**
 * The longest run of consecutive missing bins: its length in bins and in hours (the real
 * `bin_hours` summed, so a run over a 25-hour day counts 25). A series without missing bins
 * gives `{ bins: 0, hours: 0 }`.
 */
export function longestGap(bins: Iterable<{ missing: string; hours: number }>): { bins: number; hours: number } {
  let best = { bins: 0, hours: 0 };
  let run = { bins: 0, hours: 0 };
  for (const b of bins) {
    if (b.missing) {
      run = { bins: run.bins + 1, hours: run.hours + b.hours };
      if (run.bins > best.bins) best = run;
    } else run = { bins: 0, hours: 0 };
  }
  return best;
}
