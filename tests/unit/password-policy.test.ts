// The password rules one by one. The "too easy to guess" verdicts are the zxcvbn-ts estimate's (its
// common-password list and pattern matchers), not figures of ours; the personal ones are our rules.
import { describe, expect, it } from 'vitest';
import { passwordProblem } from '../../server/lib/password-policy';

const ilse = { name: 'Ilse Brandvold', email: 'i.brandvold@fernhollow.example' };
const tom = { name: 'Tom Ek', email: 'duty7@fernhollow.example' };

describe('passwordProblem', () => {
  it('accepts unrelated words with a number, and a long mixed string', () => {
    expect(passwordProblem('slate otter cobalt lantern 47', ilse)).toBeNull();
    expect(passwordProblem('kT9#vQ2$wL5!pZ', ilse)).toBeNull();
  });

  it.each([
    ['password1234', 'a common password with digits (zxcvbn-ts)'],
    ['P@ssword2024', 'the same in l33t with a year (zxcvbn-ts)'],
    ['Summer2024!!', 'a season, a year and punctuation: under 10^10 guesses (zxcvbn-ts)'],
    ['qwertyuiop12', 'a keyboard row (zxcvbn-ts)'],
    ['abcdefghijkl', 'a sequence (zxcvbn-ts)'],
  ])('refuses %s as too easy to guess: %s', (password) => {
    expect(passwordProblem(password, ilse)).toMatch(/^Too easy to guess: .+\. Use three or four unrelated words/);
  });

  it('refuses only spaces, and the demo password however it is written', () => {
    expect(passwordProblem(' '.repeat(16), ilse)).toMatch(/only spaces/);
    expect(passwordProblem('hotwell-demo-2026', ilse)).toMatch(/demo password/);
    expect(passwordProblem('Hotwell Demo 2026', ilse)).toMatch(/demo password/);
  });

  it('refuses the person’s name or e-mail anywhere in it, in any case', () => {
    expect(passwordProblem('brandvold on the night shift', ilse)).toMatch(/name/);
    expect(passwordProblem('IlseBrandvold!!88', ilse)).toMatch(/name/);
    expect(passwordProblem('duty7 at the cooling tower', tom)).toMatch(/e-mail/);
  });

  it('takes a three-letter name only as a word of its own, so it does not catch ordinary words', () => {
    expect(passwordProblem('tom checks the basin 41', tom)).toMatch(/name/);
    expect(passwordProblem('atomic basin checks 41', tom)).toBeNull();
  });
});
