import type { StudyProblem } from './parse-study.js';

/** Levenshtein distance, for "did you mean" hints. */
export function distance(a: string, b: string): number {
  const d = Array.from({ length: a.length + 1 }, (_, i) => [i, ...Array<number>(b.length).fill(0)]);
  for (let j = 1; j <= b.length; j++) (d[0] as number[])[j] = j;
  for (let i = 1; i <= a.length; i++) {
    for (let j = 1; j <= b.length; j++) {
      const row = d[i] as number[];
      const prev = d[i - 1] as number[];
      row[j] = Math.min((prev[j] as number) + 1, (row[j - 1] as number) + 1, (prev[j - 1] as number) + (a[i - 1] === b[j - 1] ? 0 : 1));
    }
  }
  return (d[a.length] as number[])[b.length] as number;
}

/** Adds a problem for each key of `value` not in `known`, with a "did you mean" hint or the known keys. */
export function unknownKeys(value: Record<string, unknown>, known: readonly string[], path: string, problems: StudyProblem[]): void {
  for (const key of Object.keys(value)) {
    if (known.includes(key)) continue;
    const near = [...known].sort((x, y) => distance(key, x) - distance(key, y))[0];
    const hint = near && distance(key, near) <= 3 ? `; did you mean \`${near}\`?` : `; known keys are ${known.join(', ')}`;
    problems.push({ path: `${path}.${key}`, message: `unknown key \`${key}\`${hint}` });
  }
}
