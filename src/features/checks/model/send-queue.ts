import type { CheckKind } from '@shared/schemas/limits';
import type { SubmitCheck } from '@shared/schemas/checks';
import type { StoredCheck } from '@shared/schemas/checks';
import { ApiRequestError, errorMessage, isRetryable } from '@/lib/api-client';
import { tabletDelete, tabletEntries, tabletSet } from '@/lib/tablet-store';
import { submitCheck } from '../api/submit-check';
import { draftKeepMs, saveDraft, type CheckDraft } from './check-draft';

/** A signed check the server has not accepted yet. Stored on the tablet without its PIN. */
export interface QueuedCheck {
  id: string;
  submission: Omit<SubmitCheck, 'pin'>;
  /** What the mechanic had on screen, to open the check again for review if the server refuses it. */
  draft: CheckDraft;
  fleetNumber: string;
  kind: CheckKind;
  owner: { kioskId: number; badge: string; name: string };
  queuedAt: number;
  attempts: number;
  nextAttemptAt: number;
  /** The server said no (4xx): sending again will not help; the owner opens it for review. */
  refused: { status: number; code: string; message: string } | null;
  /** Why the last try did not go through, in words for the screen. */
  lastProblem: string | null;
  /** The server refused the PIN given for this check (never retried with it). */
  pinRefused?: string | null;
}

export type QueueItemState = 'sending' | 'waiting' | 'needs_pin' | 'refused';

export interface SentCheck {
  id: string;
  badge: string;
  fleetNumber: string;
  kind: CheckKind;
  at: number;
}

export interface QueueSnapshot {
  loaded: boolean;
  items: QueuedCheck[];
  /** Sent from the queue since this page loaded, so the screen can say so and link the result. */
  sent: SentCheck[];
  stateOf: (item: QueuedCheck) => QueueItemState;
}

// The PIN is the signature and never goes into storage: it stays in this page's memory only, for at most the
// time a draft is kept, and only to resend that one check. After a reload the owner is asked for it again.
const pinWindowMs = draftKeepMs;
const pins = new Map<string, { pin: string; until: number }>();
const inFlight = new Set<string>();
const firstRetryMs = 2_000;
const maxRetryMs = 60_000;
const key = (id: string) => `queue:${id}`;

let items: QueuedCheck[] = [];
let sent: SentCheck[] = [];
let loaded = false;
let loading: Promise<void> | null = null;
const listeners = new Set<() => void>();

function pinFor(id: string): string | null {
  const held = pins.get(id);
  if (!held) return null;
  if (held.until <= Date.now()) {
    pins.delete(id);
    return null;
  }
  return held.pin;
}

function stateOf(item: QueuedCheck): QueueItemState {
  if (inFlight.has(item.id)) return 'sending';
  if (item.refused) return 'refused';
  return pinFor(item.id) === null ? 'needs_pin' : 'waiting';
}

let snapshot: QueueSnapshot = { loaded, items, sent, stateOf };
function changed() {
  snapshot = { loaded, items: [...items], sent: [...sent], stateOf };
  for (const listener of listeners) listener();
}

export function subscribeQueue(listener: () => void): () => void {
  listeners.add(listener);
  void loadQueue();
  return () => listeners.delete(listener);
}
export const queueSnapshot = (): QueueSnapshot => snapshot;

export function loadQueue(): Promise<void> {
  loading ??= tabletEntries<QueuedCheck>('queue:')
    .then((stored) => {
      const known = new Set(items.map((item) => item.id));
      items = [...items, ...stored.map(([, item]) => item).filter((item) => !known.has(item.id))].sort(
        (a, b) => a.queuedAt - b.queuedAt,
      );
    })
    .catch(() => undefined)
    .finally(() => {
      loaded = true;
      changed();
    });
  return loading;
}

async function put(item: QueuedCheck): Promise<void> {
  // Taken out of the queue while it was being sent (opened for review): do not bring it back.
  if (!items.some((existing) => existing.id === item.id)) return;
  items = items.map((existing) => (existing.id === item.id ? item : existing));
  changed();
  await tabletSet(key(item.id), item);
}

async function remove(id: string): Promise<void> {
  items = items.filter((item) => item.id !== id);
  pins.delete(id);
  changed();
  await tabletDelete(key(id));
}

