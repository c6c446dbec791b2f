import type { Sequelize } from 'sequelize';
import { boardFingerprint } from './airframes.repository';
import { fleetStatuses, sortForBoard } from './airframes.service';

interface Snapshot {
  fingerprint: string;
  builtAt: number;
  goodUntil: number;
  body: string;
}

/**
 * The whole fleet's board, built once and served as the same JSON until the records or the clock change it.
 *
 * Every tablet's airframe list and every hangar screen read this every few seconds, and building it derives every
 * airframe's state. Whether the records changed is read from the database on each request (the audit trail's head,
 * which every signed check, hold decision, acceptance, fleet and limits change moves, and the newest draft touch),
 * so an instance never serves what another instance has already changed. The clock is the other input: the
 * snapshot is good until the first check runs out or started check is abandoned, and never longer than maxAgeMs.
 */
export class BoardSnapshots {
  private current: Snapshot | undefined;
  private building: { fingerprint: string; done: Promise<Snapshot> } | undefined;

  constructor(
    private readonly sequelize: Sequelize,
    private readonly maxAgeMs = 30_000,
  ) {}

  /** What the board is built from, as the database has it now: another instance's change moves it too. */
  fingerprint(): Promise<string> {
    return boardFingerprint(this.sequelize);
  }

  /** The board as JSON text, sorted for the screen. */
  async json(now = new Date()): Promise<string> {
    // Read before building: a change that lands while building makes the next read rebuild, never the reverse.
    const fingerprint = await boardFingerprint(this.sequelize);
    const t = now.getTime();
    const snap = this.current;
    if (snap && snap.fingerprint === fingerprint && t >= snap.builtAt && t < snap.goodUntil) return snap.body;
    // Readers arriving while it is being built wait for the same build.
    if (this.building?.fingerprint === fingerprint) return (await this.building.done).body;
    const done = this.build(fingerprint, now);
    this.building = { fingerprint, done };
    try {
      return (await done).body;
    } finally {
      if (this.building?.done === done) this.building = undefined;
    }
  }

  private async build(fingerprint: string, now: Date): Promise<Snapshot> {
    const { details, nextClockChange } = await fleetStatuses(this.sequelize, now);
    const t = now.getTime();
    const snap: Snapshot = {
      fingerprint,
      builtAt: t,
      goodUntil: Math.min(nextClockChange?.getTime() ?? Infinity, t + this.maxAgeMs),
      body: JSON.stringify(sortForBoard(details.map((d) => d.summary))),
    };
    this.current = snap;
    return snap;
  }
}
