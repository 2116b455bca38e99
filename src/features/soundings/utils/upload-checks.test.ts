import { describe, expect, it } from 'vitest';
import { soundingLimits } from '../../../../shared/contracts/soundings';
import { batchCount, issueMessageWithoutPlace, planUpload } from './upload-checks';

describe('checks before upload', () => {
  it('when a file is empty or over 2 MB, refuses that file and sends the others', () => {
    const plan = planUpload([
      { name: 'a.csv', size: 1200 },
      { name: 'empty.csv', size: 0 },
      { name: 'huge.csv', size: soundingLimits.maxFileBytes + 1 },
    ]);
    expect(plan.send.map((f) => f.name)).toEqual(['a.csv']);
    expect(plan.refused.map((f) => f.fileName)).toEqual(['empty.csv', 'huge.csv']);
    expect(plan.refused[1]?.message).toContain('limit is 2.0 MB');
  });

  it('when there are more files than one batch allows, sends them in several batches', () => {
    expect(batchCount(1)).toBe(1);
    expect(batchCount(soundingLimits.maxFilesPerBatch)).toBe(1);
    expect(batchCount(soundingLimits.maxFilesPerBatch + 1)).toBe(2);
  });
});

describe('issue messages in the result list', () => {
  it('when the message repeats the file name, line and column, keeps only what is wrong', () => {
    expect(issueMessageWithoutPlace('bad (1).csv, line 11, column temperature_C: "abc" is not a number.', 'bad (1).csv')).toBe('"abc" is not a number.');
    expect(issueMessageWithoutPlace('a.csv: 27 of 53 levels have no wind.', 'a.csv')).toBe('27 of 53 levels have no wind.');
    expect(issueMessageWithoutPlace('Levels are out of order.', 'a.csv')).toBe('Levels are out of order.');
  });
});
