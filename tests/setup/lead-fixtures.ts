import { buildApp, makeAirframe } from './api-harness';
import { signedIn, type SignedIn } from './sign-in';
import { isolatedLevel, signCheck } from './check-builder';
import { Hold, StaffAuthorisation } from '@server/db/models';

type App = ReturnType<typeof buildApp>['app'];

/** An airframe put on hold by a mechanic's out-of-limits pre-flight. */
export async function heldAirframe(app: App, mechanic?: SignedIn) {
  const signer = mechanic ?? (await signedIn(app, ['mechanic'], 'kiosk'));
  const made = await makeAirframe();
  const check = await signCheck(signer, made.airframe.id, made.limits.id, {}, [isolatedLevel]);
  const hold = await Hold.findOne({ where: { checkId: check.id } });
  if (!hold) throw new Error('no hold was opened');
  return { ...made, mechanic: signer, check, holdId: hold.id };
}

/** Waits for something the server does in the background after answering, such as sending an e-mail. */
export async function eventually<T>(probe: () => Promise<T | undefined>, timeoutMs = 8_000): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value !== undefined) return value;
    if (Date.now() > until) throw new Error(`nothing after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/**
 * Records a certifying authorisation straight into the table, as engineering would through the staff page: by
 * default B1 for the given type, all chapters, valid to the end of next year (invented).
 */
export async function authorise(
  staffId: number,
  typeCode: string,
  changes: Partial<{
    category: 'A' | 'B1' | 'B2' | 'B3' | 'C';
    typeCodes: string[];
    scope: string[];
    expiresOn: string;
  }> = {},
) {
  return StaffAuthorisation.create({
    staffId,
    category: changes.category ?? 'B1',
    typeCodes: JSON.stringify(changes.typeCodes ?? [typeCode]),
    scope: JSON.stringify(changes.scope ?? ['all']),
    expiresOn: changes.expiresOn ?? `${new Date().getUTCFullYear() + 1}-12-31`,
    reference: `AUTH-${staffId}`,
    grantedBy: staffId,
    grantedAt: new Date(),
  });
}
