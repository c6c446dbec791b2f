import { z } from 'zod';

export const roleSchema = z.enum(['mechanic', 'shift_lead', 'pilot', 'engineering']);
export type Role = z.infer<typeof roleSchema>;

export const roleLabels: Record<Role, string> = {
  mechanic: 'Mechanic',
  shift_lead: 'Shift lead',
  pilot: 'Pilot',
  engineering: 'Engineering',
};

export const badgeSchema = z
  .string()
  .trim()
  .regex(/^[A-Za-z0-9-]{2,32}$/, 'A badge number is 2 to 32 letters, digits or dashes.');
export const pinSchema = z.string().regex(/^\d{4,8}$/, 'A PIN is 4 to 8 digits.');

export const kioskSignInSchema = z.object({ badge: badgeSchema, pin: pinSchema }).strict();
export type KioskSignIn = z.infer<typeof kioskSignInSchema>;

export const deskSignInSchema = z
  .object({ badge: badgeSchema, password: z.string().min(1, 'Enter your password.').max(200) })
  .strict();
export type DeskSignIn = z.infer<typeof deskSignInSchema>;

export interface SessionUser {
  id: number;
  badgeNumber: string;
  name: string;
  licenceNumber: string | null;
  roles: Role[];
}

export interface SessionInfo {
  user: SessionUser | null;
  channel: 'kiosk' | 'desk' | null;
  kiosk: { id: number; name: string } | null;
  csrfToken: string;
  idleSeconds: number;
}
