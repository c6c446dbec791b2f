import { describe, expect, it } from 'vitest';
import i18next from 'i18next';
import { formatFigure, usageFlown, usageProblem, type UsageProblem } from './usage';
import { phraseWords } from '../i18n/phrase';

/** The problem's words in a language (English, the server's, by default). */
const words = (problem: UsageProblem | null, language = 'en') =>
  problem && phraseWords(problem.reason, i18next.getFixedT(language));

// The limits of one entry are the server's defaults: a day of flying at most (24 h) and 50 flights or landings.
// A helicopter air ambulance flies far less in a day; the figures only catch slips. Common practice, no source.
const limits = { hours: 24, flights: 50, landings: 50 };
const last = { hours: 1234.5, flights: 400, landings: 410, recordedAt: '2026-12-02T14:05:00Z' };

describe('usageProblem', () => {
  it('when the figures move forward within the limits, then there is no problem', () => {
    expect(usageProblem(last, { hours: 1236.5, flights: 401, landings: 413 }, limits)).toBeNull();
  });

  it('when the figures equal the last ones, then nothing was flown and they are accepted', () => {
    expect(usageProblem(last, { hours: 1234.5, flights: 400, landings: 410 }, limits)).toBeNull();
  });

  it('when hours go back a tenth, then the refusal names the last figure and when it was recorded', () => {
    const problem = usageProblem(last, { hours: 1234.4, flights: 401, landings: 411 }, limits);
    expect(problem).toMatchObject({ kind: 'backwards', field: 'hours' });
    expect(words(problem)).toBe(
      'Hours cannot go back: the last figure is 1 234.5 h, recorded 2 Dec 2026, 14:05 UTC. Read the figure again.',
    );
  });

  it('when flights or landings go back, then that figure is named', () => {
    expect(usageProblem(last, { hours: 1235, flights: 399, landings: 411 }, limits)?.field).toBe('flights');
    expect(words(usageProblem(last, { hours: 1235, flights: 401, landings: 409 }, limits))).toMatch(
      /^Landings cannot go back: the last figure is 410 landings/,
    );
    const one = { ...last, flights: 1 };
    expect(words(usageProblem(one, { hours: 1235, flights: 0, landings: 410 }, limits))).toMatch(
      /^Flights cannot go back: the last figure is 1 flight, recorded/,
    );
  });

  it('when the last figures were set at the desk, then the refusal says so', () => {
    const desk = { ...last, recordedAt: null };
    expect(words(usageProblem(desk, { hours: 1200, flights: 400, landings: 410 }, limits))).toContain(
      '1 234.5 h, set at the desk',
    );
  });

  it('when hours jump exactly the limit, then they are accepted; a tenth more is refused', () => {
    expect(usageProblem(last, { hours: 1258.5, flights: 400, landings: 410 }, limits)).toBeNull();
    const problem = usageProblem(last, { hours: 1258.6, flights: 400, landings: 410 }, limits);
    expect(problem).toMatchObject({ kind: 'jump', field: 'hours' });
    expect(words(problem)).toBe(
      'Hours jump by 24.1 h, more than the 24.0 h one entry may add: the last figure is 1 234.5 h, ' +
        'recorded 2 Dec 2026, 14:05 UTC. Read the figure again; a longer gap is entered at the desk.',
    );
  });

  it('when flights or landings jump past 50, then they are refused', () => {
    expect(usageProblem(last, { hours: 1235, flights: 450, landings: 410 }, limits)).toBeNull();
    expect(usageProblem(last, { hours: 1235, flights: 451, landings: 410 }, limits)?.field).toBe('flights');
    expect(usageProblem(last, { hours: 1235, flights: 400, landings: 461 }, limits)).toMatchObject({
      kind: 'jump',
      field: 'landings',
    });
  });
});

describe('usageProblem on a German screen', () => {
  it('when the figures go back or jump, then the refusal reads in German with German figures', () => {
    expect(words(usageProblem(last, { hours: 1234.4, flights: 401, landings: 411 }, limits), 'de')).toMatch(
      /^Stunden können nicht zurückgehen: Der letzte Wert ist 1 234,5 h, erfasst am .*2026.*\. Lesen Sie den Wert erneut ab\.$/,
    );
    const desk = { ...last, flights: 1, recordedAt: null };
    expect(words(usageProblem(desk, { hours: 1235, flights: 0, landings: 410 }, limits), 'de')).toBe(
      'Flüge können nicht zurückgehen: Der letzte Wert ist 1 Flug, im Büro eingetragen. Lesen Sie den Wert erneut ab.',
    );
    expect(words(usageProblem(last, { hours: 1235, flights: 400, landings: 1461 }, limits), 'de')).toMatch(
      new RegExp(
        '^Landungen steigen um 1 051 Landungen, mehr als die 50 Landungen, die ein Eintrag hinzufügen darf: ' +
          'Der letzte Wert ist 410 Landungen, erfasst am .+\\. Lesen Sie den Wert erneut ab; ' +
          'eine längere Lücke wird im Büro eingetragen\\.$',
      ),
    );
  });
});

describe('usageFlown', () => {
  it('when hours are in tenths, then the difference has no binary fraction left over', () => {
    expect(
      usageFlown({ hours: 0.1, flights: 0, landings: 0 }, { hours: 0.3, flights: 1, landings: 2 }),
    ).toEqual({ hours: 0.2, flights: 1, landings: 2 });
  });
});

describe('formatFigure', () => {
  it('when a figure has thousands, then they are grouped with a space', () => {
    expect(formatFigure('hours', 1234567.5)).toBe('1 234 567.5 h');
    expect(formatFigure('hours', 12)).toBe('12.0 h');
    expect(formatFigure('flights', 1000)).toBe('1 000 flights');
    expect(formatFigure('landings', 3)).toBe('3 landings');
    expect(formatFigure('flights', 1)).toBe('1 flight');
    expect(formatFigure('landings', 0)).toBe('0 landings');
  });

  it('when the screen reads German, then the decimal comma and the German words are written', () => {
    const de = i18next.getFixedT('de');
    expect(formatFigure('hours', 1234.5, de)).toBe('1 234,5 h');
    expect(formatFigure('flights', 1, de)).toBe('1 Flug');
    expect(formatFigure('landings', 412, de)).toBe('412 Landungen');
  });
});
