/**
 * ORCID iDs: 16 characters in four groups of four, the last a check character computed with
 * ISO/IEC 7064 MOD 11-2 over the first fifteen digits ('X' stands for ten).
 */
const SHAPE = /^\d{4}-\d{4}-\d{4}-\d{3}[\dX]$/;
const URL_PREFIX = /^https?:\/\/orcid\.org\//i;

/** The check character for 15 base digits, in the iterative form ORCID's documentation gives. */
export function orcidCheckCharacter(baseDigits: string): string {
  if (!/^\d{15}$/.test(baseDigits)) throw new Error('expected 15 digits');
  let total = 0;
  for (const digit of baseDigits) total = (total + Number(digit)) * 2;
  const result = (12 - (total % 11)) % 11;
  return result === 10 ? 'X' : String(result);
}

/** Accepts the bare iD or its https://orcid.org/ form, upper-cases an 'x', and trims. */
export function normalizeOrcid(input: string): string {
  return input.trim().replace(URL_PREFIX, '').toUpperCase();
}

/** True for a well-formed iD (bare form) whose check character is right. */
export function isValidOrcid(id: string): boolean {
  if (!SHAPE.test(id)) return false;
  const digits = id.replace(/-/g, '');
  return orcidCheckCharacter(digits.slice(0, 15)) === digits[15];
}
