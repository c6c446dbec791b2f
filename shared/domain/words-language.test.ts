import { describe, expect, it } from 'vitest';
import i18next, { createInstance } from 'i18next';
import { english } from '../i18n/english';
import words from '../i18n/locales/de/words.json';
import { auditActionLabel, checkKindLabel, checkKindLabels, verdictLabel } from '../schemas/plain';
import { formatDay, formatInstant } from './when';
import { ataChapterWords, authorisationWords } from './authorisation';
import { describeContext, describeEntry, describeReading, positionLabel, systemWords } from './words';

// The shared words in another language, with the translate function the server passes (translatorFor): a fixed
// German t over the same catalogues. Without one they read in English, as every caller had them before.
const instance = createInstance();
void instance.init({
  resources: { en: english, de: { words } },
  lng: 'de',
  fallbackLng: 'en',
  interpolation: { escapeValue: false },
  initAsync: false,
});
const de = instance.getFixedT('de');

describe('shared words in German', () => {
  it('when the server asks in German, then conditions, entries and readings read in German with a decimal comma', () => {
    expect(
      describeContext({ attitude: 'on_wheels', systemPressure: 'on', ambientTempC: 18 }, undefined, de),
    ).toBe('Auf Rädern · Systemdruck an · 18,0 °C');
    expect(describeContext({}, undefined, de)).toBe('Keine Konfiguration nötig');
    expect(describeEntry({ value: 7, unit: 'L' }, de)).toBe('7,00 L');
    expect(describeEntry({ answer: true }, de)).toBe('Ja');
    expect(describeEntry(undefined, de)).toBe('Noch nicht abgelesen');
    expect(positionLabel('above_maximum', de)).toBe('Über Maximum');
    expect(describeReading({ dropsPerMinute: 0 }, 'in_limits', de)).toBe('Keine Leckage — zufriedenstellend');
    expect(describeReading({ dropsPerMinute: 3, leakState: 'dynamic' }, 'service', de)).toBe(
      '3 Tropfen/min, dynamisch — Handlungsbedarf',
    );
    expect(systemWords('sys2', [], de)).toBe('System 2');
    expect(checkKindLabel('pre_flight', de)).toBe('Vorflug');
    expect(verdictLabel('out_of_limits', de)).toBe('Außerhalb Grenzwerte');
    expect(auditActionLabel('hold.opened', de)).toBe('Luftfahrzeug gesperrt');
  });

  it('when an authorisation is written in German, then its chapters, words and day read German', () => {
    const terms = {
      category: 'B1',
      reference: 'CA-2',
      typeCodes: ['RX-4'],
      scope: ['12', '29'],
      expiresOn: '2027-03-01',
    };
    expect(authorisationWords(terms, de)).toBe(
      'B1 (CA-2) für RX-4, ATA 12 Wartungsdienste, ATA 29 Hydraulik, bis 1. März 2027',
    );
    expect(authorisationWords({ ...terms, reference: undefined, scope: ['all'] })).toBe(
      'B1 for RX-4, all chapters of the type, until 1 Mar 2027',
    );
    expect(ataChapterWords('45', de)).toBe('ATA 45');
  });

  it('when a German screen words an authorisation with its own translate function, then the day is German too', async () => {
    // A screen's t names no language; the words and the day both follow the screen (the process's i18next here).
    const terms = { category: 'B1', typeCodes: ['RX-4'], scope: ['all'], expiresOn: '2027-12-03' };
    await i18next.changeLanguage('de');
    try {
      expect(authorisationWords(terms)).toBe('B1 für RX-4, alle Kapitel des Musters, bis 3. Dez. 2027');
      expect(authorisationWords(terms, i18next.t)).toBe(
        'B1 für RX-4, alle Kapitel des Musters, bis 3. Dez. 2027',
      );
    } finally {
      await i18next.changeLanguage('en');
    }
    expect(ataChapterWords(null)).toBe('work not classified by ATA chapter');
  });

  it('when nobody passes a language, then every word stays the English it was', () => {
    expect(describeEntry({ value: 7, unit: 'L' })).toBe('7.00 L');
    expect(describeReading({ dropsPerMinute: 3, leakState: 'dynamic' }, 'service')).toBe(
      '3 drops/min, dynamic — needs attention',
    );
    expect(checkKindLabels.ground_run).toBe('Ground run');
    expect(Object.keys(checkKindLabels)).toEqual(['pre_flight', 'ground_run', 'after_flight', 'servicing']);
  });

  it('when a date is written for German, then the day and month read German and English is unchanged', () => {
    expect(formatInstant('2026-12-02T14:05:00Z')).toBe('2 Dec 2026, 14:05 UTC');
    expect(formatInstant('2026-12-02T14:05:00Z', 'UTC', 'de')).toBe('2. Dez. 2026, 14:05 UTC');
    expect(formatDay('2026-03-01', 'de')).toBe('1. März 2026');
    expect(formatDay('2026-03-01')).toBe('1 Mar 2026');
  });
});
