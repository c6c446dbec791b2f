import type { Request } from 'express';

export const CSRF_COOKIE = 'gw_csrf';

/**
 * Where the CSRF token is kept. Signed in: in the session, as before. Not signed in: in a signed, httpOnly
 * cookie, so a visit that only asks "who am I" stores no session row (the sign-in form still needs a token).
 * The cookie is signed with the session secret, so a token cannot be made up, and a page on another site can
 * neither read it nor send it in the header.
 */
export function csrfState(secureCookies: boolean) {
  return {
    getTokenFromState: (req: Request): string | undefined => {
      if (req.user) return req.session.csrfToken ?? undefined;
      const fromCookie: unknown = req.signedCookies?.[CSRF_COOKIE];
      return typeof fromCookie === 'string' && fromCookie !== '' ? fromCookie : undefined;
    },
    storeTokenInState: (req: Request, token?: string | null) => {
      if (req.user) {
        req.session.csrfToken = token;
        return;
      }
      req.signedCookies = { ...req.signedCookies, [CSRF_COOKIE]: token ?? undefined };
      const options = { httpOnly: true, sameSite: 'strict', secure: secureCookies, path: '/api' } as const;
      if (token) req.res?.cookie(CSRF_COOKIE, token, { ...options, signed: true });
      else req.res?.clearCookie(CSRF_COOKIE, options);
    },
  };
}
