/**
 * Parsing and formatting of equatorial coordinates as people type them.
 *
 * Right ascension: `10:00:24.0`, `10 00 24`, `10h00m24.0s` (hours), or decimal degrees `150.1`.
 * Declination: `+22:30:00`, `-05:04:03.2`, `22d30m00s`, `22°30′00″` / `22°30'00"`, or decimal degrees.
 * Only the last field may carry a fraction. Results are in degrees.
 */
import { CalcInputError, CoordinateParseError, type CoordinatePart } from './errors.js';

const FIELD = String.raw`(\d+(?:\.\d*)?|\.\d+)`;
const SEP = String.raw`(?:\s*:\s*|\s+)`;
/** `hh:mm[:ss.s]` or `hh mm [ss.s]`; also used for `dd:mm:ss`. */
const COLON_OR_SPACE = new RegExp(`^${FIELD}${SEP}${FIELD}(?:${SEP}${FIELD})?$`);
const RA_LETTERS = new RegExp(
  `^${FIELD}\\s*[hʰ](?:\\s*${FIELD}\\s*[mᵐ′'](?:\\s*${FIELD}\\s*(?:[sˢ″"])?)?)?$`,
  'i',
);
const DEC_LETTERS = new RegExp(
  `^${FIELD}\\s*(?:deg|[d°])(?:\\s*${FIELD}\\s*[m′'](?:\\s*${FIELD}\\s*(?:''|[s″"])?)?)?$`,
  'i',
);
const DECIMAL_DEGREES = new RegExp(`^${FIELD}\\s*(?:deg|[d°])?$`, 'i');

interface Sexagesimal {
  whole: number;
  minutes: number;
  seconds: number;
}

function fail(input: string, part: CoordinatePart, message: string): never {
  throw new CoordinateParseError(input, part, `${message} (in "${input}").`);
}

/** Checks the fields of a sexagesimal match and returns them as numbers. */
function readFields(
  input: string,
  what: string,
  wholeName: 'hours' | 'degrees',
  match: RegExpMatchArray,
): Sexagesimal {
  const [, wholeText = '', minutesText, secondsText] = match;
  if (minutesText !== undefined && wholeText.includes('.')) {
    fail(input, wholeName, `${what} ${wholeName} must be a whole number when minutes follow`);
  }
  if (secondsText !== undefined && minutesText?.includes('.')) {
    fail(input, 'minutes', `${what} minutes must be a whole number when seconds follow`);
  }
  const minutes = minutesText === undefined ? 0 : Number(minutesText);
  const seconds = secondsText === undefined ? 0 : Number(secondsText);
  if (minutes >= 60) fail(input, 'minutes', `${what} minutes must be below 60, got ${minutesText}`);
  if (seconds >= 60) fail(input, 'seconds', `${what} seconds must be below 60, got ${secondsText}`);
  return { whole: Number(wholeText), minutes, seconds };
}

function sexagesimalValue({ whole, minutes, seconds }: Sexagesimal): number {
  return whole + minutes / 60 + seconds / 3600;
}

/** Parses a right ascension to degrees in [0, 360). Throws `CoordinateParseError`. */
export function parseRightAscension(text: string): number {
  const input = text;
  const body = text.trim().replace(/^\+\s*/, '');
  if (/^[-−]/.test(body)) fail(input, 'format', 'Right ascension cannot be negative');

  const decimal = DECIMAL_DEGREES.exec(body);
  if (decimal) {
    const deg = Number(decimal[1]);
    if (deg >= 360)
      fail(input, 'degrees', `Right ascension in degrees must be below 360, got ${decimal[1]}`);
    return deg;
  }
  const match = RA_LETTERS.exec(body) ?? COLON_OR_SPACE.exec(body);
  if (!match) {
    fail(
      input,
      'format',
      'Right ascension must look like 10:00:24.0, 10h00m24.0s, 10 00 24 or decimal degrees such as 150.1',
    );
  }
  const fields = readFields(input, 'Right ascension', 'hours', match);
  if (fields.whole >= 24)
    fail(input, 'hours', `Right ascension hours must be below 24, got ${match[1]}`);
  return sexagesimalValue(fields) * 15;
}

