/** Number formatting for the sentences of findings and issues (not exported from the package). */

/**
 * `significant` significant digits, trailing zeros dropped; exponent form outside [1e-3, 1e6).
 * Whole digits are never rounded away (12 345 stays "12345").
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
  const decimals = Math.max(0, significant - 1 - Math.floor(Math.log10(abs)));
  return String(Number(x.toFixed(decimals)));
}

/** Fixed decimals with trailing zeros dropped, for angles ("47.3", "15"). */
export function formatFixed(x: number, decimals: number): string {
  const text = String(Number(x.toFixed(decimals)));
  return text === '-0' ? '0' : text;
}
