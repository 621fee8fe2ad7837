import { countWords } from './proposal-options.js';
import { utcText } from './proposal-checks.js';

describe('countWords', () => {
  it.each([
    ['', 0],
    ['   \n\t ', 0],
    ['one', 1],
    ['  two words  ', 2],
    ['line\nbreaks\tand  tabs', 4],
    ['Hα emission (λ = 21 cm)', 6],
  ])('%j has %i words', (text, words) => expect(countWords(text)).toBe(words));
});

describe('utcText', () => {
  it('writes minutes, and seconds only when there are some', () => {
    expect(utcText(new Date('2027-01-15T17:00:00Z'))).toBe('2027-01-15 17:00 UTC');
    expect(utcText(new Date('2027-01-15T16:59:59.5Z'))).toBe('2027-01-15 16:59:59 UTC');
  });
});
