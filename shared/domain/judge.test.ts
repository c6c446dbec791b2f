import { describe, expect, it } from 'vitest';
import type { Checkpoint } from '../schemas/limits';
import { worstVerdict } from './bands';
import { judgeReading, judgeSubmission } from './judge';
import { band, plainGlass } from '@tests/setup/domain-fixtures';

// An invented 0 to 10 L glass: below 2 L out of limits, 2 to 4 L service, 4 to 10 L in limits.
const glass: Checkpoint = {
  ...plainGlass,
  bands: [
    band('low', [0, true], [2, false], 'out_of_limits'),
    band('top_up', [2, true], [4, false], 'service'),
    band('ok', [4, true], [10, true], 'in_limits'),
  ],
};
const second: Checkpoint = { ...glass, code: 'sys2.level', label: 'System 2 level' };
const card = [glass, second];
const context = {};
const litres = (value: number) => ({ value, unit: 'L' as const });

describe('worstVerdict', () => {
  it('when readings disagree, then the check takes the most severe verdict', () => {
    expect(worstVerdict(['in_limits', 'service', 'in_limits'])).toBe('service');
    expect(worstVerdict(['service', 'out_of_limits', 'in_limits'])).toBe('out_of_limits');
    expect(worstVerdict(['out_of_limits', 'service'])).toBe('out_of_limits');
  });

  it('when there is no reading, then the check is in limits', () => {
    expect(worstVerdict([])).toBe('in_limits');
    expect(worstVerdict(['in_limits'])).toBe('in_limits');
  });
});

describe('judgeReading', () => {
  it('when nothing was read, then the checkpoint is empty, not judged', () => {
    expect(judgeReading(glass, undefined, context)).toEqual({ kind: 'empty' });
  });

  it('when the reading fits a band, then it gets that band verdict', () => {
    const judged = judgeReading(glass, litres(3), context);
    expect(judged.kind === 'verdict' && judged.evaluation.verdict).toBe('service');
  });

  it('when the reading cannot be judged, then it carries the refusal, never a verdict', () => {
    const judged = judgeReading(glass, { answer: true }, context);
    expect(judged.kind).toBe('invalid');
    expect(judged.kind === 'invalid' && judged.error.code).toBe('wrong_entry');
  });
});

describe('judgeSubmission: a complete check', () => {
  it('when every checkpoint is read, then there is no problem and the verdict is the worst reading', () => {
    const judged = judgeSubmission(card, {
      readings: [
        { code: 'sys2.level', entry: litres(1) },
        { code: 'sys1.level', entry: litres(5) },
      ],
      context,
    });
    expect(judged.problems).toEqual([]);
    expect(judged.verdict).toBe('out_of_limits');
    expect(judged.readings.map((r) => [r.code, r.evaluation.verdict])).toEqual([
      ['sys2.level', 'out_of_limits'],
      ['sys1.level', 'in_limits'],
    ]);
    expect(judged.card.map((row) => row.checkpoint.code)).toEqual(['sys1.level', 'sys2.level']);
    expect(judged.card.map((row) => row.judgement.kind)).toEqual(['verdict', 'verdict']);
  });

  it('when every reading is in limits, then the check is in limits', () => {
    const judged = judgeSubmission(card, {
      readings: card.map((c) => ({ code: c.code, entry: litres(6) })),
      context,
    });
    expect(judged.verdict).toBe('in_limits');
  });
});

describe('judgeSubmission: what cannot be signed', () => {
  it('when a checkpoint is not read, then it is missing and shown empty', () => {
    const judged = judgeSubmission(card, { readings: [{ code: 'sys1.level', entry: litres(3) }], context });
    expect(judged.problems).toEqual([{ kind: 'readings_missing', missing: [second] }]);
    expect(judged.card[1]!.judgement).toEqual({ kind: 'empty' });
    expect(judged.verdict).toBe('service');
  });

  it('when a reading names a checkpoint off the card, then it is refused by its place in the list', () => {
    const judged = judgeSubmission([glass], {
      readings: [
        { code: 'sys1.level', entry: litres(5) },
        { code: 'sys2.level', entry: litres(5) },
      ],
      context,
    });
    expect(judged.problems).toEqual([{ kind: 'unknown_checkpoint', index: 1, code: 'sys2.level' }]);
  });

  it('when a checkpoint is read twice, then the second is refused and the first counts', () => {
    const judged = judgeSubmission([glass], {
      readings: [
        { code: 'sys1.level', entry: litres(5) },
        { code: 'sys1.level', entry: litres(1) },
      ],
      context,
    });
    expect(judged.problems).toEqual([{ kind: 'duplicate_reading', index: 1, checkpoint: glass }]);
    expect(judged.verdict).toBe('in_limits');
  });

  it('when a reading cannot be judged, then it is a problem, shown invalid, and adds no verdict', () => {
    const judged = judgeSubmission(card, {
      readings: [
        { code: 'sys1.level', entry: { answer: false } },
        { code: 'sys2.level', entry: litres(3) },
      ],
      context,
    });
    expect(judged.problems).toHaveLength(1);
    expect(judged.problems[0]).toMatchObject({ kind: 'invalid_reading', index: 0, checkpoint: glass });
    expect(judged.card[0]!.judgement.kind).toBe('invalid');
    expect(judged.readings.map((r) => r.code)).toEqual(['sys2.level']);
    expect(judged.verdict).toBe('service');
  });

  it('when several things are wrong, then they come in the order sent, the missing ones last', () => {
    const judged = judgeSubmission(card, {
      readings: [
        { code: 'nose.tyre', entry: litres(5) },
        { code: 'sys1.level', entry: { answer: true } },
      ],
      context,
    });
    expect(judged.problems.map((p) => p.kind)).toEqual([
      'unknown_checkpoint',
      'invalid_reading',
      'readings_missing',
    ]);
  });
});
