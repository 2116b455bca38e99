import { describe, expect, it } from 'vitest';
import { actionProblem } from './review-rules';

describe('refused actions in words', () => {
  it('explains a 403 on approve as the four-eyes rule and a 409 as a stale view', () => {
    expect(actionProblem('approve', 403, 'x').title).toBe('Another lead must approve this outlook');
    expect(actionProblem('publish', 409, 'Changed.').reload).toBe(true);
  });
});
