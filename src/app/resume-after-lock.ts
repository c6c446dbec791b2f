import { tabletDelete, tabletGet, tabletSet } from '../lib/tablet-store';

// Where each badge was when the tablet locked, so its owner (and only its owner) lands back in the half-done check.
// Kept in the same tablet store as the drafts, for the same 30 minutes.
const keepMs = 30 * 60_000;
const key = (kioskId: number, badge: string) => `resume:${kioskId}:${badge}`;

export async function rememberWhereLocked(kioskId: number, badge: string, path: string): Promise<void> {
  await tabletSet(key(kioskId, badge), { path, at: Date.now() });
}

export async function takeResumePath(kioskId: number, badge: string): Promise<string | null> {
  try {
    const saved = await tabletGet<{ path: string; at: number }>(key(kioskId, badge));
    await tabletDelete(key(kioskId, badge));
    if (!saved) return null;
    return Date.now() - saved.at < keepMs && saved.path.startsWith('/kiosk/') ? saved.path : null;
  } catch {
    return null;
  }
}

/** Only paths inside the app, so a crafted link cannot send a signed-in tablet elsewhere. */
export function safeNext(next: string | null): string | null {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : null;
}
