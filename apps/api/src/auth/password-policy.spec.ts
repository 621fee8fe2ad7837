import { dictionary } from '@zxcvbn-ts/language-common';
import { passwordProblem } from './password-policy.js';

describe('password policy', () => {
  it('refuses fewer than 12 characters, counting characters rather than bytes', () => {
    expect(passwordProblem('short pass!')).toMatch(/at least 12/);
    // 12 characters, 24 bytes in UTF-8
    expect(passwordProblem('ééééé ñññ ßß')).toBeNull();
    expect(passwordProblem('ééééé ñññ ß')).toMatch(/at least 12/);
  });

  it('refuses common passwords from the zxcvbn-ts list, whatever their case', () => {
    const long = dictionary['passwords-common'].filter((p) => p.length >= 12);
    expect(long).toContain('qwerty123456');
    expect(passwordProblem('qwerty123456')).toMatch(/common passwords/);
    expect(passwordProblem('QWERTY123456')).toMatch(/common passwords/);
    expect(passwordProblem('leavemealone')).toMatch(/common passwords/);
  });

  it('refuses a run of one or two characters repeated', () => {
    expect(passwordProblem('aaaaaaaaaaaaaaaa')).not.toBeNull();
    expect(passwordProblem('abababababababab')).not.toBeNull();
  });

  it('accepts a passphrase and refuses one beyond the maximum', () => {
    expect(passwordProblem('violet kettle under the hill')).toBeNull();
    expect(passwordProblem('x1y2'.repeat(65))).toMatch(/at most 256/);
  });
});
