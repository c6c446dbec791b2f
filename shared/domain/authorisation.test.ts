import { describe, expect, it } from 'vitest';
import { authorisationCovers, coveringAuthorisation, type Authorisation } from './authorisation';
import { inWords } from '../i18n/phrase';

// Certifying staff sign only within the scope and validity of their authorisation: EASA Part-145 145.A.30 and
// 145.A.35 (from memory). Types, chapters and dates are invented.
const b1: Authorisation = {
  category: 'B1',
  typeCodes: ['RX-4'],
  scope: ['29', '32'],
  expiresOn: '2026-06-30',
};
const work = { typeCode: 'RX-4', chapters: ['29'] };

describe('authorisationCovers', () => {
  it.each([
    ['the last millisecond of its expiry day (UTC)', '2026-06-30T23:59:59.999Z', { ok: true }],
    [
      'the first millisecond after it',
      '2026-07-01T00:00:00.000Z',
      { ok: false, reason: 'the authorisation expired on 30 Jun 2026' },
    ],
  ])('when the signature is at %s, then %j', (_what, at, expected) => {
    expect(inWords(authorisationCovers(b1, work, at))).toEqual(expected);
  });

  it('when the type is another, then the reason names both types', () => {
    expect(
      inWords(authorisationCovers(b1, { typeCode: 'RL-2', chapters: ['29'] }, '2026-01-01T00:00:00Z')),
    ).toEqual({
      ok: false,
      reason: 'the authorisation covers RX-4, not RL-2',
    });
  });

  it('when the work is in a chapter outside the scope, or unclassified, then the reason names it', () => {
    expect(
      inWords(authorisationCovers(b1, { typeCode: 'RX-4', chapters: ['12', null] }, '2026-01-01T00:00:00Z')),
    ).toEqual({
      ok: false,
      reason: 'the authorisation does not cover ATA 12 Servicing, work not classified by ATA chapter',
    });
  });

  it('when it was withdrawn before the signature, then it does not cover', () => {
    const withdrawn = { ...b1, revokedAt: '2026-02-01T00:00:00Z' };
    expect(inWords(authorisationCovers(withdrawn, work, '2026-03-01T00:00:00Z'))).toEqual({
      ok: false,
      reason: 'the authorisation was withdrawn',
    });
  });
});

describe('coveringAuthorisation', () => {
  it('when a person has none, then it says so; when one of two covers, then that one is used', () => {
    expect(inWords(coveringAuthorisation([], work, '2026-01-01T00:00:00Z'))).toEqual({
      ok: false,
      reason: 'no certifying authorisation is recorded for this person',
    });
    const all = { ...b1, scope: ['all'], typeCodes: ['RL-2'] };
    expect(coveringAuthorisation([all, b1], work, '2026-01-01T00:00:00Z')).toEqual({
      ok: true,
      authorisation: b1,
    });
  });
});
