import { z } from 'zod';
import type { CheckKind } from './limits';
import type { AirframeSummary } from './airframes';
import type { DefectSummary } from './defects';
import type { AirframeRef } from './refs';
import type { Phrase } from '../i18n/phrase';

export const handoverWindowSchema = z
  .object({
    from: z.iso.datetime({ offset: true, message: 'words:validation.handoverFrom' }).optional(),
    to: z.iso.datetime({ offset: true, message: 'words:validation.handoverTo' }).optional(),
  })
  .strict()
  .refine((w) => !w.from || !w.to || Date.parse(w.from) < Date.parse(w.to), {
    path: ['to'],
    message: 'words:validation.shiftEndAfterStart',
  })
  .refine((w) => !w.from || !w.to || Date.parse(w.to) - Date.parse(w.from) <= 31 * 24 * 3_600_000, {
    path: ['from'],
    message: 'words:validation.handoverDays',
  });
export type HandoverWindow = z.infer<typeof handoverWindowSchema>;

export interface HandoverConsumption {
  airframe: AirframeRef;
  system: string;
  windowDays: number;
  litresAdded: number;
  /** null when the flight hours in the window are not known. */
  flightHours: number | null;
  litresPerFlightHour: number | null;
  litresPerDay: number;
  alertLPerFh: number;
  alert: { kind: 'rate_at_or_above_threshold' | 'fluid_without_flying'; message: Phrase } | null;
}

export interface HandoverSummary {
  from: string;
  to: string;
  checks: {
    total: number;
    byKind: { kind: CheckKind; total: number; in_limits: number; service: number; out_of_limits: number }[];
  };
  holdsOpened: { id: number; airframe: AirframeRef; reason: string; openedAt: string; checkId: string }[];
  holdsReleased: { id: number; airframe: AirframeRef; releasedAt: string; releasedBy: string }[];
  holdsStillOpen: number;
  /** Each airframe's state at the end of the window, as the board shows it. */
  states: ({ airframe: AirframeRef } & Pick<AirframeSummary, 'state' | 'causes'>)[];
  /** Every airframe with a defect not rectified: open, deferred or deferred past its limit. */
  defects: { airframe: AirframeRef; defects: DefectSummary[] }[];
  fluidUsed: {
    bySystem: { system: string; litres: number }[];
    byAirframe: { airframe: AirframeRef; system: string; litres: number }[];
  };
  consumption: HandoverConsumption[];
  consumptionAlerts: Phrase[];
  /** Plain notes on what the summary could not say, e.g. flight hours not recorded. */
  notes: string[];
  caution: string;
}

export interface HandoverSent {
  deliveryId: number;
  status: 'sent' | 'failed';
  to: string[];
  subject: string;
  error: string | null;
}
