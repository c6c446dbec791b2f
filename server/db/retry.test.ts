import { describe, expect, it } from 'vitest';
import { isTransient, retryTransient } from './retry';

// MariaDB error numbers (MariaDB's error code list, from memory): 1213 ER_LOCK_DEADLOCK, which Galera also raises
// for a certification failure; 1205 ER_LOCK_WAIT_TIMEOUT; 1047 ER_UNKNOWN_COM_ERROR, "WSREP has not yet prepared
// node for application use"; 1062 ER_DUP_ENTRY.
const sqlError = (errno: number) => Object.assign(new Error(`error ${errno}`), { errno });
const quick = { tries: 5, firstDelayMs: 1 };

describe('retrying a transaction after a transient failure', () => {
  it('when the first try meets a certification failure, then the same work runs again and its answer is returned once', async () => {
    const seen: number[] = [];
    const answer = await retryTransient(async (attempt) => {
      seen.push(attempt);
      if (attempt === 1) throw sqlError(1213);
      return 'stored';
    }, quick);
    expect(answer).toBe('stored');
    expect(seen).toEqual([1, 2]);
  });

  it('when the failure keeps coming, then it gives up after the policy tries and raises the last error', async () => {
    let tries = 0;
    const run = retryTransient(async () => {
      tries += 1;
      throw sqlError(1205);
    }, quick);
    await expect(run).rejects.toMatchObject({ errno: 1205, triedTimes: 5 });
    expect(tries).toBe(5);
  });

  it('when the error is not transient (a duplicate id, a refusal), then it is raised at once', async () => {
    let tries = 0;
    const run = retryTransient(async () => {
      tries += 1;
      throw sqlError(1062);
    }, quick);
    await expect(run).rejects.toMatchObject({ errno: 1062 });
    expect(tries).toBe(1);
  });

  it('when Sequelize wraps the connector error, then its number is still read', () => {
    expect(isTransient({ parent: { errno: 1213 } })).toBe(true);
    expect(isTransient({ original: { errno: 1047 } })).toBe(true);
    expect(isTransient(sqlError(1213))).toBe(true);
    expect(isTransient(sqlError(2013))).toBe(false);
    expect(isTransient(new Error('socket closed'))).toBe(false);
    expect(isTransient(null)).toBe(false);
  });

  it('when it waits between tries, then the waits double with jitter up to the longest, within half and all of each step', async () => {
    const starts: number[] = [];
    await retryTransient(
      async (attempt) => {
        starts.push(performance.now());
        if (attempt < 6) throw sqlError(1213);
      },
      { tries: 6, firstDelayMs: 40, longestDelayMs: 60 },
    );
    const gaps = starts.slice(1).map((t, i) => t - starts[i]!);
    // Steps of 40, then 60 (the longest; doubling would give 640 by the last): each wait is at least half its step
    // and not far past it.
    [40, 60, 60, 60, 60].forEach((step, i) => {
      expect(gaps[i]).toBeGreaterThanOrEqual(step / 2 - 2);
      expect(gaps[i]).toBeLessThan(step + 60);
    });
  });
});
