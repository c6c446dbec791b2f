import type { Sequelize } from 'sequelize';
import { boardFingerprint } from './airframes.repository';
import type { AirframeSummary } from '@shared/schemas/airframes';
import {
  judgeFleet,
  loadFleetRecords,
  sortForBoard,
  type FleetJudgement,
  type FleetRecords,
} from './airframes.service';
import { EncodedJson } from './encoded-json';

interface Snapshot {
  fingerprint: string;
  builtAt: number;
  /** Until when its records are used without reading them again (at most maxAgeMs after they were read). */
  recordsUntil: number;
  /** Until the first instant the clock alone changes a state. */
  goodUntil: number;
  /** The board as sent, in the board's order. */
  encoded: EncodedJson;
  /** The same board with one base's airframes first (a tablet's list), made on the first ask for that base. */
  ownBaseFirst: Map<number, EncodedJson>;
  summaries: AirframeSummary[];
  records: FleetRecords;
  /** The judgement behind it: the next judgement of the same records keeps what the clock has not changed. */
  judgement: FleetJudgement;
}

/** A tablet's own base first, each part in the board's order, so the mechanic finds the aircraft in front of them. */
export const ownBaseFirst = (summaries: AirframeSummary[], baseId: number) => [
  ...summaries.filter((s) => s.base.id === baseId),
  ...summaries.filter((s) => s.base.id !== baseId),
];

/** Which airframes a board shows: every base (undefined) or the airframes at these bases. */
export type BoardScope = readonly number[] | undefined;

const scopeKey = (scope: BoardScope) => (scope ? [...scope].sort((a, b) => a - b).join(',') : '*');

/**
 * A board (the whole fleet's, or some bases'), built once and served as the same JSON until the records or the clock change it.
 *
 * Every tablet's airframe list and every hangar screen read this every few seconds, and building it derives every
 * airframe's state. Whether the records changed is read from the database on each request (the audit trail's head,
 * which every signed check, hold decision, acceptance, fleet and limits change moves, and the newest draft touch),
 * so an instance never serves what another instance has already changed. The clock is the other input: the
 * snapshot is good until the first check runs out or started check is abandoned. Then the same records are judged
 * again at the new instant without reading them (with thousands of airframes some check runs out every few
 * seconds, and reading a whole fleet's records takes seconds); they are read again when they change, and at least
 * every maxAgeMs (in the background: the fingerprint says they are unchanged, so readers get them meanwhile).
 *
 * What is sent is encoded once per snapshot (bytes, entity tag, compressed copies): see EncodedJson.
 */
export class BoardSnapshots {
  private readonly scopes = new Map<string, BoardScopeSnapshots>();

  constructor(
    private readonly sequelize: Sequelize,
    private readonly maxAgeMs = 30_000,
  ) {}

  /** What the board is built from, as the database has it now: another instance's change moves it too. */
  fingerprint(): Promise<string> {
    return boardFingerprint(this.sequelize);
  }

  private of(scope: BoardScope): BoardScopeSnapshots {
    const key = scopeKey(scope);
    let found = this.scopes.get(key);
    if (!found) {
      // A hangar has a handful of boards; a caller making up scopes cannot grow this without bound.
      if (this.scopes.size >= 200) this.scopes.clear();
      found = new BoardScopeSnapshots(this.sequelize, scope, this.maxAgeMs);
      this.scopes.set(key, found);
    }
    return found;
  }

  /** The board ready to send, with a tablet's own base first when it has one. */
  async encoded(now = new Date(), scope?: BoardScope, ownBase: number | null = null): Promise<EncodedJson> {
    const snap = await this.of(scope).get(now);
    if (ownBase === null) return snap.encoded;
    let found = snap.ownBaseFirst.get(ownBase);
    if (!found) {
      found = new EncodedJson(JSON.stringify(ownBaseFirst(snap.summaries, ownBase)));
      snap.ownBaseFirst.set(ownBase, found);
    }
    return found;
  }

  /** The same board as objects, for a caller that pages or reorders it. */
  summaries(now = new Date(), scope?: BoardScope): Promise<AirframeSummary[]> {
    return this.of(scope)
      .get(now)
      .then((snap) => snap.summaries);
  }
}

class BoardScopeSnapshots {
  private current: Snapshot | undefined;
  private building: { fingerprint: string; done: Promise<Snapshot> } | undefined;

  constructor(
    private readonly sequelize: Sequelize,
    private readonly scope: BoardScope,
    private readonly maxAgeMs: number,
  ) {}

  async get(now: Date): Promise<Snapshot> {
    // Read before building: a change that lands while building makes the next read rebuild, never the reverse.
    const fingerprint = await boardFingerprint(this.sequelize);
    const t = now.getTime();
    const snap = this.current;
    if (snap && snap.fingerprint === fingerprint && t >= snap.builtAt) {
      // The records are unchanged; past their age they are read again in the background, and readers are not
      // kept waiting for a read that takes seconds on a large fleet.
      if (t >= snap.recordsUntil && !this.building)
        void this.startBuild(fingerprint, now).catch(() => undefined);
      if (t < snap.goodUntil) return snap;
      // Only the clock moved: the same records, judged at this instant (only the airframes it changed).
      this.current = this.judged(snap.records, fingerprint, snap.recordsUntil, now, snap.judgement);
      return this.current;
    }
    // Readers arriving while it is being built wait for the same build.
    if (this.building?.fingerprint === fingerprint) return this.building.done;
    return this.startBuild(fingerprint, now);
  }

  /** A build the next readers of the same fingerprint share; a failed one leaves the current snapshot in place. */
  private startBuild(fingerprint: string, now: Date): Promise<Snapshot> {
    const done = this.build(fingerprint, now);
    this.building = { fingerprint, done };
    const over = () => {
      if (this.building?.done === done) this.building = undefined;
    };
    done.then(over, over);
    return done;
  }

  private async build(fingerprint: string, now: Date): Promise<Snapshot> {
    const records = await loadFleetRecords(this.sequelize, now, undefined, this.scope);
    this.current = this.judged(records, fingerprint, now.getTime() + this.maxAgeMs, now);
    return this.current;
  }

  private judged(
    records: FleetRecords,
    fingerprint: string,
    recordsUntil: number,
    now: Date,
    earlier?: FleetJudgement,
  ): Snapshot {
    const judgement = judgeFleet(records, now, earlier);
    const { details, nextClockChange } = judgement;
    const summaries = sortForBoard(details.map((d) => d.summary));
    return {
      fingerprint,
      builtAt: now.getTime(),
      recordsUntil,
      goodUntil: Math.min(nextClockChange?.getTime() ?? Infinity, recordsUntil),
      encoded: new EncodedJson(JSON.stringify(summaries)),
      ownBaseFirst: new Map(),
      summaries,
      records,
      judgement,
    };
  }
}
