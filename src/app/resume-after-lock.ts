// Where each badge was when the tablet locked, so its owner (and only its owner) lands back in the half-done check.
const keepMs = 30 * 60_000;
const key = (kioskId: number, badge: string) => `gw.resume.${kioskId}.${badge}`;

export function rememberWhereLocked(kioskId: number, badge: string, path: string): void {
  localStorage.setItem(key(kioskId, badge), JSON.stringify({ path, at: Date.now() }));
}

export function takeResumePath(kioskId: number, badge: string): string | null {
  const raw = localStorage.getItem(key(kioskId, badge));
  localStorage.removeItem(key(kioskId, badge));
  if (!raw) return null;
  try {
    const { path, at } = JSON.parse(raw) as { path: string; at: number };
    return Date.now() - at < keepMs && path.startsWith('/kiosk/') ? path : null;
  } catch {
    return null;
  }
}

/** Only paths inside the app, so a crafted link cannot send a signed-in tablet elsewhere. */
export function safeNext(next: string | null): string | null {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : null;
}
