import { EventEmitter } from 'node:events';

/** Tells open board streams that something changed; they then fetch the board again. */
export class ChangeFeed {
  private readonly emitter = new EventEmitter();
  private version = 0;

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

  get current(): number {
    return this.version;
  }
}
