import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import {
  recordProblem,
  signedEventProblem,
  type StoredCheckRow,
  type StoredReadingRow,
} from './record-check';

const id = '5b0b2a52-6f0e-4b8e-9a43-2f1d4c1c0a11';
const signedReadings = [
  { code: 'sys1.level', entry: { unit: 'L', value: 7 }, verdict: 'in_limits', bandId: 'normal' },
  { code: 'acc.precharge', entry: { unit: 'bar', value: 82 }, verdict: 'service', bandId: 'low' },
  { code: 'leaks.none', entry: { answer: true }, verdict: 'in_limits', bandId: 'yes' },
];
// Stored as the signing path stores it: canonical JSON (keys in order), hashed with SHA-256.
const signedContent = JSON.stringify({
  id,
  kind: 'pre_flight',
  readings: signedReadings.map((r) => ({
    bandId: r.bandId,
    code: r.code,
    entry: r.entry,
    verdict: r.verdict,
  })),
});
const sha256 = (text: string) => createHash('sha256').update(text, 'utf8').digest('hex');

function stored() {
  const check: StoredCheckRow = {
    id,
    kind: 'pre_flight',
    verdict: 'service',
    contentHash: sha256(signedContent),
    signedContent,
  };
  const readings: StoredReadingRow[] = [
    {
      checkpointCode: 'sys1.level',
      entry: '{"unit":"L","value":7}',
      value: 7,
      verdict: 'in_limits',
      bandId: 'normal',
    },
    {
      checkpointCode: 'acc.precharge',
      entry: '{"unit":"bar","value":82}',
      value: 82,
      verdict: 'service',
      bandId: 'low',
    },
    { checkpointCode: 'leaks.none', entry: '{"answer":true}', value: 1, verdict: 'in_limits', bandId: 'yes' },
  ];
  return { check, readings };
}

describe('the record check: one reason for every way a signed check can be changed', () => {
  it('when nothing was touched, then there is no problem', () => {
    const { check, readings } = stored();
    expect(recordProblem(id, check, readings)).toBeNull();
  });

  it('when the check row is gone, then it is reported missing', () => {
    expect(recordProblem(id, null, [])).toBe(`check ${id} is missing`);
  });

  it('when the signed content was emptied, then it is reported as having none', () => {
    const { check, readings } = stored();
    expect(recordProblem(id, { ...check, signedContent: null }, readings)).toBe(
      `check ${id} has no signed content`,
    );
    expect(recordProblem(id, { ...check, signedContent: '' }, readings)).toBe(
      `check ${id} has no signed content`,
    );
  });

  it('when the signed content or its hash is changed, then the content no longer matches its signature hash', () => {
    const { check, readings } = stored();
    const edited = signedContent.replace('"value":7', '"value":9');
    expect(recordProblem(id, { ...check, signedContent: edited }, readings)).toBe(
      `check ${id}: the signed content does not match its signature hash`,
    );
    expect(recordProblem(id, { ...check, contentHash: sha256(edited) }, readings)).toBe(
      `check ${id}: the signed content does not match its signature hash`,
    );
  });

  it('when the signed content is not a record with readings but matches its hash, then it is reported unreadable', () => {
    const { check, readings } = stored();
    for (const text of ['not json', '{"kind":"pre_flight"}', '{"kind":"pre_flight","readings":{}}'])
      expect(recordProblem(id, { ...check, signedContent: text, contentHash: sha256(text) }, readings)).toBe(
        `check ${id}: its signed content is unreadable`,
      );
  });

  it('when the kind is changed after signing, then the kind is reported', () => {
    const { check, readings } = stored();
    expect(recordProblem(id, { ...check, kind: 'after_flight' }, readings)).toBe(
      `check ${id}: its kind was changed after signing`,
    );
  });

  it('when a reading is removed or one is added, then the reading count is reported', () => {
    const { check, readings } = stored();
    const reason = `check ${id}: readings were added or removed after signing`;
    expect(recordProblem(id, check, readings.slice(0, 2))).toBe(reason);
    expect(recordProblem(id, check, [...readings, readings[0]!])).toBe(reason);
    expect(recordProblem(id, check, [])).toBe(reason);
  });
});

