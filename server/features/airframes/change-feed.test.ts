import { afterEach, describe, expect, it, vi } from 'vitest';
import { ChangeFeed } from './change-feed';

describe('board change feed watching the database', () => {
  afterEach(() => {
    vi.useRealTimers();
  });

  it('when the fingerprint moves between reads, then the streams are told once per move; a failed read tells nothing', async () => {
    vi.useFakeTimers();
    const readings: (string | Error)[] = [
      'head-1',
      'head-1',
      'head-2',
      new Error('node restarting'),
      'head-2',
      'head-3',
    ];
    const feed = new ChangeFeed();
    const told: number[] = [];
    feed.subscribe((version) => told.push(version));
    feed.watch(async () => {
      const next = readings.shift() ?? 'head-3';
      if (next instanceof Error) throw next;
      return next;
    }, 1_000);
    for (let i = 0; i < 6; i += 1) await vi.advanceTimersByTimeAsync(1_000);
    // head-1 is the first reading (nothing to compare with), head-2 and head-3 are moves.
    expect(told).toEqual([1, 2]);
    feed.close();
    await vi.advanceTimersByTimeAsync(5_000);
    expect(told).toEqual([1, 2]);
  });
});
