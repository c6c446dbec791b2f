import { KIOSK_COOKIE } from '../middleware/kiosk-device';

/** A session of its own (cookie jar of two cookies and the CSRF token), as a tablet or a desk browser has. */
export async function signIn(base: string, path: string, body: object, deviceToken?: string) {
  const cookies = new Map<string, string>();
  if (deviceToken) cookies.set(KIOSK_COOKIE, deviceToken);
  let csrf = '';
  const call = async (method: string, url: string, payload?: object) => {
    const res = await fetch(`${base}${url}`, {
      method,
      headers: {
        cookie: [...cookies].map(([k, v]) => `${k}=${v}`).join('; '),
        'content-type': 'application/json',
        'x-csrf-token': csrf,
      },
      body: payload ? JSON.stringify(payload) : undefined,
    });
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const at = pair!.indexOf('=');
      cookies.set(pair!.slice(0, at), pair!.slice(at + 1));
    }
    const json = (await res.json()) as { csrfToken?: string };
    if (json.csrfToken) csrf = json.csrfToken;
    if (!res.ok) throw new Error(`${method} ${url}: ${res.status} ${JSON.stringify(json)}`);
  };
  await call('GET', '/api/session');
  await call('POST', path, body);
  return {
    cookie: [...cookies].map(([k, v]) => `${k}=${v}`).join('; '),
    'x-csrf-token': csrf,
    'content-type': 'application/json',
  };
}
