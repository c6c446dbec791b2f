import { describe, expect, it } from 'vitest';
import i18next from 'i18next';
import { toolRefusal, topUpToolRule, topUpWhat, type ToolRule } from './tools';
import { phraseWords } from '../i18n/phrase';
import { toolNumberFromTag, toolTagText, type SignedTool } from '../schemas/tools';

const gaugeRule: ToolRule = { kinds: ['pressure_gauge', 'nitrogen_charging_kit'], required: false };
/** The refusal's words in a language (English, the server's, by default). */
const words = (refusal: ReturnType<typeof toolRefusal>, language = 'en') =>
  refusal && phraseWords(refusal.reason, i18next.getFixedT(language));
const gauge = (changes: Partial<SignedTool & { retired: boolean }> = {}) => ({
  number: 'PG-014',
  kind: 'pressure_gauge' as const,
  description: 'Test gauge 0-250 bar',
  serial: 'TG-40562',
  calibrationDue: '2026-12-01',
  retired: false,
  ...changes,
});

describe('toolRefusal', () => {
  // A tool may be used up to and including its calibration due date (common practice, no source; the duty to use
  // calibrated tools is Part-145 145.A.40, from memory).
  it.each([
    ['2026-11-30', null],
    ['2026-12-01', null],
    ['2026-12-02', 'tool_calibration_overdue'],
    ['2027-01-01', 'tool_calibration_overdue'],
  ] as const)('when the gauge is due on 1 Dec 2026 and used on %s, then the refusal is %s', (day, code) => {
    expect(toolRefusal('Pre-charge', gaugeRule, gauge(), day)?.code ?? null).toBe(code);
  });

  it('when the calibration ran out, then the refusal names the gauge, the day in words and asks for another gauge', () => {
    expect(words(toolRefusal('Pre-charge', gaugeRule, gauge(), '2026-12-03'))).toBe(
      'Gauge PG-014 was due for calibration on 1 Dec 2026; use another gauge.',
    );
    expect(
      words(
        toolRefusal(
          'Pre-charge',
          gaugeRule,
          gauge({ kind: 'nitrogen_charging_kit', number: 'NK-3' }),
          '2026-12-03',
        ),
      ),
    ).toBe('Charging kit NK-3 was due for calibration on 1 Dec 2026; use another charging kit.');
  });

  it('when no tool is named, then only a checkpoint that requires one refuses, saying which kinds', () => {
    expect(toolRefusal('Pre-charge', gaugeRule, null, '2026-12-03')).toBeNull();
    expect(toolRefusal('Pre-charge', undefined, null, '2026-12-03')).toBeNull();
    const required = toolRefusal('Pre-charge', { ...gaugeRule, required: true }, null, '2026-12-03');
    expect(required?.code).toBe('tool_required');
    expect(words(required)).toBe(
      'Pre-charge is read with a pressure gauge or nitrogen charging kit from the tools register: scan its tag or pick it.',
    );
  });

  it('when the tool is retired, of another kind, or the checkpoint takes none, then each says so before the calibration', () => {
    expect(toolRefusal('Pre-charge', gaugeRule, gauge({ retired: true }), '2026-11-01')?.code).toBe(
      'tool_retired',
    );
    const wrongKind = toolRefusal(topUpWhat, topUpToolRule, gauge(), '2026-11-01');
    expect(wrongKind?.code).toBe('tool_wrong_kind');
    expect(words(wrongKind)).toBe('Gauge PG-014 is a pressure gauge; A top-up needs a servicing cart.');
    expect(toolRefusal('Leaks', undefined, gauge(), '2026-11-01')?.code).toBe('tool_not_asked');
    expect(words(toolRefusal('Pre-charge', gaugeRule, gauge({ retired: true }), '2026-11-01'))).toBe(
      'Gauge PG-014 has been retired from the tools register; use another.',
    );
    expect(words(toolRefusal('Leaks', undefined, gauge(), '2026-11-01'))).toBe(
      'Leaks is not read with a tool; remove Gauge PG-014.',
    );
  });

  it('when a German screen shows a refusal, then it reads in German with the day and the kinds in German', () => {
    expect(words(toolRefusal('Vorfülldruck', gaugeRule, gauge(), '2026-12-03'), 'de')).toMatch(
      /^Manometer PG-014 war am .*2026 zur Kalibrierung fällig; verwenden Sie ein anderes Manometer\.$/,
    );
    expect(words(toolRefusal(topUpWhat, topUpToolRule, gauge(), '2026-11-01'), 'de')).toBe(
      'Manometer PG-014 ist ein Manometer; Eine Nachfüllung braucht ein anderes Werkzeug (Servicewagen).',
    );
    expect(
      words(toolRefusal('Vorfülldruck', { ...gaugeRule, required: true }, null, '2026-12-03'), 'de'),
    ).toBe(
      'Vorfülldruck wird mit einem Werkzeug aus dem Werkzeugregister abgelesen (Manometer oder Stickstoff-Füllset): ' +
        'Scannen Sie sein Etikett oder wählen Sie es.',
    );
  });
});

describe('tool tags', () => {
  it('when a tool tag is scanned, then its number comes back; an airframe tag or stray code is not a tool', () => {
    expect(toolNumberFromTag(toolTagText('PG-014'))).toBe('PG-014');
    expect(toolNumberFromTag('  GAUGEWALK-TOOL:pg-014 ')).toBe('PG-014');
    expect(toolNumberFromTag('https://hangar.example/t/abc123')).toBeNull();
    expect(toolNumberFromTag('gaugewalk-tool:')).toBeNull();
  });
});
