import { describe, expect, it } from 'vitest';
import { describeBand } from './reading-limits';

const edge = (value: number, closed: boolean) => ({ value, closed });
const band = (lower: ReturnType<typeof edge> | null, upper: ReturnType<typeof edge> | null) => ({
  id: 'b',
  lower,
  upper,
  verdict: 'in_limits' as const,
  message: 'm',
  action: 'a',
});

describe('describeBand', () => {
  it.each([
    ['an open upper edge', band(null, edge(100, false)), 'below 100 bar'],
    ['a closed upper edge', band(null, edge(100, true)), 'at or below 100 bar'],
    ['both edges', band(edge(100, true), edge(195, true)), 'at or above 100 bar and at or below 195 bar'],
    ['an open lower edge', band(edge(195, false), null), 'above 195 bar'],
  ])('when a band has %s, then its words keep the edge open or closed', (_what, b, text) => {
    expect(describeBand(b, { kind: 'pressure', unit: 'bar' })).toBe(text);
  });

  it('when the unit is US quarts, then it reads "US qt"', () => {
    expect(describeBand(band(edge(1, true), null), { kind: 'level', unit: 'US_qt' })).toBe(
      'at or above 1 US qt',
    );
  });

  it('when a yes/no band covers 1, then it reads "answer yes"; covering 0, "answer no"', () => {
    expect(describeBand(band(edge(1, true), edge(1, true)), { kind: 'yes_no', unit: null })).toBe(
      'answer yes',
    );
    expect(describeBand(band(edge(0, true), edge(0, true)), { kind: 'yes_no', unit: null })).toBe(
      'answer no',
    );
  });

  it('when a leak-rate band is for a dynamic leak, then it reads in drops per minute and names the state', () => {
    const dynamic = { ...band(edge(0, true), edge(3, true)), when: { leakState: 'dynamic' as const } };
    expect(describeBand(dynamic, { kind: 'leak_rate', unit: null })).toBe(
      'at or above 0 drops/min and at or below 3 drops/min for a dynamic leak',
    );
    expect(describeBand(band(edge(10, false), null), { kind: 'leak_rate', unit: null })).toBe(
      'above 10 drops/min',
    );
  });
});
