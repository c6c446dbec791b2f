import { EventEmitter } from 'node:events';

/**
 * Tells open board streams that something changed; they then fetch the board again. A change stored through this
 * instance is told at once (`notify`); one stored through another instance is found by `watch`, which reads the
 * database's board fingerprint every second.
 */
export class ChangeFeed {
  private readonly emitter = new EventEmitter();
  private version = 0;
  private watcher: NodeJS.Timeout | undefined;

  constructor() {
    this.emitter.setMaxListeners(0);
  }

  notify(): void {
    this.version += 1;
    this.emitter.emit('change', this.version);
  }

  subscribe(listener: (version: number) => void): () => void {
    this.emitter.on('change', listener);
    return () => this.emitter.off('change', listener);
  }

  /**
   * Every `everyMs` reads `fingerprint` (what the board is built from: the audit trail's head and the drafts) and
   * tells the streams when it moved. It reads even with no stream open, so a stream opened just before a change
   * compares with what was there before it. A failed read (the database restarting) is skipped; the next one
   * compares with the last fingerprint read.
   */
  watch(fingerprint: () => Promise<string>, everyMs = 1_000): void {
    let last: string | undefined;
    let reading = false;
    this.watcher = setInterval(() => {
      if (reading) return;
      reading = true;
      fingerprint()
        .then((now) => {
          if (last !== undefined && now !== last) this.notify();
          last = now;
        })
        .catch(() => {})
        .finally(() => {
          reading = false;
        });
    }, everyMs);
    this.watcher.unref();
  }

  /** Ends every open board stream (the server is stopping); the boards reconnect to whichever server is up. */
  close(): void {
    clearInterval(this.watcher);
    this.emitter.emit('close');
  }

  onClose(listener: () => void): () => void {
    this.emitter.on('close', listener);
    return () => this.emitter.off('close', listener);
  }

  get current(): number {
    return this.version;
  }
}
