import type { CheckContext } from '../schemas/limits';

// Words for what a check records, the same on the kiosk, the desk, the e-mails and the exports.

/** The conditions a check was taken in: "On wheels · System pressure on · 18.0 °C". */
export function describeContext(context: CheckContext, none = 'No configuration needed'): string {
  const parts: string[] = [];
  if (context.attitude)
    parts.push(context.attitude === 'on_wheels' ? 'On wheels' : 'On jacks, gear retracted');
  if (context.systemPressure)
    parts.push(context.systemPressure === 'on' ? 'System pressure on' : 'System pressure relieved');
  if (context.ambientTempC !== undefined) parts.push(`${context.ambientTempC.toFixed(1)} °C`);
  return parts.length > 0 ? parts.join(' · ') : none;
}

/** A type as people name it: "RX-4 medium twin", with its code added only when the name does not carry it. */
export const typeWords = (type: { code: string; name: string }) =>
  type.name.includes(type.code) ? type.name : `${type.name} (${type.code})`;
