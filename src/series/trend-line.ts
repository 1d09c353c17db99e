/** Least-squares line of y on t over defined values; undefined with fewer than 2 distinct t. */
export function trendLine(values: ReadonlyArray<number | undefined>, observed: readonly boolean[]): { a: number; b: number } | undefined {
  let n = 0;
  let mt = 0;
  let my = 0;
  for (let t = 0; t < values.length; t++) {
    const y = values[t];
    if (!observed[t] || y === undefined) continue;
    n++;
    mt += (t - mt) / n;
    my += (y - my) / n;
  }
  if (n < 2) return undefined;
  let stt = 0;
  let sty = 0;
  for (let t = 0; t < values.length; t++) {
    const y = values[t];
    if (!observed[t] || y === undefined) continue;
    stt += (t - mt) * (t - mt);
    sty += (t - mt) * (y - my);
  }
  if (stt === 0) return undefined;
  const b = sty / stt;
  return { a: my - b * mt, b };
}
