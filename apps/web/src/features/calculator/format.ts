/** How the Calculator writes its numbers: a few significant digits, never NaN, never "1e-7". */

const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻',
  '0': '⁰',
  '1': '¹',
  '2': '²',
  '3': '³',
  '4': '⁴',
  '5': '⁵',
  '6': '⁶',
  '7': '⁷',
  '8': '⁸',
  '9': '⁹',
};

/**
 * `digits` significant digits; between 0.001 and a million in plain notation with thin-space
 * thousands ("12 345"), outside it as "1.23 × 10⁻⁴".
 */
export function formatNumber(x: number, digits = 4): string {
  if (!Number.isFinite(x)) return '—';
  if (x === 0) return '0';
  const abs = Math.abs(x);
  if (abs >= 1e-3 && abs < 1e6) {
    return new Intl.NumberFormat('en-GB', { maximumSignificantDigits: digits })
      .format(x)
      .replace(/,/g, '\u2009')
      .replace('-', '−');
  }
  const [mantissa = '', exponent = ''] = x.toExponential(digits - 1).split('e');
  const trimmed = mantissa.replace(/\.?0+$/, '').replace('-', '−');
  const power = String(Number(exponent))
    .split('')
    .map((c) => SUPERSCRIPT[c] ?? c)
    .join('');
  return `${trimmed} × 10${power}`;
}

/** Sidereal hours as "hh:mm", rounded to the minute (23:59.6 becomes 00:00). */
export function formatLst(hours: number): string {
  const minutes = Math.round((((hours % 24) + 24) % 24) * 60) % 1440;
  const hh = String(Math.floor(minutes / 60)).padStart(2, '0');
  const mm = String(minutes % 60).padStart(2, '0');
  return `${hh}:${mm}`;
}
