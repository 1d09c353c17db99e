import { writeFileSync } from 'node:fs';

/**
 * Writes the `<scores>.meta.json` sidecar that `lexichron score` writes beside a scores file:
 * the lexicons and the score columns with their aggregation, and the reconciliation counts
 * (`read` rows, `scored` entries) when given. Returns the scores path.
 */
export function writeScoresSidecar(
  scores: string,
  columns: ReadonlyArray<{ name: string; aggregation: 'count' | 'rating' | 'sum' | 'vader' }>,
  lexicons: ReadonlyArray<{ name: string; version: string }> = [{ name: 'x', version: '1' }],
  reconciliation?: Record<string, unknown>,
): string {
  const meta = {
    tool: { name: 'lexichron', version: 'test' },
    lexicons: lexicons.map((l) => ({ ...l, sha256: '0'.repeat(64), license: 'invented', source: 'test' })),
    columns: columns.map((c) => ({ lexicon: c.name.split('.')[0], ...c })),
    ...(reconciliation ? { reconciliation } : {}),
  };
  writeFileSync(`${scores}.meta.json`, JSON.stringify(meta, null, 2) + '\n');
  return scores;
}
