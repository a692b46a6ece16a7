// What a new password may not be, beyond the schema's length: only spaces; the demo password that
// is printed in the README; the person's own name or e-mail address; or anything the zxcvbn
// estimate (zxcvbn-ts with its common-password list, keyboard layouts, repeats, sequences and
// dates) puts under 10^10 guesses — which is where lists of breached passwords and their usual
// variations ("Summer2024!!", "P@ssword2024") end up. Applied to every password a person chooses
// and every temporary one an administrator sets; the demo seed writes its hashes directly.
import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import { adjacencyGraphs, dictionary } from '@zxcvbn-ts/language-common';
import demoPeople from '../db/seed/demo-people.json';

// Levenshtein matching is left off: it costs a few hundred milliseconds of the event loop per check
// and the dictionary, l33t and pattern matchers already catch the variants.
const estimator = new ZxcvbnFactory({ dictionary, graphs: adjacencyGraphs });
/** zxcvbn's top score: at least 10^10 guesses. */
const MIN_SCORE = 4;

export type PasswordOwner = { name: string; email: string };

const letters = (text: string) => text.toLowerCase().replace(/[^\p{L}\p{N}]/gu, '');
const parts = (text: string) => text.toLowerCase().split(/[^\p{L}\p{N}]+/u).filter(Boolean);

/** Whether the password holds the word: long words anywhere, short ones (e.g. "Ann") only standing alone. */
function holds(password: string, word: string): boolean {
  if (word.length >= 4) return letters(password).includes(word);
  return word.length === 3 && parts(password).includes(word);
}

const weakBecause: Record<string, string> = {
  topTen: 'it is one of the most common passwords',
  topHundred: 'it is one of the most common passwords',
  common: 'it is a common password',
  similarToCommon: 'it is a common password with small changes',
  straightRow: 'it is a row of keys',
  keyPattern: 'it is a pattern on the keyboard',
  simpleRepeat: 'it repeats characters',
  extendedRepeat: 'it repeats a group of characters',
  sequences: 'it is a sequence such as abc or 123',
  recentYears: 'it leans on a year',
  dates: 'it leans on a date',
  namesByThemselves: 'it is a name',
  commonNames: 'it is made of common names',
};

/** The reason this password may not be used, in the person's words; null when it may. */
export function passwordProblem(password: string, owner: PasswordOwner): string | null {
  if (password.trim() === '') return 'A password of only spaces is not allowed';
  if (letters(password) === letters(demoPeople.password)) return 'This is the public demo password; choose one of your own';
  const nameWords = parts(owner.name);
  if (holds(password, letters(owner.name)) || nameWords.some((w) => holds(password, w))) return 'Leave your name out of your password';
  const local = owner.email.split('@')[0] ?? '';
  if (holds(password, letters(local)) || parts(local).some((w) => w.length >= 4 && holds(password, w))) return 'Leave your e-mail address out of your password';
  const result = estimator.check(password, ['hotwell', ...nameWords, ...parts(local)]);
  if (result.score >= MIN_SCORE) return null;
  const why = (result.feedback.warning && weakBecause[result.feedback.warning]) || 'it follows a pattern that is quick to try';
  return `Too easy to guess: ${why}. Use three or four unrelated words, or a longer mix`;
}
