import { describe, expect, it } from 'vitest';
import pino from 'pino';
import { serialTask } from './serial-task';

const silent = pino({ level: 'silent' });

describe('serialTask', () => {
  it('when it is asked three times while running, then it runs once more afterwards, not three times', async () => {
    let runs = 0;
    let release: () => void = () => {};
    const run = serialTask(
      'test',
      async () => {
        runs += 1;
        if (runs === 1) await new Promise<void>((ok) => (release = ok));
      },
      silent,
    );
    const first = run();
    void run();
    void run();
    release();
    await first;
    expect(runs).toBe(2);
  });

  it('when the task throws, then the caller is not rejected and a later call runs again', async () => {
    let runs = 0;
    const run = serialTask(
      'test',
      async () => {
        runs += 1;
        throw new Error('smtp down');
      },
      silent,
    );
    await expect(run()).resolves.toBeUndefined();
    await run();
    expect(runs).toBe(2);
  });
});
