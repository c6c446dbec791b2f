import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import {
  GENESIS,
  chainEvents,
  eventHash,
  lockAuditHeadSql,
  trailReasons,
  verifyChain,
  type AuditInput,
  type StoredEvent,
} from './trail-chain';

const inputs: AuditInput[] = [
  {
    actorId: 7,
    action: 'check.signed',
    entity: 'check',
    entityId: 'c-1',
    payload: { contentHash: 'a'.repeat(64), verdict: 'in_limits' },
    at: new Date('2026-03-01T06:00:00.000Z'),
  },
  {
    actorId: 7,
    action: 'hold.opened',
    entity: 'hold',
    entityId: '12',
    payload: { reason: 'System 2 level: below the minimum' },
    at: new Date('2026-03-01T06:05:00.250Z'),
  },
  {
    actorId: null,
    action: 'kiosk.enrolled',
    entity: 'kiosk',
    entityId: '3',
    payload: { name: 'Hangar 1 tablet' },
    at: new Date('2026-03-01T06:10:00.999Z'),
  },
];

/** The rows chainEvents would insert, read back as the verifier sees them. */
function storedChain(list = inputs, head?: { hash: string; last_event_id: number }) {
  const chained = chainEvents(head, list);
  const events: StoredEvent[] = chained.events.map((e) => ({ ...e }));
  return { events, head: chained.head, chained };
}

const verify = (
  events: StoredEvent[],
  head: string | null,
  check?: (e: StoredEvent) => Promise<string | null>,
) => verifyChain(events, async () => head, check);

/** The whole report for a trail that breaks at its second event, the hold, for `reason`. */
const brokenAtSecond = (reason: string) => ({
  ok: false,
  events: 2,
  firstBroken: { id: 2, action: 'hold.opened', entity: 'hold', entityId: '12', reason },
});

describe('one event hash, computed here without the project code', () => {
  it('when the first event is hashed, then it is the SHA-256 of the canonical JSON of its link, time, actor, action, entity and payload', () => {
    const { events } = storedChain();
    // Canonical JSON written out by hand: keys in code-unit order, no spaces; the payload is stored as its own
    // canonical JSON text, so it appears here as a string.
    const canonical =
      '{"action":"check.signed","actorId":7,"at":"2026-03-01T06:00:00.000Z","entity":"check","entityId":"c-1",' +
      `"payload":"{\\"contentHash\\":\\"${'a'.repeat(64)}\\",\\"verdict\\":\\"in_limits\\"}",` +
      `"prevHash":"${'0'.repeat(64)}"}`;
    const expected = createHash('sha256').update(canonical, 'utf8').digest('hex');
    expect(events[0]!.payload).toBe(`{"contentHash":"${'a'.repeat(64)}","verdict":"in_limits"}`);
    expect(events[0]!.hash).toBe(expected);
    expect(events[0]!.prevHash).toBe('0'.repeat(64));
  });
});

describe('chaining events onto the head', () => {
  it('when there is no head yet, then ids start at 1, the first link is the genesis hash and each link is the previous hash', () => {
    const { events, head } = storedChain();
    expect(events.map((e) => e.id)).toEqual([1, 2, 3]);
    expect(events[0]!.prevHash).toBe(GENESIS);
    expect(events[1]!.prevHash).toBe(events[0]!.hash);
    expect(events[2]!.prevHash).toBe(events[1]!.hash);
    expect(head).toEqual({ id: 3, hash: events[2]!.hash });
    expect(new Set(events.map((e) => e.hash)).size).toBe(3);
  });

  it('when a head exists, then the new events continue its ids and link to its hash, and the head update names the last', () => {
    const headHash = 'f'.repeat(64);
    const { events, chained } = storedChain(inputs.slice(0, 2), { hash: headHash, last_event_id: 41 });
    expect(events.map((e) => e.id)).toEqual([42, 43]);
    expect(events[0]!.prevHash).toBe(headHash);
    expect(events[0]!.hash).toBe(eventHash(headHash, events[0]!));
    expect(chained.events.map((e) => e.prevHash)).toEqual([headHash, events[0]!.hash]);
    expect(chained.updateHead).toEqual({
      sql: 'UPDATE audit_head SET hash = ?, last_event_id = ? WHERE id = 1',
      values: [events[1]!.hash, 43],
    });
  });

  it('when an event time has sub-millisecond precision or none is given, then the stored time is whole milliseconds and the hash covers exactly that', () => {
    const before = Date.now();
    const { events } = storedChain([{ ...inputs[0]!, at: undefined }]);
    const after = Date.now();
    expect(events[0]!.at.getTime()).toBeGreaterThanOrEqual(before);
    expect(events[0]!.at.getTime()).toBeLessThanOrEqual(after);
    expect(chainEvents(undefined, [inputs[0]!]).events[0]!.at.toISOString()).toBe('2026-03-01T06:00:00.000Z');
  });

  it('when the head lock is asked for with or without extra columns, then it is one locking read of the head row', () => {
    expect(lockAuditHeadSql()).toBe('SELECT hash, last_event_id FROM audit_head WHERE id = 1 FOR UPDATE');
    expect(lockAuditHeadSql('NOW(3) AS now')).toBe(
      'SELECT hash, last_event_id, NOW(3) AS now FROM audit_head WHERE id = 1 FOR UPDATE',
    );
  });
});

