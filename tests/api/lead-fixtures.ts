import { Client, buildApp, makeAirframe, makeStaff, preFlightBody } from '../setup/api-harness';
import { Hold, StaffAuthorisation } from '@server/db/models';
import type { Role } from '@shared/schemas/auth';

type App = ReturnType<typeof buildApp>['app'];

/** A person signed in the way their role works: badge + PIN on a kiosk, or badge + password at the desk. */
export async function signedIn(app: App, roles: Role[], channel: 'kiosk' | 'desk') {
  const person = await makeStaff(roles, channel === 'desk' ? { password: 'desk-pass-123' } : {});
  if (channel === 'kiosk') {
    const client = await Client.kiosk(app);
    await client.signInKiosk(person.badge, person.pin);
    return { client, ...person };
  }
  const client = new Client(app);
  const res = await client.signInDesk(person.badge, person.password!);
  if (res.status !== 200) throw new Error(`desk sign-in failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { client, ...person };
}

export type SignedIn = Awaited<ReturnType<typeof signedIn>>;

/** System 1 at 2.9 L: below the 3.0 L isolation mark of the demo RX-4, so out of limits. */
export const isolatedLevel = { code: 'sys1.level', entry: { value: 2.9, unit: 'L' } };

export async function signCheck(
  mechanic: SignedIn,
  airframeId: number,
  limitsId: number,
  changes: Record<string, unknown> = {},
  readings: { code: string; entry: unknown }[] = [],
) {
  const body = preFlightBody(airframeId, limitsId, mechanic.pin, changes);
  body.readings = body.readings.map(
    (r) => readings.find((x) => x.code === r.code) ?? r,
  ) as typeof body.readings;
  const res = await mechanic.client.post('/api/checks', body);
  if (res.status !== 201) throw new Error(`check refused: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as { id: string; holdOpened: boolean; verdict: string };
}

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
