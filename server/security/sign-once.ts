import { isDuplicateKey } from '@server/db/unique-violation';
import { conflict, refusal } from '@server/errors/app-error';

/**
 * One act of signing, stored once however often it is sent. The screen gives the act an id and sends it again
 * with every resend (the answer was lost on the way back, a double tap, a tablet that resends on its own), and the
 * row keeps it under a unique key. `earlier` finds the row signed under that id and answers as the first did, or
 * refuses when the id was used for something else; null when nothing was signed under it yet.
 *
 * The signer's PIN or password is checked before this, on every try: a resend is answered only to its signer.
 * Two copies that arrive together both find nothing; the unique key stores one, and the other is answered from it.
 */
export async function signOnce<T>(
  requestId: string | undefined,
  earlier: (requestId: string) => Promise<T | null>,
  sign: () => Promise<T>,
): Promise<T> {
  if (requestId === undefined) return sign();
  const before = await earlier(requestId);
  if (before !== null) return before;
  try {
    return await sign();
  } catch (err) {
    if (!isDuplicateKey(err)) throw err;
    const raced = await earlier(requestId);
    if (raced === null) throw err;
    return raced;
  }
}

/** An id already signed under for another airframe, hold, decision or person: never answered with that record. */
export const signingIdReused = () => conflict('signing_id_reused', refusal('signing.idReused'));
