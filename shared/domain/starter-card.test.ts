import { describe, expect, it } from 'vitest';
import { starterCard } from './starter-card';
import { validateTypeDefinition } from './limits';
import { demoTypes } from '../demo/demo-types';

describe('the starter card of a new type', () => {
  it('when a type is started, then its card carries the new code and name and passes the publication check', () => {
    const card = starterCard('NT-1', 'New type');
    expect(card.code).toBe('NT-1');
    expect(card.name).toBe('New type');
    expect(validateTypeDefinition(card)).toEqual([]);
  });

  it('when a type is started, then every check kind asks a checkpoint the card defines', () => {
    const card = starterCard('NT-1', 'New type');
    const codes = new Set(card.checkpoints.map((c) => c.code));
    for (const asked of Object.values(card.cards))
      for (const code of asked) expect(codes.has(code)).toBe(true);
  });

  it('when a type is started, then nothing of the demo types is in its card', () => {
    const card = starterCard('NT-1', 'New type');
    for (const demo of demoTypes) {
      expect({ ...card, code: demo.code, name: demo.name }).not.toEqual(demo);
      expect(card.checkpoints.map((c) => c.reference)).not.toContain(demo.checkpoints[0]!.reference);
    }
  });
});
