import { describe, expect, it } from 'vitest';
import { parseHash } from '../src/ui/router';

describe('parseHash', () => {
  it('maps hashes to areas and anything unknown to today', () => {
    expect(parseHash('#/sites')).toBe('sites');
    expect(parseHash('#/checks?instrument=ph-1')).toBe('checks');
    expect(parseHash('#cautions')).toBe('cautions');
    expect(parseHash('')).toBe('today');
    expect(parseHash('#/no-such-area')).toBe('today');
  });
});
