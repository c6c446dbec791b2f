const tokenPattern = /^[A-Za-z0-9_-]{8,64}$/;

/** A tag's QR code holds its URL (…/t/<token>); a hand-made label may hold the bare token. */
export function tagTokenFrom(scanned: string): string | null {
  const text = scanned.trim();
  const fromUrl = /\/t\/([A-Za-z0-9_-]{8,64})(?:[/?#]|$)/.exec(text)?.[1];
  if (fromUrl) return fromUrl;
  return tokenPattern.test(text) ? text : null;
}