/** Keeps a signed check on the tablet until the server has it; it is stored before this returns. */
export async function enqueue(
  entry: Omit<QueuedCheck, 'queuedAt' | 'attempts' | 'nextAttemptAt' | 'refused' | 'lastProblem'>,
  pin: string,
  problem: string,
): Promise<void> {
  const now = Date.now();
  const item: QueuedCheck = {
    ...entry,
    queuedAt: now,
    attempts: 1,
    nextAttemptAt: now + firstRetryMs,
    refused: null,
    lastProblem: problem,
  };
  pins.set(item.id, { pin, until: now + pinWindowMs });
  items = [...items.filter((existing) => existing.id !== item.id), item];
  changed();
  await tabletSet(key(item.id), item);
}

/** The owner typed the PIN again (after a reload, or after a wrong one): send at once. */
export async function providePin(id: string, pin: string): Promise<void> {
  const item = items.find((candidate) => candidate.id === id);
  if (!item) return;
  pins.set(id, { pin, until: Date.now() + pinWindowMs });
  await put({ ...item, nextAttemptAt: Date.now(), lastProblem: null, pinRefused: null });
}

/** The network is back (or the mechanic asked): try every waiting check now. */
export function wakeQueue(): void {
  const now = Date.now();
  items = items.map((item) => (item.refused ? item : { ...item, nextAttemptAt: now }));
  changed();
}

const takeForReview = (id: string): Promise<void> => remove(id);

const backoff = (attempts: number) => Math.min(maxRetryMs, firstRetryMs * 2 ** Math.max(0, attempts - 1));

async function send(item: QueuedCheck, pin: string, onSent: (check: StoredCheck) => void): Promise<void> {
  inFlight.add(item.id);
  changed();
  try {
    const stored = await submitCheck({ ...item.submission, pin });
    inFlight.delete(item.id);
    sent = [
      ...sent,
      {
        id: stored.id,
        badge: item.owner.badge,
        fleetNumber: item.fleetNumber,
        kind: item.kind,
        at: Date.now(),
      },
    ];
    await remove(item.id);
    onSent(stored);
  } catch (error) {
    inFlight.delete(item.id);
    const attempts = item.attempts + 1;
    if (isRetryable(error)) {
      await put({
        ...item,
        attempts,
        nextAttemptAt: Date.now() + backoff(attempts),
        lastProblem: errorMessage(error),
      });
    } else if (
      error instanceof ApiRequestError &&
      (error.code === 'wrong_pin' || error.code === 'badge_locked')
    ) {
      // Never tried again with a PIN the server refused: that would count against the badge.
      pins.delete(item.id);
      await put({ ...item, attempts, lastProblem: error.message, pinRefused: error.message });
    } else if (error instanceof ApiRequestError) {
      pins.delete(item.id);
      await put({
        ...item,
        attempts,
        refused: { status: error.status, code: error.code, message: error.message },
        lastProblem: error.message,
      });
    }
  }
}

/**
 * Sends the checks that are due and belong to the person signed in: the server signs with the session's badge, so
 * nobody else's check may go out under it.
 */
export function sendDue(
  signedIn: { kioskId: number; badge: string },
  onSent: (check: StoredCheck) => void,
): void {
  const now = Date.now();
  for (const item of items) {
    if (item.owner.kioskId !== signedIn.kioskId || item.owner.badge !== signedIn.badge) continue;
    if (item.refused || inFlight.has(item.id) || item.nextAttemptAt > now) continue;
    const pin = pinFor(item.id);
    if (pin !== null) void send(item, pin, onSent);
  }
}

/** Seconds until the next try, for the screen. */
export const secondsToNextTry = (item: QueuedCheck, now = Date.now()) =>
  Math.max(0, Math.ceil((item.nextAttemptAt - now) / 1000));

/**
 * A refused check goes back to its owner as a draft at the review step (same id: the server stored nothing), and
 * leaves the queue.
 */
export async function reopenForReview(item: QueuedCheck): Promise<void> {
  await saveDraft(
    { kioskId: item.owner.kioskId, badge: item.owner.badge },
    { ...item.draft, step: 'review' },
  );
  await takeForReview(item.id);
}
