import { describe, expect, it } from 'vitest';
import { describeContext, systemWords, typeWords } from './words';
import { auditActionLabel, plainName } from '../schemas/plain';

describe('words for what a check records', () => {
  it('when a check carries conditions, then they read as words, never as keys', () => {
    expect(describeContext({ attitude: 'on_wheels', systemPressure: 'on', ambientTempC: 18 })).toBe(
      'On wheels · System pressure on · 18.0 °C',
    );
    expect(describeContext({ attitude: 'on_jacks_gear_retracted', systemPressure: 'relieved' })).toBe(
      'On jacks, gear retracted · System pressure relieved',
    );
    expect(describeContext({}, '—')).toBe('—');
  });

  it('when a type name already carries its code, then the code is not said twice', () => {
    expect(typeWords({ code: 'RX-4', name: 'RX-4 medium twin' })).toBe('RX-4 medium twin');
    expect(typeWords({ code: 'QZ-9', name: 'Light single' })).toBe('Light single (QZ-9)');
  });

  it('when an audit action is shown, then it is words, known or not', () => {
    expect(auditActionLabel('hold.opened')).toBe('Aircraft put on hold');
    expect(auditActionLabel('kiosk.enrolment_created')).toBe('Tablet enrolment link made');
    expect(auditActionLabel('tool.calibration_changed')).toBe('Tool: calibration changed');
    expect(plainName('board_link')).toBe('Board link');
  });
});

describe('a system in words', () => {
  it('when a system key is shown, then it is the type label, or its words', () => {
    expect(systemWords('sys1', [{ code: 'sys1', label: 'Main system' }])).toBe('Main system');
    expect(systemWords('sys2')).toBe('System 2');
    expect(systemWords('brake')).toBe('Brake');
    expect(systemWords('tail_rotor')).toBe('Tail rotor');
    expect(systemWords(null)).toBe('No system');
  });
});
