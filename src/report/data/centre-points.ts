/**
 * Person-mean centring of complete (x, y) pairs for the within-person scatter: each value minus
 * its person's mean over the same pairs (two-pass: means first, then differences). Also returns
 * the person means, one point per person, for the between-person scatter.
 */
export function centrePoints(points: readonly { person: string; x: number; y: number }[]): {
  within: { person: string; x: number; y: number }[];
  means: { person: string; x: number; y: number; n: number }[];
} {
  const sums = new Map<string, { x: number; y: number; n: number }>();
  for (const p of points) {
    const s = sums.get(p.person) ?? { x: 0, y: 0, n: 0 };
    s.x += p.x;
    s.y += p.y;
    s.n += 1;
    sums.set(p.person, s);
  }
  const means = [...sums].sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0)).map(([person, s]) => ({ person, x: s.x / s.n, y: s.y / s.n, n: s.n }));
  const byPerson = new Map(means.map((m) => [m.person, m]));
  const within = points.map((p) => {
    const m = byPerson.get(p.person) as { x: number; y: number };
    return { person: p.person, x: p.x - m.x, y: p.y - m.y };
  });
  return { within, means };
}
