/**
 * Formats a number for output files so that the same value always prints the same way.
 *
 * Returns `''` for `undefined`, `null` and non-finite values (missing is empty, never `NaN`).
 * Integers print as integers; other values with up to 10 significant digits, trailing zeros
 * removed, and without exponent notation for magnitudes between 1e-6 and 1e15.
 */
export function formatNumber(value: number | undefined | null, digits = 10): string {
  if (value === undefined || value === null || !Number.isFinite(value)) return '';
  if (Number.isInteger(value) && Math.abs(value) < 1e15) return integerText(value);
  const magnitude = Math.abs(value);
  if (magnitude !== 0 && (magnitude < 1e-6 || magnitude >= 1e15)) return value.toPrecision(digits).replace(/\.?0+e/, 'e');
  let text = value.toPrecision(digits);
  if (text.includes('e')) text = Number(text).toFixed(20);
  if (text.includes('.')) {
    // Trailing zeros, then a trailing point, removed (the hot path of every scores file).
    let end = text.length;
    while (text.charCodeAt(end - 1) === 48) end--;
    if (text.charCodeAt(end - 1) === 46) end--;
    text = text.slice(0, end);
  }
  return text === '-0' ? '0' : text;
}

/** Decimal texts of the integers −1024 … 1023, made once: counts and sums in output rows are mostly small. */
const SMALL_INTEGERS = Array.from({ length: 2048 }, (_, k) => String(k - 1024));

/** `String(value)` for an integer (−0 prints as 0), without a new string for small ones. */
export function integerText(value: number): string {
  return value >= -1024 && value < 1024 ? (SMALL_INTEGERS[value + 1024] as string) : String(value);
}
