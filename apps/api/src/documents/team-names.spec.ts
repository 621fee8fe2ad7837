import { foldText, nameMatchers, namesIn } from './team-names.js';

const found = (text: string, names: string[]) => namesIn(text, nameMatchers(names));

describe('foldText', () => {
  it('drops accents and case, unifies dashes and joins a name split at a line end', () => {
    expect(foldText('Zoë  NGŨGĨ‐\nŁukasik')).toBe('zoe ngugi-lukasik');
    expect(foldText('Øyvind Strøm O’Brien')).toBe("oyvind strom o'brien");
  });
});

describe('namesIn (team names in a science case)', () => {
  // Each row: text, the team, the names that must be found.
  const cases: Array<[string, string[], string[]]> = [
    ['Led by Ada Quill at the array.', ['Ada Quill'], ['Ada Quill']],
    ['see A. Quill (2024)', ['Ada Quill'], ['Ada Quill']],
    ['see A.Quill et al.', ['Ada Quill'], ['Ada Quill']],
    ['ADA QUILL', ['Ada Quill'], ['Ada Quill']],
    ['Ada B. Quill wrote', ['Ada Quill'], ['Ada Quill']],
    ['Ada Beatrix Quill wrote', ['Ada Beatrix Quill'], ['Ada Beatrix Quill']],
    ['Quill, Ada, and others', ['Ada Quill'], ['Ada Quill']],
    ['References: Quill, A., 2025, J. Invented 3, 1', ['Ada Quill'], ['Ada Quill']],
    [
      'Quill A., Brennholt T. 2025',
      ['Ada Quill', 'Tomasz Brennholt'],
      ['Ada Quill', 'Tomasz Brennholt'],
    ],
    ['Ada\nQuill', ['Ada Quill'], ['Ada Quill']],
    ['as Zoe Ngugi-Lukasik showed', ['Zoë Ngũgĩ-Łukasik'], ['Zoë Ngũgĩ-Łukasik']],
    ['as Z. Łukasik showed', ['Zoë Ngũgĩ-Łukasik'], ['Zoë Ngũgĩ-Łukasik']],
    ['Ngũgĩ-Łukasik, Z. (2026)', ['Zoë Ngũgĩ-Łukasik'], ['Zoë Ngũgĩ-Łukasik']],
    ['A.-M. van der Berg', ['Anne-Marie van der Berg'], ['Anne-Marie van der Berg']],
    ['Anne-Marie van der Berg', ['Anne-Marie van der Berg'], ['Anne-Marie van der Berg']],
    ['Quill, Ada as typed', ['Quill, Ada'], ['Quill, Ada']],
    // Not the person: the family name alone, other given names, words inside words, prose.
    ['Quill et al. (2024) found', ['Ada Quill'], []],
    ['B. Quill measured', ['Ada Quill'], []],
    ['Adam Quillfeather', ['Ada Quill'], []],
    ['we used a quill pen', ['Ada Quill'], []],
    ['the rose will bloom', ['Will Rose'], []],
    ['nobody is named here', ['Ada Quill', 'Zoë Ngũgĩ-Łukasik'], []],
    ['Berg, A. (2020)', ['Anne-Marie van der Berg'], []],
  ];
  it.each(cases)('%j with team %j finds %j', (text, team, expected) => {
    expect(found(text, team)).toEqual(expected);
  });

  it('matches a one-word name on its own, as a whole word', () => {
    expect(found('Thanks to Quillon for the data', ['Quillon'])).toEqual(['Quillon']);
    expect(found('Quillons are rare', ['Quillon'])).toEqual([]);
  });

  it('ignores names with no letters and characters that mean something to a RegExp', () => {
    expect(nameMatchers(['  ', '—'])).toEqual([]);
    expect(found('J. (Jay) Doe+ spoke', ['Jay (J) Doe+'])).toEqual([]);
    expect(() => nameMatchers(['a[b', 'c)d', '*'])).not.toThrow();
  });
});