describe('the record check: a reading or verdict changed after signing', () => {
  it.each([
    ['checkpoint', { checkpointCode: 'sys2.level' }],
    ['entry', { entry: '{"unit":"L","value":7.5}' }],
    ['entry', { entry: '{"unit":"qt","value":7}' }],
    ['entry', { entry: 'not json' }],
    ['verdict', { verdict: 'out_of_limits' }],
    ['band', { bandId: 'high' }],
    ['value', { value: 7.5 }],
  ] as const)(
    'when a reading’s %s is changed after signing, then that reading and that field are named',
    (field, change) => {
      const { check, readings } = stored();
      readings[0] = { ...readings[0]!, ...change };
      expect(recordProblem(id, check, readings)).toBe(
        `check ${id}: reading "sys1.level" was changed after signing (its ${field})`,
      );
    },
  );

  it('when a yes/no reading’s stored value no longer says what was answered, then the value is named', () => {
    const { check, readings } = stored();
    readings[2] = { ...readings[2]!, value: 0 };
    expect(recordProblem(id, check, readings)).toBe(
      `check ${id}: reading "leaks.none" was changed after signing (its value)`,
    );
  });

  it('when a later reading is changed, then that reading is named, not the first', () => {
    const { check, readings } = stored();
    readings[1] = { ...readings[1]!, value: 90 };
    expect(recordProblem(id, check, readings)).toBe(
      `check ${id}: reading "acc.precharge" was changed after signing (its value)`,
    );
  });

  it.each(['in_limits', 'out_of_limits'] as const)(
    'when the check’s verdict is changed to %s after signing, then the verdict is reported',
    (verdict) => {
      const { check, readings } = stored();
      expect(recordProblem(id, { ...check, verdict }, readings)).toBe(
        `check ${id}: its verdict was changed after signing`,
      );
    },
  );

  it('when the worst reading is out of limits, then only an out-of-limits verdict matches', () => {
    const readingsSigned = [
      { bandId: 'low', code: 'sys1.level', entry: { unit: 'L', value: 1 }, verdict: 'out_of_limits' },
      { bandId: 'low', code: 'acc.precharge', entry: { unit: 'bar', value: 82 }, verdict: 'service' },
    ];
    const content = JSON.stringify({ kind: 'pre_flight', readings: readingsSigned });
    const rows: StoredReadingRow[] = readingsSigned.map((r) => ({
      checkpointCode: r.code,
      entry: JSON.stringify(r.entry),
      value: r.entry.value,
      verdict: r.verdict as StoredReadingRow['verdict'],
      bandId: r.bandId,
    }));
    const check = { id, kind: 'pre_flight' as const, contentHash: sha256(content), signedContent: content };
    expect(recordProblem(id, { ...check, verdict: 'out_of_limits' }, rows)).toBeNull();
    expect(recordProblem(id, { ...check, verdict: 'service' }, rows)).toBe(
      `check ${id}: its verdict was changed after signing`,
    );
  });
});

describe('the signed event against its check', () => {
  const event = (contentHash: unknown) => ({
    entityId: id,
    payload: JSON.stringify({ contentHash, verdict: 'service' }),
  });

  it('when the event names the check’s hash, then there is no problem', () => {
    const { check } = stored();
    expect(signedEventProblem(event(check.contentHash), check)).toBeNull();
  });

  it('when the check row was deleted, then the event reports it removed', () => {
    expect(signedEventProblem(event('a'.repeat(64)), null)).toBe(`check ${id} was removed`);
  });

  it('when the check’s content and hash were both replaced, then the event reports its signature hash replaced', () => {
    const { check } = stored();
    const forged = signedContent.replace('"value":7', '"value":9');
    const replaced = { ...check, signedContent: forged, contentHash: sha256(forged) };
    expect(signedEventProblem(event(check.contentHash), replaced)).toBe(
      `check ${id}: its signature hash was replaced`,
    );
    expect(signedEventProblem({ entityId: id, payload: 'not json' }, check)).toBe(
      `check ${id}: its signature hash was replaced`,
    );
  });
});
