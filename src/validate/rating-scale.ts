import { usageError } from '../errors.js';

/** The declared range of a rating, inclusive. */
export interface RatingScale {
  min: number;
  max: number;
}

/**
 * Parses declared rating scales, `NAME=MIN:MAX` separated by commas (the `--scale` option), e.g.
 * `mood=0:100,calm=1:7`; `*=1:7` applies to every rating column without its own scale.
 * Throws a usage error naming the bad part and showing the expected form.
 */
export function parseRatingScales(spec: string | undefined): Map<string, RatingScale> {
  const scales = new Map<string, RatingScale>();
  if (!spec) return scales;
  for (const part of spec.split(',')) {
    const m = /^\s*([^=]+?)\s*=\s*(-?\d+(?:\.\d+)?)\s*:\s*(-?\d+(?:\.\d+)?)\s*$/.exec(part);
    if (!m) throw usageError(`Cannot read --scale \`${spec}\`: \`${part}\` is not NAME=MIN:MAX; for example --scale mood=0:100,calm=1:7`);
    const min = Number(m[2]);
    const max = Number(m[3]);
    if (!(min < max)) throw usageError(`Cannot read --scale \`${part}\`: the minimum ${min} must be below the maximum ${max}`);
    scales.set(m[1] as string, { min, max });
  }
  return scales;
}

/** The scale of a rating column: its own, else the `*` default, else undefined. */
export function scaleOf(scales: ReadonlyMap<string, RatingScale>, column: string): RatingScale | undefined {
  return scales.get(column) ?? scales.get('*');
}
