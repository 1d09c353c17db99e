import type { Reconciliation } from '../types.js';

const pad = (n: number): string => n.toLocaleString('en-US').padStart(12);

/**
 * The reconciliation as plain text lines: rows read = scored + rejected (by reason) + dropped
 * (by reason). The identity is checked and a mismatch is shown, never hidden.
 */
export function reconciliationText(r: Reconciliation): string {
  const rejected = Object.values(r.rejected).reduce((a, b) => a + b, 0);
  const dropped = Object.values(r.dropped).reduce((a, b) => a + b, 0);
  const lines = [`rows read    ${pad(r.read)}`, `  scored     ${pad(r.scored)}`, `  rejected   ${pad(rejected)}`];
  for (const [code, n] of Object.entries(r.rejected).sort((a, b) => b[1] - a[1] || (a[0] < b[0] ? -1 : 1))) lines.push(`    ${code.padEnd(22)}${n.toLocaleString('en-US').padStart(10)}`);
  if (dropped > 0) {
    lines.push(`  dropped    ${pad(dropped)}`);
    for (const [code, n] of Object.entries(r.dropped).sort((a, b) => b[1] - a[1] || (a[0] < b[0] ? -1 : 1))) lines.push(`    ${code.padEnd(22)}${n.toLocaleString('en-US').padStart(10)}`);
  }
  // Notes on scored rows (e.g. times read by the RFC 3339 fallback of a time format): counted, not subtracted.
  for (const [note, n] of Object.entries(r.notes ?? {})) lines.push(`  note: ${note.padEnd(16)}${n.toLocaleString('en-US').padStart(10)} of the scored rows`);
  const elsewhere = r.otherShard ?? 0;
  if (r.otherShard !== undefined) lines.push(`  other shard${pad(elsewhere).slice(1)}`);
  if (r.scored + rejected + dropped + elsewhere !== r.read) lines.push(`  MISMATCH: read ${r.read} ≠ scored + rejected + dropped${r.otherShard !== undefined ? ' + other shard' : ''} ${r.scored + rejected + dropped + elsewhere}; please report this as a bug`);
  return lines.join('\n');
}
