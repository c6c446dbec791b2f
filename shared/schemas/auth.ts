import { z } from 'zod';
import type { Language } from '../i18n/languages';
import { badgePattern, pinPattern, roleLabels as plainRoleLabels } from './plain';

export const roleSchema = z.enum(['mechanic', 'shift_lead', 'pilot', 'engineering']);
export type Role = z.infer<typeof roleSchema>;

// Same keys as roleSchema, or this does not compile.
export const roleLabels: Record<Role, string> = plainRoleLabels;

export const badgeSchema = z.string().trim().regex(badgePattern, 'words:validation.badge');
export const pinSchema = z.string().regex(pinPattern, 'words:validation.pin');

export const kioskSignInSchema = z.object({ badge: badgeSchema, pin: pinSchema }).strict();
export type KioskSignIn = z.infer<typeof kioskSignInSchema>;

export const deskSignInSchema = z
  .object({ badge: badgeSchema, password: z.string().min(1, 'words:validation.password').max(200) })
  .strict();
export type DeskSignIn = z.infer<typeof deskSignInSchema>;

export interface SessionUser {
  id: number;
  badgeNumber: string;
  name: string;
  licenceNumber: string | null;
  roles: Role[];
  /** The kiosk switches to it at this badge's sign-in; null keeps the tablet's language. */
  preferredLanguage: Language | null;
}

export interface SessionInfo {
  user: SessionUser | null;
  channel: 'kiosk' | 'desk' | null;
  kiosk: { id: number; name: string } | null;
  csrfToken: string;
  idleSeconds: number;
  /** The hangar's clock (IANA name) for kiosk times: the bases' zone when they share one, else UTC. */
  timeZone: string;
}
