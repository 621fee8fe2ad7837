import { randomInt } from 'node:crypto';
import { isValidOrcid, normalizeOrcid, orcidCheckCharacter } from './orcid.js';

/**
 * A second, independent formulation of ISO/IEC 7064 MOD 11-2 (the textbook "pure system" check):
 * a string a_n … a_1 with the check character as a_1 ('X' = 10) is valid exactly when
 * Σ a_i · 2^(i−1) ≡ 1 (mod 11). Here the check character is found by trying all eleven.
 */
function referenceCheckCharacter(base: string): string {
  const candidates = ['0', '1', '2', '3', '4', '5', '6', '7', '8', '9', 'X'];
  const valid = candidates.filter((c) => {
    const chars = [...base, c].reverse();
    let sum = 0;
    let weight = 1;
    for (const ch of chars) {
      sum += (ch === 'X' ? 10 : Number(ch)) * weight;
      weight = (weight * 2) % 11;
    }
    return sum % 11 === 1;
  });
  if (valid.length !== 1) throw new Error(`expected one check character, got ${valid.join()}`);
  return valid[0] as string;
}

const format = (digits: string) => digits.match(/.{4}/g)!.join('-');

describe('ORCID iD check characters (ISO/IEC 7064 MOD 11-2)', () => {
  // ORCID's documentation uses 0000-0002-1825-0097 as its example iD, and 0000-0002-1694-233X as
  // one with an X check character (both from memory).
  it.each([
    ['0000-0002-1825-0097', '7'],
    ['0000-0002-1694-233X', 'X'],
  ])('%s has check character %s', (id, check) => {
    expect(orcidCheckCharacter(id.replace(/-/g, '').slice(0, 15))).toBe(check);
    expect(referenceCheckCharacter(id.replace(/-/g, '').slice(0, 15))).toBe(check);
    expect(isValidOrcid(id)).toBe(true);
  });

  it('agrees with the independent formulation over many random bodies', () => {
    for (let n = 0; n < 5000; n++) {
      const base = Array.from({ length: 15 }, () => String(randomInt(10))).join('');
      const check = orcidCheckCharacter(base);
      expect(check).toBe(referenceCheckCharacter(base));
      expect(isValidOrcid(format(base + check))).toBe(true);
    }
  });

  it('refuses every wrong check character, and a swap of two neighbouring digits', () => {
    const base = '000000021825009';
    for (const wrong of ['0', '1', '2', '3', '4', '5', '6', '8', '9', 'X']) {
      expect(isValidOrcid(format(base + wrong))).toBe(false);
    }
    expect(isValidOrcid('0000-0002-8125-0097')).toBe(false);
  });

  it('refuses malformed iDs', () => {
    for (const id of [
      '',
      '0000000218250097',
      '0000-0002-1825-009',
      '0000-0002-1825-00977',
      '0000-0002-1825-009x',
      'abcd-0002-1825-0097',
      '0000-0002-1825-X097',
    ]) {
      expect(isValidOrcid(id)).toBe(false);
    }
  });

  it('normalises the link form and a lower-case x', () => {
    expect(normalizeOrcid(' https://orcid.org/0000-0002-1694-233x ')).toBe('0000-0002-1694-233X');
    expect(normalizeOrcid('0000-0002-1825-0097')).toBe('0000-0002-1825-0097');
  });
});
