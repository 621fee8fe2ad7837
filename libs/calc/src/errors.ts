/** The errors the library throws. Rule failures are findings (`Check`); these are for bad arguments. */

/** One bad input value, named by its path in the input (`target.decDeg`, `array.antennas`). */
export interface InputIssue {
  path: string;
  message: string;
}

/** Thrown when an input fails validation; `issues` names every bad field. */
export class CalcInputError extends Error {
  override readonly name = 'CalcInputError';
  readonly issues: readonly InputIssue[];

  constructor(issues: readonly InputIssue[]) {
    const first = issues[0];
    const more = issues.length > 1 ? ` (and ${issues.length - 1} more)` : '';
    super(first ? `${first.path}: ${first.message}${more}` : 'Invalid input.');
    this.issues = issues;
  }
}

/** Which part of a sexagesimal coordinate is wrong. */
export type CoordinatePart = 'format' | 'hours' | 'degrees' | 'minutes' | 'seconds';

/** Thrown by `parseRightAscension` / `parseDeclination`; the message names what is wrong. */
export class CoordinateParseError extends Error {
  override readonly name = 'CoordinateParseError';
  readonly input: string;
  readonly part: CoordinatePart;

  constructor(input: string, part: CoordinatePart, message: string) {
    super(message);
    this.input = input;
    this.part = part;
  }
}
