/**
 * About `count` round tick values covering [min, max], with a step of 1, 2 or 5 × 10^k
 * (the usual "nice numbers" rule; Heckbert 1990, Graphics Gems, "Nice numbers for graph labels").
 * Returns the ticks and the widened domain [first tick, last tick].
 */
export function niceTicks(min: number, max: number, count = 5): { ticks: number[]; domain: [number, number] } {
  if (!Number.isFinite(min) || !Number.isFinite(max)) return { ticks: [], domain: [0, 1] };
  if (max < min) [min, max] = [max, min];
  if (max === min) {
    const pad = min === 0 ? 1 : Math.abs(min) * 0.1;
    min -= pad;
    max += pad;
  }
  const raw = (max - min) / Math.max(1, count);
  const power = Math.pow(10, Math.floor(Math.log10(raw)));
  const fraction = raw / power;
  const step = (fraction <= 1 ? 1 : fraction <= 2 ? 2 : fraction <= 5 ? 5 : 10) * power;
  const first = Math.floor(min / step + 1e-9) * step;
  const last = Math.ceil(max / step - 1e-9) * step;
  const ticks: number[] = [];
  for (let i = 0; first + i * step <= last + step * 1e-9; i++) ticks.push(Number((first + i * step).toPrecision(12)));
  return { ticks, domain: [ticks[0] ?? min, ticks[ticks.length - 1] ?? max] };
}
