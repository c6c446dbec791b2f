// A board's address, read by the board page and by the server that names what the page will ask for
// (server/middleware/first-screen-hints.ts). No zod here: the board's first screen loads it.

/** `/board?board=<link token>&base=NP,HH`: the query parameters of a board's page and of its API reads. */
export const boardParams = { token: 'board', bases: 'base' } as const;

/** The bases a board's address names, as the API is asked for them: trimmed and upper-cased, or none. */
export const boardBases = (text: string | null | undefined): string | null =>
  text?.trim().toUpperCase() || null;

/**
 * `?board=<token>` on a TV with nobody signed in; the server reads it as a read-only board link. `bases`: a base
 * code or a comma-separated list (`NP,HH`), a board of those bases only.
 */
export function boardQuery(boardToken: string | null, bases: string | null = null): string {
  const query = new URLSearchParams();
  if (boardToken) query.set(boardParams.token, boardToken);
  if (bases) query.set(boardParams.bases, bases);
  const text = query.toString();
  return text ? `?${text}` : '';
}
