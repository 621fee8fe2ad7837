/**
 * Number formatting for the sentences of findings (not exported from the package). It runs on
 * every evaluation that raises a check, so it rounds to a whole number of the last digit and
 * prints integers, which is several times faster than printing a double with toFixed().
 */

const POW10 = [1, 10, 100, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9];

/** x rounded to `decimals` (0–9) places, trailing zeros dropped. */
function rounded(x: number, decimals: number): string {
  const scale = POW10[decimals] ?? 1e9;
  const units = Math.round(Math.abs(x) * scale);
  if (units === 0) return '0';
  const sign = x < 0 ? '-' : '';
  const whole = Math.floor(units / scale);
  let fraction = units - whole * scale;
  if (fraction === 0) return `${sign}${whole}`;
  let digits = decimals;
  while (fraction % 10 === 0) {
    fraction /= 10;
    digits--;
  }
  return `${sign}${whole}.${String(fraction).padStart(digits, '0')}`;
}

/**
 * `significant` significant digits (at most 9), trailing zeros dropped; exponent form outside
 * [1e-3, 1e6). Whole digits are never rounded away (12345 stays "12345").
 */
export function formatNumber(x: number, significant = 3): string {
  if (x === 0 || !Number.isFinite(x)) return String(x);
  const abs = Math.abs(x);
  if (abs >= 1e6 || abs < 1e-3) {
    return x
      .toExponential(significant - 1)
      .replace(/\.?0+e/, 'e')
      .replace('e+', 'e');
  }
  return rounded(x, Math.max(0, significant - 1 - Math.floor(Math.log10(abs))));
}

/** Fixed decimals with trailing zeros dropped, for angles ("47.3", "15"). */
export function formatFixed(x: number, decimals: number): string {
  return rounded(x, decimals);
}