describe('verifying the trail: one reason for every way it can be broken', () => {
  it('when nothing was touched, then the trail verifies and counts every event', async () => {
    const { events, head } = storedChain();
    expect(await verify(events, head.hash)).toEqual({ ok: true, events: 3, firstBroken: null });
  });

  it('when the trail is empty and its head is the genesis hash or missing, then it verifies', async () => {
    expect(await verify([], GENESIS)).toEqual({ ok: true, events: 0, firstBroken: null });
    expect(await verify([], null)).toEqual({ ok: true, events: 0, firstBroken: null });
  });

  it("when an event's own hash is replaced, then that event is reported: its content does not match its hash", async () => {
    const { events, head } = storedChain();
    events[1] = { ...events[1]!, hash: 'b'.repeat(64) };
    expect(await verify(events, head.hash)).toEqual(brokenAtSecond('its content does not match its hash'));
  });

  it("when an event's link to the previous hash is replaced, then that event is reported: its link does not match", async () => {
    const { events, head } = storedChain();
    events[1] = { ...events[1]!, prevHash: 'c'.repeat(64) };
    const result = await verify(events, head.hash);
    expect(result.ok).toBe(false);
    expect(result.firstBroken).toMatchObject({
      id: 2,
      reason: 'its link to the previous event does not match',
    });
  });

  it.each([
    ['payload', { payload: '{"reason":"nothing found"}' }],
    ['time', { at: new Date('2026-03-01T06:05:00.251Z') }],
    ['actor', { actorId: 8 }],
    ['action', { action: 'hold.released' }],
    ['entity', { entity: 'check' }],
    ['entity id', { entityId: '13' }],
  ])(
    "when an event's %s is changed, then that event is reported: its content does not match its hash",
    async (_, change) => {
      const { events, head } = storedChain();
      events[1] = { ...events[1]!, ...change };
      const result = await verify(events, head.hash);
      expect(result.firstBroken).toMatchObject({ id: 2, reason: trailReasons.content });
      expect(result.events).toBe(2);
    },
  );

  it("when an event's payload is changed and its hash recomputed, then the next event's link gives it away", async () => {
    const { events, head } = storedChain();
    const edited = { ...events[1]!, payload: '{"reason":"nothing found"}' };
    events[1] = { ...edited, hash: eventHash(edited.prevHash, edited) };
    const result = await verify(events, head.hash);
    expect(result.firstBroken).toMatchObject({ id: 3, action: 'kiosk.enrolled', reason: trailReasons.link });
  });
});

describe('verifying the trail: removed events, a missing head and record checks', () => {
  it('when an event in the middle is deleted, then the one after it is reported: its link does not match', async () => {
    const { events, head } = storedChain();
    const result = await verify([events[0]!, events[2]!], head.hash);
    expect(result.firstBroken).toMatchObject({
      id: 3,
      reason: 'its link to the previous event does not match',
    });
    expect(result.events).toBe(2);
  });

  it('when the newest event is deleted, then the trail reports that events after the last one were removed', async () => {
    const { events, head } = storedChain();
    expect(await verify(events.slice(0, 2), head.hash)).toEqual({
      ok: false,
      events: 2,
      firstBroken: {
        id: 2,
        action: 'end',
        entity: 'trail',
        entityId: '',
        reason: 'events after this one were removed',
      },
    });
  });

  it('when every event is deleted but the head remains, then the trail reports removed events after none', async () => {
    const { head } = storedChain();
    const result = await verify([], head.hash);
    expect(result).toMatchObject({ ok: false, events: 0 });
    expect(result.firstBroken).toMatchObject({ id: 0, reason: trailReasons.truncated });
  });

  it('when the head row is deleted under a trail with events, then the trail reports its head missing', async () => {
    const { events } = storedChain();
    const result = await verify(events, null);
    expect(result.ok).toBe(false);
    expect(result.firstBroken).toMatchObject({
      id: 3,
      action: 'end',
      reason: "the trail's head row is missing",
    });
  });

  it('when a record check finds a problem with an event, then that event is reported with the record check’s reason and later events are not checked', async () => {
    const { events, head } = storedChain();
    const seen: number[] = [];
    const result = await verify(events, head.hash, async (e) => {
      seen.push(Number(e.id));
      return e.entity === 'hold' ? 'hold 12 was changed' : null;
    });
    expect(result).toEqual(brokenAtSecond('hold 12 was changed'));
    expect(seen).toEqual([1, 2]);
  });

  it('when the events come in batches from an async source, then they are walked as one chain', async () => {
    const { events, head } = storedChain();
    async function* batches() {
      yield* events.slice(0, 1);
      yield* events.slice(1);
    }
    expect(await verifyChain(batches(), async () => head.hash)).toEqual({
      ok: true,
      events: 3,
      firstBroken: null,
    });
  });
});