/** Parses a declination to degrees in [−90, 90]. Throws `CoordinateParseError`. */
export function parseDeclination(text: string): number {
  const input = text;
  const trimmed = text.trim();
  const signMatch = /^([+\-−])\s*/.exec(trimmed);
  const negative = signMatch !== null && signMatch[1] !== '+';
  const body = signMatch ? trimmed.slice(signMatch[0].length) : trimmed;

  let deg: number;
  const decimal = DECIMAL_DEGREES.exec(body);
  if (decimal) {
    deg = Number(decimal[1]);
  } else {
    const match = DEC_LETTERS.exec(body) ?? COLON_OR_SPACE.exec(body);
    if (!match) {
      fail(
        input,
        'format',
        'Declination must look like +22:30:00, -05:04:03.2, 22d30m00s, 22°30′00″ or decimal degrees such as -5.07',
      );
    }
    const fields = readFields(input, 'Declination', 'degrees', match);
    if (fields.whole > 90)
      fail(input, 'degrees', `Declination degrees must be at most 90, got ${match[1]}`);
    deg = sexagesimalValue(fields);
  }
  if (deg > 90)
    fail(input, 'degrees', `Declination must lie within ±90°, got ${negative ? '−' : '+'}${deg}°`);
  // `-00:30:00` is negative although its degrees field is zero: the sign belongs to the whole angle.
  return negative && deg !== 0 ? -deg : deg;
}

function checkDecimals(decimals: number): void {
  if (!(Number.isInteger(decimals) && decimals >= 0 && decimals <= 6)) {
    throw new CalcInputError([
      {
        path: 'decimals',
        message: `decimals must be a whole number from 0 to 6, got ${decimals}.`,
      },
    ]);
  }
}

function pad2(n: number): string {
  return n < 10 ? `0${n}` : String(n);
}

/** Formats whole units of 10^-decimals seconds as `aa:mm:ss[.s…]`. */
function formatUnits(units: number, decimals: number): string {
  const scale = 10 ** decimals;
  const perMinute = 60 * scale;
  const perWhole = 3600 * scale;
  const whole = Math.floor(units / perWhole);
  const minutes = Math.floor((units % perWhole) / perMinute);
  const secondUnits = units % perMinute;
  const secondsInt = Math.floor(secondUnits / scale);
  const fraction = decimals > 0 ? `.${String(secondUnits % scale).padStart(decimals, '0')}` : '';
  return `${pad2(whole)}:${pad2(minutes)}:${pad2(secondsInt)}${fraction}`;
}

/**
 * Formats degrees as right ascension `hh:mm:ss.s` (decimals of a second, default 1). The value is
 * rounded once, in whole units of the last digit, so 59.99 s carries into the next minute and
 * 23:59:59.99 into 00:00:00.0.
 */
export function formatRightAscension(deg: number, decimals = 1): string {
  checkDecimals(decimals);
  if (!Number.isFinite(deg)) {
    throw new CalcInputError([
      { path: 'deg', message: `Right ascension must be finite, got ${deg}.` },
    ]);
  }
  const scale = 10 ** decimals;
  const unitsPerDay = 86_400 * scale;
  const wrapped = ((deg % 360) + 360) % 360;
  const units = Math.round(wrapped * 240 * scale) % unitsPerDay;
  return formatUnits(units, decimals);
}

/** Formats degrees as declination `±dd:mm:ss` (optional decimals of an arcsecond), with the same carry. */
export function formatDeclination(deg: number, decimals = 0): string {
  checkDecimals(decimals);
  if (!(Number.isFinite(deg) && Math.abs(deg) <= 90)) {
    throw new CalcInputError([
      { path: 'deg', message: `Declination must lie within ±90°, got ${deg}.` },
    ]);
  }
  const units = Math.round(Math.abs(deg) * 3600 * 10 ** decimals);
  const sign = deg < 0 && units > 0 ? '-' : '+';
  return sign + formatUnits(units, decimals);
}
