/** How the proposal editor writes numbers: a few significant digits, never NaN or "1e-7". */

export function formatNumber(x: number | null | undefined, digits = 3): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return '—';
  if (x === 0) return '0';
  const abs = Math.abs(x);
  if (abs >= 1e-3 && abs < 1e7) {
    return new Intl.NumberFormat('en-GB', { maximumSignificantDigits: digits })
      .format(x)
      .replace('-', '−');
  }
  return x.toExponential(digits - 1).replace('-', '−');
}

/** Hours with one decimal, the way requests are added up: "12.5 h". */
export const formatHours = (hours: number | null | undefined) =>
  hours === null || hours === undefined || !Number.isFinite(hours)
    ? '—'
    : `${new Intl.NumberFormat('en-GB', { maximumFractionDigits: 1, minimumFractionDigits: 1 }).format(hours)} h`;

export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${formatNumber(bytes / 1024, 3)} KB`;
  return `${formatNumber(bytes / (1024 * 1024), 3)} MB`;
}

/** Sidereal hours as "hh:mm". */
export function formatLst(hours: number | null): string {
  if (hours === null) return '—';
  const minutes = Math.round((((hours % 24) + 24) % 24) * 60) % 1440;
  return `${String(Math.floor(minutes / 60)).padStart(2, '0')}:${String(minutes % 60).padStart(2, '0')}`;
}

/** `12:04`, the viewer's clock, for "Saved · 12:04". */
export const formatClock = (at: Date) =>
  new Intl.DateTimeFormat(undefined, {
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
  }).format(at);

/** Words in a text as a reader counts them: runs of non-space characters. */
export const countWords = (text: string) =>
  text.trim() === '' ? 0 : text.trim().split(/\s+/).length;

/**
 * A typed number: null when empty, a message when it is not a number. A comma for decimals is
 * refused with a hint rather than read as a thousands separator.
 */
export function parseNumber(text: string): number | null | { error: string } {
  const trimmed = text.trim().replace(/^−/, '-');
  if (trimmed === '') return null;
  if (/^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:e[+-]?\d+)?$/i.test(trimmed)) return Number(trimmed);
  if (/^[+-]?\d*,\d+$/.test(trimmed)) return { error: 'Use a point for decimals, e.g. 1.4.' };
  return { error: `“${trimmed.slice(0, 20)}” is not a number.` };
}
