import type { SessionUser } from '../shared/schemas/auth';

declare global {
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
    interface Request {
      kiosk?: { id: number; name: string; baseId: number | null };
      /** A read-only hangar board link (a TV with no person signed in). */
      boardLink?: { id: number; name: string; baseIds: number[] | null };
      /**
       * The signed-in person's row as read for this request (PIN hash and lockout state included): a signature
       * checks it without reading it again. Server-side only, never sent.
       */
      staffRow?: import('./security/credentials').StaffRow;
      /** This sign-in used a temporary PIN (set by the sign-in strategy, stored in the session after login). */
      temporaryPin?: boolean;
    }
  }
}

declare module 'express-session' {
  interface SessionData {
    channel: 'kiosk' | 'desk';
    lastSeenAt: number;
    kioskId: number;
    /** Signed in with a temporary PIN: nothing but choosing a PIN works until it is changed. */
    temporaryPin: boolean;
  }
}

export {};
