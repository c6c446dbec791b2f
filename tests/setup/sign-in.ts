import { Client, buildApp, makeStaff } from './api-harness';
import type { Role } from '@shared/schemas/auth';

type App = ReturnType<typeof buildApp>['app'];

/** The desk password every test person gets unless a test says otherwise (invented). */
export const deskPassword = 'correct horse battery';

/**
 * The one way tests sign a person in: a new person with the given roles, signed in the way the channel works
 * (badge + PIN on an enrolled kiosk, badge + password at the desk). Refused sign-ins throw, with the answer.
 */
export async function signedIn(app: App, roles: Role[], channel: 'kiosk' | 'desk') {
  const person = await makeStaff(roles, channel === 'desk' ? { password: deskPassword } : {});
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
