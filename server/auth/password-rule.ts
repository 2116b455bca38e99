import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import * as zxcvbnCommon from '@zxcvbn-ts/language-common';

/** Shortest and longest password accepted (also enforced by better-auth and the shared form schema). */
export const PASSWORD_MIN_LENGTH = 10;
export const PASSWORD_MAX_LENGTH = 128;
/**
 * Lowest zxcvbn score accepted (0–4; 3 means "safely unguessable", about 10^8 guesses or more,
 * per the zxcvbn scoring scale). Common passwords, keyboard walks and repeats score 0–2.
 */
export const PASSWORD_MIN_SCORE = 3;

const strength = new ZxcvbnFactory({
  dictionary: { ...zxcvbnCommon.dictionary },
  graphs: zxcvbnCommon.adjacencyGraphs,
});

/**
 * The product's one password rule, applied wherever a password is set (self-registration,
 * reset, accounts made by an admin). Returns a message for the person, or null when the
 * password is acceptable. `userInputs` (name, e-mail) count as easy to guess.
 */
export function passwordProblem(password: string, userInputs: string[] = []): string | null {
  if (password.length < PASSWORD_MIN_LENGTH) return `Use at least ${PASSWORD_MIN_LENGTH} characters for the password.`;
  if (password.length > PASSWORD_MAX_LENGTH) return `Keep the password under ${PASSWORD_MAX_LENGTH} characters.`;
  if (new Set(password).size === 1) return 'A password of one repeated character is too easy to guess. Choose another.';
  const result = strength.check(password, userInputs);
  if (result.score < PASSWORD_MIN_SCORE) {
    return 'This password is too common or too easy to guess. Use a longer phrase of unrelated words.';
  }
  return null;
}
