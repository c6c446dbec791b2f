import { describe, expect, it } from 'vitest';
import type { LimitBand, Verdict } from '../schemas/limits';
import { applicableBands, conditionMatches, contains, intersects, isEmpty, worstBand } from './bands';

const edge = (value: number, closed: boolean) => ({ value, closed });
const band = (id: string, verdict: Verdict, when?: LimitBand['when']): LimitBand => ({
  id,
  lower: null,
  upper: null,
  verdict,
  message: id,
  action: id,
  ...(when ? { when } : {}),
});

describe('intervals', () => {
  it('when an interval is unbounded on a side, then it is never empty and holds every value on that side', () => {
    expect(isEmpty({ lower: null, upper: edge(0, false) })).toBe(false);
    expect(isEmpty({ lower: edge(0, false), upper: null })).toBe(false);
    expect(isEmpty({ lower: null, upper: null })).toBe(false);
    expect(contains({ lower: null, upper: edge(0, false) }, -1e308)).toBe(true);
    expect(contains({ lower: edge(0, false), upper: null }, 1e308)).toBe(true);
  });

  it('when the lower edge is above the upper, then the interval is empty', () => {
    expect(isEmpty({ lower: edge(2, true), upper: edge(1, true) })).toBe(true);
  });

  it('when both edges are the same value, then only a closed-closed interval holds it', () => {
    expect(isEmpty({ lower: edge(1, true), upper: edge(1, true) })).toBe(false);
    expect(isEmpty({ lower: edge(1, false), upper: edge(1, true) })).toBe(true);
    expect(isEmpty({ lower: edge(1, true), upper: edge(1, false) })).toBe(true);
  });

  // IEEE 754 binary64: the next double after 0 is Number.MIN_VALUE, and after -1 towards zero is -1 + 2^-53.
  it('when an open interval runs between two neighbouring doubles, then it is empty; with a double between, it is not', () => {
    expect(isEmpty({ lower: edge(0, false), upper: edge(Number.MIN_VALUE, false) })).toBe(true);
    expect(isEmpty({ lower: edge(0, false), upper: edge(2 * Number.MIN_VALUE, false) })).toBe(false);
    expect(isEmpty({ lower: edge(-1, false), upper: edge(-1 + 2 ** -53, false) })).toBe(true);
    expect(isEmpty({ lower: edge(-1, false), upper: edge(-1 + 2 ** -52, false) })).toBe(false);
    expect(isEmpty({ lower: edge(1, false), upper: edge(1 + 2 ** -52, false) })).toBe(true);
    expect(isEmpty({ lower: edge(1, true), upper: edge(1 + 2 ** -52, false) })).toBe(false);
  });

  it('when two intervals meet at an edge, then they intersect only if both hold it', () => {
    const low = (closed: boolean) => ({ lower: edge(0, true), upper: edge(5, closed) });
    const high = (closed: boolean) => ({ lower: edge(5, closed), upper: edge(9, true) });
    expect(intersects(low(true), high(true))).toBe(true);
    expect(intersects(low(true), high(false))).toBe(false);
    expect(intersects(low(false), high(true))).toBe(false);
  });

  it('when one interval is unbounded, then the other decides', () => {
    expect(intersects({ lower: null, upper: null }, { lower: edge(3, true), upper: edge(3, true) })).toBe(
      true,
    );
    expect(intersects({ lower: edge(3, true), upper: edge(3, true) }, { lower: null, upper: null })).toBe(
      true,
    );
    expect(intersects({ lower: null, upper: edge(2, true) }, { lower: edge(3, true), upper: null })).toBe(
      false,
    );
    expect(intersects({ lower: edge(3, true), upper: null }, { lower: null, upper: edge(2, true) })).toBe(
      false,
    );
  });

  it('when the intervals overlap in the middle, then the tighter edges are used on both sides', () => {
    expect(
      intersects(
        { lower: edge(0, true), upper: edge(6, true) },
        { lower: edge(4, true), upper: edge(9, true) },
      ),
    ).toBe(true);
    expect(
      intersects(
        { lower: edge(4, true), upper: edge(9, true) },
        { lower: edge(0, true), upper: edge(6, true) },
      ),
    ).toBe(true);
    expect(
      intersects(
        { lower: edge(0, true), upper: edge(3, true) },
        { lower: edge(4, true), upper: edge(9, true) },
      ),
    ).toBe(false);
    expect(
      intersects(
        { lower: edge(4, true), upper: edge(9, true) },
        { lower: edge(0, true), upper: edge(3, true) },
      ),
    ).toBe(false);
  });
});

describe('conditions and the worst band', () => {
  it('when a band names system pressure, then it applies only with that pressure', () => {
    expect(conditionMatches({ systemPressure: 'on' }, { systemPressure: 'on' })).toBe(true);
    expect(conditionMatches({ systemPressure: 'on' }, { systemPressure: 'relieved' })).toBe(false);
    expect(conditionMatches({ systemPressure: 'on' }, {})).toBe(false);
    expect(conditionMatches({ attitude: 'on_wheels' }, { attitude: 'on_wheels', systemPressure: 'on' })).toBe(
      true,
    );
    expect(conditionMatches({ attitude: 'on_wheels' }, { attitude: 'on_jacks_gear_retracted' })).toBe(false);
    expect(conditionMatches({}, {})).toBe(true);
    expect(conditionMatches(undefined, {})).toBe(true);
  });

  it('when bands are filtered by context, then the unconditional ones and the matching ones stay in order', () => {
    const bands = [
      band('any', 'in_limits'),
      band('on', 'service', { systemPressure: 'on' }),
      band('off', 'service', { systemPressure: 'relieved' }),
    ];
    expect(applicableBands(bands, { systemPressure: 'on' }).map((b) => b.id)).toEqual(['any', 'on']);
  });

  it('when bands of each verdict compete, then out of limits beats service beats in limits, and the first of equals wins', () => {
    const ok = band('ok', 'in_limits');
    const service = band('service', 'service');
    const out = band('out', 'out_of_limits');
    expect(worstBand([ok, service, out])?.id).toBe('out');
    expect(worstBand([out, service, ok])?.id).toBe('out');
    expect(worstBand([ok, service])?.id).toBe('service');
    expect(worstBand([service, ok])?.id).toBe('service');
    expect(worstBand([ok, band('ok2', 'in_limits')])?.id).toBe('ok');
    expect(worstBand([])).toBeUndefined();
  });
});
