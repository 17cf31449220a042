// Every browser test runs under the app's Content-Security-Policy (the meta tag in index.html):
// a test that makes the app break the policy fails here, whatever it was testing.
import { afterEach, expect } from 'vitest';
import { cspViolations } from './helpers';

afterEach(() => {
  const seen = cspViolations.splice(0);
  expect(seen, 'Content-Security-Policy violations reported by the page').toEqual([]);
});
