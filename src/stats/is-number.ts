/**
 * True when `value` is a finite number: the test every numeric primitive uses to skip missing
 * values (`undefined`, `null`, `NaN`, ±Infinity and anything that is not a number).
 */
export function isNumber(value: unknown): value is number {
  return typeof value === 'number' && Number.isFinite(value);
}
