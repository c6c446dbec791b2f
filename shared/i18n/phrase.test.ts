import { readFileSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import i18next from 'i18next';
import { languages } from './languages';
import { inWords, instantValue, phrase, phraseWords } from './phrase';
import { deriveAirframeStatus } from '../domain/status';
import { consumptionOverWindow } from '../domain/consumption';

// The unit tests' i18next (set up by the server's translator, see vite.config.ts) in one language.
const translatorFor = (language: string) => i18next.getFixedT(language);

const root = join(import.meta.dirname, '..', '..');

function sources(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return sources(path);
    return /\.tsx?$/.test(name) && !/\.test\.tsx?$/.test(name) ? [path] : [];
  });
}

const catalogue = (language: string) =>
  JSON.parse(readFileSync(join(import.meta.dirname, 'locales', language, 'words.json'), 'utf8')) as {
    phrase: Record<string, string>;
  };

describe('phrases', () => {
  it('when the code makes a phrase, then every language has its key (or its plural forms)', () => {
    const used = new Set<string>();
    for (const file of ['shared', 'server', 'src'].flatMap((dir) => sources(join(root, dir))))
      for (const m of readFileSync(file, 'utf8').matchAll(/\bphrase\(\s*'(\w+)'/g)) used.add(m[1]!);
    expect(used.size).toBeGreaterThan(30);
    for (const language of languages) {
      const keys = new Set(
        Object.keys(catalogue(language).phrase).map((k) => k.replace(/_(one|other)$/, '')),
      );
      expect({ language, missing: [...used].filter((key) => !keys.has(key)) }).toEqual({
        language,
        missing: [],
      });
    }
  });

  it('when a phrase holds a date, a number, a kind of check and another phrase, then each language writes them its own way', () => {
    const limit = phrase('oneOf', {
      parts: {
        phrases: [
          phrase('untilInstant', { at: instantValue('2026-12-12T23:59:59.999Z') }),
          phrase('untilHours', { hours: { decimal: 1234.5, places: 1 } }),
        ],
        joiner: 'or',
      },
    });
    const deferred = phrase('defectDeferred', {
      number: 4,
      reason: { phrase: phrase('deferred', { limit: { phrase: limit } }) },
      description: 'Cabin step light inoperative',
    });
    expect(phraseWords(deferred, translatorFor('en'))).toBe(
      'Defect 4 deferred until 12 Dec 2026, 23:59 UTC or until 1234.5 airframe hours: Cabin step light inoperative',
    );
    expect(phraseWords(deferred, translatorFor('de'))).toBe(
      'Beanstandung 4 zurückgestellt bis 12. Dez. 2026, 23:59 UTC oder bis 1.234,5 Zellenstunden: Cabin step light inoperative',
    );
    const ranOut = phrase('usedUpByFlights', {
      kind: { checkKind: 'pre_flight' },
      signed: instantValue('2026-12-01T08:00:00Z'),
      count: 1,
    });
    expect(phraseWords(ranOut, translatorFor('en'))).toBe(
      'Pre-flight of 1 Dec 2026, 08:00 UTC used up by 1 flight',
    );
    expect(phraseWords(ranOut, translatorFor('de'))).toMatch(
      /^Vorflug vom 1\. Dez\. 2026, 08:00 UTC durch 1 Flug/,
    );
  });

  it('when the airframe state is derived, then its reasons carry no words of any language, and read in both', () => {
    const status = deriveAirframeStatus({
      now: '2026-01-15T12:00:00Z',
      timeZone: 'UTC',
      validity: { pre_flight: { hours: 24 } },
      checks: [],
      inProgress: [{ id: 'd', kind: 'ground_run', startedAt: '2026-01-15T11:50:00Z', startedBy: 'M2' }],
    });
    expect(status.reasons).toEqual([
      {
        key: 'inProgressSince',
        values: { kind: { checkKind: 'ground_run' }, at: { instant: '2026-01-15T11:50:00.000Z' } },
      },
    ]);
    expect(inWords(status.reasons, translatorFor('en'))).toEqual([
      'Ground run in progress since 15 Jan 2026, 11:50 UTC',
    ]);
    expect(inWords(status.reasons, translatorFor('de'))).toEqual([
      expect.stringMatching(/^Standlauf in Arbeit seit 15\. Jan\. 2026, 11:50 UTC$/),
    ]);
  });
});

describe('fluid alerts as phrases', () => {
  it('when a consumption alert is made, then it names the system and the rate in each language', () => {
    const summary = consumptionOverWindow({
      system: 'sys1',
      events: [{ at: '2026-03-05T00:00:00Z', system: 'sys1', litres: 0.6 }],
      flights: [{ at: '2026-03-05T00:00:00Z', flightHours: 2 }],
      windowEnd: '2026-03-10T00:00:00Z',
      windowDays: 10,
      alertLPerFh: 0.08,
    });
    expect(inWords(summary.alert?.message, translatorFor('en'))).toBe(
      'System 1: 0.300 L per flight hour over 10 days, at or above the alert level of 0.08 L. Look for a leak.',
    );
    expect(inWords(summary.alert?.message, translatorFor('de'))).toMatch(
      /^System 1: 0,300 L je Flugstunde in 10 Tagen, auf oder über der Warnschwelle von 0,08 L\./,
    );
  });
});

describe('namespaced phrases', () => {
  it('when the code makes a phrase with a namespaced key, then every language has that key', () => {
    // phrase('refusals:defects.deferralInPast') and the limits engine's problem('overlap') (engineeringTypes:problems).
    const used = new Set<string>();
    for (const file of ['shared', 'server', 'src'].flatMap((dir) => sources(join(root, dir)))) {
      const text = readFileSync(file, 'utf8');
      for (const m of text.matchAll(/\bphrase\(\s*'(\w+:[\w.]+)'/g)) used.add(m[1]!);
      if (file.endsWith(join('shared', 'domain', 'limits.ts')))
        for (const m of text.matchAll(/\bproblem\(\s*'(\w+)'/g))
          used.add(`engineeringTypes:problems.${m[1]!}`);
    }
    expect(used.size).toBeGreaterThan(20);
    for (const language of languages) {
      const has = (key: string) => {
        const [namespace, path] = key.split(':') as [string, string];
        const tree = JSON.parse(
          readFileSync(join(import.meta.dirname, 'locales', language, `${namespace}.json`), 'utf8'),
        ) as Record<string, unknown>;
        const parts = path.split('.');
        const last = parts.pop()!;
        let node: unknown = tree;
        for (const part of parts) node = (node as Record<string, unknown> | undefined)?.[part];
        const leaf = node as Record<string, unknown> | undefined;
        return !!leaf && (last in leaf || `${last}_one` in leaf || `${last}_other` in leaf);
      };
      expect({ language, missing: [...used].filter((key) => !has(key)) }).toEqual({ language, missing: [] });
    }
  });
});
