import { describe, expect, it } from 'vitest';
import { toolRefusal, topUpToolRule, type ToolRule } from './tools';
import { toolNumberFromTag, toolTagText, type SignedTool } from '../schemas/tools';

const gaugeRule: ToolRule = { kinds: ['pressure_gauge', 'nitrogen_charging_kit'], required: false };
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
    expect(toolRefusal('Pre-charge', gaugeRule, gauge(), '2026-12-03')?.message).toBe(
      'Gauge PG-014 was due for calibration on 1 Dec 2026; use another gauge.',
    );
    expect(
      toolRefusal(
        'Pre-charge',
        gaugeRule,
        gauge({ kind: 'nitrogen_charging_kit', number: 'NK-3' }),
        '2026-12-03',
      )?.message,
    ).toBe('Charging kit NK-3 was due for calibration on 1 Dec 2026; use another charging kit.');
  });

  it('when no tool is named, then only a checkpoint that requires one refuses, saying which kinds', () => {
    expect(toolRefusal('Pre-charge', gaugeRule, null, '2026-12-03')).toBeNull();
    expect(toolRefusal('Pre-charge', undefined, null, '2026-12-03')).toBeNull();
    expect(toolRefusal('Pre-charge', { ...gaugeRule, required: true }, null, '2026-12-03')).toEqual({
      code: 'tool_required',
      message:
        'Pre-charge is read with a pressure gauge or nitrogen charging kit from the tools register: scan its tag or pick it.',
    });
  });

  it('when the tool is retired, of another kind, or the checkpoint takes none, then each says so before the calibration', () => {
    expect(toolRefusal('Pre-charge', gaugeRule, gauge({ retired: true }), '2026-11-01')?.code).toBe(
      'tool_retired',
    );
    expect(toolRefusal('A top-up', topUpToolRule, gauge(), '2026-11-01')).toEqual({
      code: 'tool_wrong_kind',
      message: 'Gauge PG-014 is a pressure gauge; A top-up needs a servicing cart.',
    });
    expect(toolRefusal('Leaks', undefined, gauge(), '2026-11-01')?.code).toBe('tool_not_asked');
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
