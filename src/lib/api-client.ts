import i18next from 'i18next';
import type { ApiError } from '@shared/schemas/errors';
import type { SessionInfo } from '@shared/schemas/auth';
import { formatInstant } from '@shared/domain/when';
import { ambientLanguage, ambientTranslate, say } from '@shared/i18n/translate';

/**
 * An answer's words in the screen's language: the `apiErrors` part of the common words where it has the code (the
 * sign-in refusals, which need the hangar's clock and the attempts left, and the answers any screen may meet);
 * otherwise the server's message, which it writes in the language this client asked for (Accept-Language, below).
 */
function screenWords(body: ApiError): string {
  const key = `common:apiErrors.${body.code}`;
  if (!i18next.exists(key)) return body.message;
  const until =
    typeof body.lockedUntil === 'string'
      ? formatInstant(body.lockedUntil, hangarZone, ambientLanguage())
      : undefined;
  const words = say(ambientTranslate(), key, { until, seconds: body.retryAfterSeconds });
  return typeof body.attemptsLeft === 'number'
    ? `${words} ${say(ambientTranslate(), 'common:apiErrors.attemptsLeft', { count: body.attemptsLeft })}`
    : words;
}

/** An answer from the server that is not a success; `message` is written for the person at the screen. */
export class ApiRequestError extends Error {
  readonly status: number;
  /** One of the API's codes (`ApiErrorCode` in shared/schemas/errors.ts), so a misspelt code fails the build. */
  readonly code: ApiError['code'];
  readonly body: ApiError;

  constructor(status: number, body: ApiError) {
    super(screenWords(body));
    this.name = 'ApiRequestError';
    this.status = status;
    this.code = body.code;
    this.body = body;
  }
}

export function errorMessage(error: unknown): string {
  if (error instanceof ApiRequestError) return error.message;
  if (error instanceof TypeError) return i18next.t('api.unreachable', { ns: 'common' });
  if (error instanceof Error) return error.message;
  return i18next.t('api.wentWrong', { ns: 'common' });
}

// The server rotates the CSRF token at sign-in and sign-out; every write must carry the latest one.
let csrfToken: string | null = null;
let hangarZone = 'UTC';
export function rememberSession(session: SessionInfo): SessionInfo {
  csrfToken = session.csrfToken;
  if (session.timeZone) hangarZone = session.timeZone;
  return session;
}
/** The hangar's clock as the server last said it, for kiosk times written without an airframe at hand. */
export const hangarTimeZone = (): string => hangarZone;

type SignedOutListener = (code: ApiError['code']) => void;
const signedOutListeners = new Set<SignedOutListener>();
/** Lets the session layer hear a 401 from any endpoint, so the kiosk locks at once and not on the next poll. */
export function onSignedOut(listener: SignedOutListener): () => void {
  signedOutListeners.add(listener);
  return () => signedOutListeners.delete(listener);
}

async function parseBody(response: Response): Promise<unknown> {
  const text = await response.text();
  if (text === '') return null;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return {
      code: 'bad_response',
      message: i18next.t('api.unreadable', { ns: 'common', status: response.status }),
    };
  }
}

function asApiError(status: number, body: unknown): ApiError {
  if (body && typeof body === 'object' && 'message' in body && 'code' in body) return body as ApiError;
  return { code: `http_${status}`, message: i18next.t('api.status', { ns: 'common', status }) };
}

// Only these mean the session is gone; a wrong PIN at signing is a 401 too, but must not lock the tablet.
const sessionEndedCodes = new Set<ApiError['code']>(['not_signed_in', 'idle_locked', 'kiosk_revoked']);

async function freshToken(): Promise<string> {
  const response = await fetch('/api/session', {
    credentials: 'same-origin',
    headers: { Accept: 'application/json' },
  });
  const body = await parseBody(response);
  if (!response.ok) throw new ApiRequestError(response.status, asApiError(response.status, body));
  return rememberSession(body as SessionInfo).csrfToken;
}

