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

  /** Ends every open board stream (the server is stopping); the boards reconnect to whichever server is up. */
  close(): void {
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
