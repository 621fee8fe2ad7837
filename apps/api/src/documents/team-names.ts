/**
 * Finding the team's names in a science case's text, for anonymous calls.
 *
 * The rule: a person is named when their family name appears together with their given name or
 * its initial, in either order, as whole words, ignoring case, accents and spacing:
 *
 *   "Ada Quill", "A. Quill", "A.Quill", "Ada B. Quill", "Quill, Ada", "Quill, A.", "Quill A."
 *
 * The family name is the last word of the name with any particles before it ("van der Berg");
 * each half of a double-barrelled family name also counts ("Z. Łukasik" for "Zoë Ngũgĩ-Łukasik").
 * An initial needs its full stop, and a given name after the family name needs the comma
 * ("Rose, Will"), so ordinary prose ("a quill", "the rose will") is not taken for a name.
 * The family name alone is not flagged: citing one's own earlier work in the third person is
 * allowed in anonymous review, and a common surname alone would stop many honest proposals. A
 * one-word name is matched on its own. Words split by a hyphen at a line end are not rejoined.
 */

/** Letters that Unicode decomposition leaves whole, written as their plain Latin forms. */
const PLAIN_LETTERS: Record<string, string> = {
  ł: 'l',
  ø: 'o',
  đ: 'd',
  ħ: 'h',
  ı: 'i',
  ß: 'ss',
  æ: 'ae',
  œ: 'oe',
  þ: 'th',
  ð: 'd',
};

const PARTICLES = new Set([
  'al',
  'bin',
  'da',
  'das',
  'de',
  'del',
  'della',
  'den',
  'der',
  'di',
  'do',
  'dos',
  'du',
  'el',
  'la',
  'le',
  'ten',
  'ter',
  'van',
  'von',
]);

/**
 * Lower case without accents, every dash "-", every apostrophe "'", one space for any run of
 * white space, and a hyphen at a line end joined to the next line ("Ngũgĩ-\nŁukasik").
 */
export function foldText(text: string): string {
  return text
    .normalize('NFKD')
    .replace(/\p{M}/gu, '')
    .toLowerCase()
    .replace(/[łøđħıßæœþð]/g, (c) => PLAIN_LETTERS[c] ?? c)
    .replace(/\u00ad/g, '')
    .replace(/[\u2010-\u2015\u2212]/g, '-')
    .replace(/[\u2018\u2019\u02bc`´]/g, "'")
    .replace(/-\s*\n\s*/g, '-')
    .replace(/\s+/g, ' ');
}

const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

/** "anne-marie" → "a\.(?: ?- ?m\.)?": the initial, with the second part's initial optional. */
function initialPattern(given: string): string {
  const [first, ...rest] = given.replace(/\.$/, '').split('-');
  const head = `${escape((first ?? '').charAt(0))}\\.`;
  return rest.length ? `${head}(?: ?- ?${escape(rest[0]!.charAt(0))}\\.)?` : head;
}

export interface NameMatcher {
  /** The name as the team list gives it. */
  name: string;
  pattern: RegExp;
}

/** One matcher per name; a name with no letters gives none. */
export function nameMatchers(names: string[]): NameMatcher[] {
  const matchers: NameMatcher[] = [];
  for (const name of names) {
    const pattern = namePattern(name);
    if (pattern) matchers.push({ name, pattern });
  }
  return matchers;
}

function namePattern(name: string): RegExp | null {
  let folded = foldText(name).trim();
  // "Quill, Ada" as typed in a team list: family name first.
  const comma = folded.indexOf(',');
  if (comma > 0) folded = `${folded.slice(comma + 1)} ${folded.slice(0, comma)}`.trim();
  const words = folded.split(' ').filter((w) => /[a-z0-9]/.test(w));
  if (words.length === 0) return null;
  const whole = (body: string) => new RegExp(`(?<![a-z0-9])(?:${body})(?![a-z0-9])`);
  if (words.length === 1) return whole(escape(words[0]!));

  let familyStart = words.length - 1;
  while (familyStart > 1 && PARTICLES.has(words[familyStart - 1]!)) familyStart--;
  const given = words[0]!;
  const middle = words.slice(1, familyStart);
  const family = words.slice(familyStart).join(' ');
  const familyForms = [family, ...(family.includes('-') ? family.split('-') : [])]
    .filter((f) => f.length > 1)
    .map((f) => escape(f).replace(/-/g, '[- ]?'));
  const F = `(?:${familyForms.join('|')})`;
  const initial = initialPattern(given);
  const isInitial = given.endsWith('.') || given.length === 1;
  const givenFull = isInitial ? initial : `${escape(given)} `;
  // Middle names: the person's own, in full or as initials, or any initials.
  const middleWord = ['[a-z]\\. ?', ...middle.map((m) => `${escape(m.replace(/\.$/, ''))} `)].join(
    '|',
  );
  const M = `(?:${middleWord}){0,3}`;
  return whole(
    [
      `(?:${givenFull}|${initial} ?)${M}${F}`, // Ada Quill, A. Quill, Ada B. Quill
      `${F}, ${escape(given.replace(/\.$/, ''))}`, // Quill, Ada
      `${F},? ${initial}`, // Quill, A. / Quill A.
    ].join('|'),
  );
}

/** The names of `matchers` that `text` contains, each once, in the matchers' order. */
export function namesIn(text: string, matchers: NameMatcher[]): string[] {
  const folded = foldText(text);
  return matchers.filter((m) => m.pattern.test(folded)).map((m) => m.name);
}
