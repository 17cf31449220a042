import { describe, expect, it } from 'vitest';
import { parseHash, parseRoute } from '../src/ui/router';

describe('parseHash', () => {
  it('maps hashes to areas; an empty hash is today, an unknown or malformed one is not-found', () => {
    expect(parseHash('#/sites')).toBe('sites');
    expect(parseHash('#/checks?instrument=ph-1')).toBe('checks');
    expect(parseHash('#cautions')).toBe('cautions');
    expect(parseHash('')).toBe('today');
    expect(parseHash('#/no-such-area')).toBe('not-found');
    expect(parseRoute('#/sample/%')).toMatchObject({ area: 'not-found', param: '#/sample/%' });
    expect(parseRoute('#/sample/a%20b')).toMatchObject({ area: 'sample', param: 'a b' });
  });
});
