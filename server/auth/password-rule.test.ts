import { describe, expect, it } from 'vitest';
import { demoPassword } from '../services/seed.service';
import { passwordProblem } from './password-rule';

describe('passwordProblem', () => {
  it.each(['password12', '1234567890', 'qwertyuiop', 'letmein123', 'Password123!'])('When the password is the common "%s", then it is refused', (password) => {
    expect(passwordProblem(password)).toMatch(/too common|easy to guess/);
  });

  it('When the password is one character repeated, then it is refused', () => {
    expect(passwordProblem('zzzzzzzzzzzzzz')).toMatch(/repeated character/);
  });

  it('When the password is too short or too long, then it is refused with the limit', () => {
    expect(passwordProblem('short')).toMatch(/at least 10/);
    expect(passwordProblem('x'.repeat(129))).toMatch(/under 128/);
  });

  it('When the password is the demo password, then it passes (the demo accounts keep working)', () => {
    expect(passwordProblem(demoPassword)).toBeNull();
  });

  it('When the password is the e-mail address, then it is refused', () => {
    expect(passwordProblem('dana.forecaster@office.test', ['dana.forecaster@office.test'])).not.toBeNull();
  });
});
