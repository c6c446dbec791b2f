import { describe, expect, it } from 'vitest';
import { SignInThrottle, defaultThrottlePolicy } from './sign-in-throttle';

function throttleAt(start = 1_000_000) {
  const clock = { now: start };
  return { clock, throttle: new SignInThrottle(defaultThrottlePolicy, () => clock.now) };
}

describe('sign-in throttle', () => {
  it('when a badge keeps failing, then each next attempt waits twice as long as the one before, up to the refusal', async () => {
    const { throttle } = throttleAt();
    const waits: number[] = [];
    for (let i = 0; i < 6; i++) {
      const decision = await throttle.decide('4101', 'a');
      waits.push('waitMs' in decision ? decision.waitMs : -1);
      await throttle.recordFailure('4101', 'a', true);
    }
    expect(waits).toEqual([0, 250, 500, 1000, 2000, 4000]);
    for (let i = 0; i < 2; i++) await throttle.recordFailure('4101', 'a', true);
    // 250 ms doubled seven times is 32 s, beyond the 10 s an attempt is held: refused with the time to wait.
    expect(await throttle.decide('4101', 'a')).toEqual({ refuseForMs: 30_000 });
  });

  it('when the same badge number is typed in another case, then it counts as the same badge', async () => {
    const { throttle } = throttleAt();
    await throttle.recordFailure('ab-12', 'a', false);
    expect(await throttle.decide('AB-12', 'b')).toEqual({ waitMs: 250 });
  });

  it('when one address fails on many badges, then it is slowed only after its free failures', async () => {
    const { throttle } = throttleAt();
    for (let i = 0; i < defaultThrottlePolicy.addressFreeFailures - 1; i++) {
      await throttle.recordFailure(`badge-${i}`, '10.0.0.7', false);
    }
    expect(await throttle.decide('fresh-1', '10.0.0.7')).toEqual({ waitMs: 0 });
    await throttle.recordFailure('badge-x', '10.0.0.7', false);
    expect(await throttle.decide('fresh-2', '10.0.0.7')).toEqual({ waitMs: 100 });
    await throttle.recordFailure('badge-y', '10.0.0.7', false);
    expect(await throttle.decide('fresh-3', '10.0.0.7')).toEqual({ waitMs: 200 });
    expect(await throttle.decide('fresh-3', '10.0.0.8')).toEqual({ waitMs: 0 });
  });

  it('when an attempt on a badge is still being checked, then a second one at the same time is refused', async () => {
    const { throttle } = throttleAt();
    throttle.begin('4101');
    expect(await throttle.decide('4101', 'b')).toHaveProperty('refuseForMs');
    throttle.end('4101');
    expect(await throttle.decide('4101', 'b')).toEqual({ waitMs: 0 });
  });

  it('when the window has passed, then old failures no longer slow the badge', async () => {
    const { clock, throttle } = throttleAt();
    for (let i = 0; i < 4; i++) await throttle.recordFailure('4101', 'a', true);
    clock.now += defaultThrottlePolicy.windowMs;
    expect(await throttle.decide('4101', 'a')).toEqual({ waitMs: 0 });
  });

  it('when failures come from several addresses and tablets, then the count says how many of each', async () => {
    const { throttle } = throttleAt();
    await throttle.recordFailure('4101', 'a', true);
    await throttle.recordFailure('4101', 'b', false);
    expect(await throttle.recordFailure('4101', 'c', false)).toEqual({
      failures: 3,
      fromTablets: 1,
      addresses: 3,
    });
  });
});