/** The CSRF token for a write the JSON client does not make (a photo upload with progress). */
export const csrfTokenForWrite = async (): Promise<string> => csrfToken ?? (await freshToken());
/** A fresh CSRF token after the server refused the one held. */
export const csrfTokenAfterRefusal = (): Promise<string> => freshToken();

/** Builds the error for an answer that is not a success, from its status and body text. */
export function apiErrorFrom(status: number, text: string): ApiRequestError {
  let body: unknown = null;
  try {
    body = text === '' ? null : (JSON.parse(text) as unknown);
  } catch {
    body = null;
  }
  return new ApiRequestError(status, asApiError(status, body));
}

/** No answer, or an answer that says "try later": a resend with the same check id may succeed. */
export function isRetryable(error: unknown): boolean {
  if (!(error instanceof ApiRequestError)) return true;
  return (
    error.status >= 500 ||
    error.status === 408 ||
    error.status === 429 ||
    (error.status === 401 && sessionEndedCodes.has(error.code))
  );
}

interface RequestOptions {
  method?: 'GET' | 'POST';
  body?: unknown;
  signal?: AbortSignal;
  /** A read asked again sends the entity tag of the answer held for it (see `held`). */
  revalidate?: boolean;
}

/**
 * The last answer to each revalidated read, with its entity tag. Asked again, the read sends the tag; an unchanged
 * answer comes back as 304 with no body, and the same data is returned, so the screen neither downloads nor parses
 * nor redraws it (TanStack Query keeps an identical answer as it was). The board refetches on every change its
 * stream announces, on the stream's first hello and on its slow poll: most of those find nothing new. The API's
 * answers are `no-store`, so the browser keeps no copy of its own; the server still checks who asks before it
 * compares tags.
 */
const held = new Map<string, { etag: string; data: unknown }>();

export async function apiRequest<T>(
  path: string,
  { method = 'GET', body, signal, revalidate = false }: RequestOptions = {},
): Promise<T> {
  const before = method === 'GET' && revalidate ? held.get(path) : undefined;
  const send = async (token: string | null) => {
    const headers: Record<string, string> = { Accept: 'application/json' };
    if (before) headers['If-None-Match'] = before.etag;
    // The server writes its words in the screen's language where it can (languageOf on the server).
    if (i18next.resolvedLanguage) headers['Accept-Language'] = i18next.resolvedLanguage;
    if (body !== undefined) headers['Content-Type'] = 'application/json';
    if (method !== 'GET' && token) headers['X-CSRF-Token'] = token;
    const init: RequestInit = { method, headers, credentials: 'same-origin' };
    if (body !== undefined) init.body = JSON.stringify(body);
    if (signal) init.signal = signal;
    const response = await fetch(`/api${path}`, init);
    return { response, parsed: await parseBody(response) };
  };

  let token = method === 'GET' ? null : (csrfToken ?? (await freshToken()));
  let { response, parsed } = await send(token);
  if (response.status === 403 && asApiError(403, parsed).code === 'csrf_invalid') {
    token = await freshToken();
    ({ response, parsed } = await send(token));
  }
  if (response.status === 304 && before) return before.data as T;
  if (!response.ok) {
    const error = asApiError(response.status, parsed);
    if (response.status === 401 && path !== '/session' && sessionEndedCodes.has(error.code)) {
      for (const listener of signedOutListeners) listener(error.code);
    }
    throw new ApiRequestError(response.status, error);
  }
  const etag = revalidate ? response.headers.get('ETag') : null;
  if (etag) held.set(path, { etag, data: parsed });
  return parsed as T;
}

export const apiGet = <T>(path: string, signal?: AbortSignal) =>
  apiRequest<T>(path, signal ? { signal } : {});
/** A read whose server sends an entity tag: asked again, an unchanged answer costs a 304 (see `held`). */
export const apiGetRevalidated = <T>(path: string, signal?: AbortSignal) =>
  apiRequest<T>(path, { revalidate: true, ...(signal ? { signal } : {}) });
export const apiPost = <T>(path: string, body: unknown = {}) => apiRequest<T>(path, { method: 'POST', body });
