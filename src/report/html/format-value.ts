/**
 * A number for reading on the page: `digits` decimals (default 2), a true minus sign, `–` for a
 * missing value. Thousands are grouped for integers (`12,480`). No locale is consulted.
 */
export function formatValue(value: number | undefined, digits = 2): string {
  if (value === undefined || !Number.isFinite(value)) return '–';
  if (Number.isInteger(value) && digits === 0) return groupThousands(value);
  let text = value.toFixed(digits);
  if (/^-0(\.0+)?$/.test(text)) text = text.slice(1);
  return text.replace(/^-/, '−');
}

/** An integer with commas between thousands (`1234567` → `1,234,567`), minus as `−`. */
export function groupThousands(value: number): string {
  const sign = value < 0 ? '−' : '';
  const digits = String(Math.abs(Math.round(value)));
  return sign + digits.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
}
