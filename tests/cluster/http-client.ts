// A browser-like client over fetch for the cluster test: keeps its cookies, sends the CSRF token, and can talk to
// either app instance with the same cookies, as a tablet behind a load balancer does.

export interface Answer {
  status: number;
  body: Record<string, unknown>;
  replay: boolean;
}

export class HttpClient {
  private readonly cookies = new Map<string, string>();
  private csrf = '';

  constructor(cookies: Record<string, string> = {}) {
    for (const [name, value] of Object.entries(cookies)) this.cookies.set(name, value);
  }

  get cookieHeader() {
    return [...this.cookies].map(([name, value]) => `${name}=${value}`).join('; ');
  }

  private keep(res: Response) {
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const at = pair!.indexOf('=');
      this.cookies.set(pair!.slice(0, at).trim(), pair!.slice(at + 1).trim());
    }
  }

  async get(base: string, path: string): Promise<Answer> {
    const res = await fetch(`${base}${path}`, { headers: { cookie: this.cookieHeader } });
    this.keep(res);
    const body = (await res.json().catch(() => ({}))) as Record<string, unknown>;
    if (typeof body.csrfToken === 'string') this.csrf = body.csrfToken;
    return { status: res.status, body, replay: false };
  }

  /** The bytes of a GET (a photo), with its status. */
  async bytes(base: string, path: string): Promise<{ status: number; bytes: Buffer }> {
    const res = await fetch(`${base}${path}`, { headers: { cookie: this.cookieHeader } });
    return { status: res.status, bytes: Buffer.from(await res.arrayBuffer()) };
  }

  async post(base: string, path: string, payload: unknown): Promise<Answer> {
    return this.send(base, path, () => JSON.stringify(payload), 'application/json');
  }

  /** A POST with the session's cookies and CSRF token; the body is made per call, as a form cannot be sent twice. */
  async send(
    base: string,
    path: string,
    payload: () => string | FormData,
    contentType?: string,
  ): Promise<Answer> {
    if (!this.csrf) await this.get(base, '/api/session');
    const res = await fetch(`${base}${path}`, {
      method: 'POST',
      headers: {
        cookie: this.cookieHeader,
        'x-csrf-token': this.csrf,
        ...(contentType ? { 'content-type': contentType } : {}),
      },
      body: payload(),
      signal: AbortSignal.timeout(60_000),
    });
    this.keep(res);
    const body = (await res.json().catch(() => ({}))) as Record<string, unknown>;
    if (typeof body.csrfToken === 'string') this.csrf = body.csrfToken;
    return { status: res.status, body, replay: res.headers.get('idempotent-replay') === 'true' };
  }
}

/** A photo as the kiosk uploads it (multipart, field "photo"), through one instance. */
export async function uploadPhoto(client: HttpClient, base: string, bytes: Buffer, contentType: string) {
  return client.send(base, '/api/photos', () => {
    const form = new FormData();
    form.append('photo', new Blob([new Uint8Array(bytes)], { type: contentType }), 'evidence.jpg');
    return form;
  });
}

/** Opens a board event stream and calls `onChange` with the time of every `change` event until `stop()`. */
export async function watchBoard(base: string, cookie: string, onChange: (at: number) => void) {
  const controller = new AbortController();
  const res = await fetch(`${base}/api/board/events`, { headers: { cookie }, signal: controller.signal });
  if (res.status !== 200) throw new Error(`The board stream answered ${res.status}.`);
  const reader = res.body!.getReader();
  const decoder = new TextDecoder();
  const reading = (async () => {
    let text = '';
    for (;;) {
      const { value, done } = await reader.read();
      if (done) return;
      text += decoder.decode(value, { stream: true });
      let end: number;
      while ((end = text.indexOf('\n\n')) >= 0) {
        if (text.slice(0, end).includes('event: change')) onChange(performance.now());
        text = text.slice(end + 2);
      }
    }
  })().catch(() => {});
  return {
    stop: async () => {
      controller.abort();
      await reading;
    },
  };
}
