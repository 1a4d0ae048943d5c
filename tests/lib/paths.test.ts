import { describe, expect, it } from 'vitest';
import { safeNext } from '../../src/lib/paths';

// After sign-in the app follows ?next= only to its own pages, never to another
// site (an open redirect, OWASP "Unvalidated Redirects and Forwards").
describe('safeNext', () => {
  it('keeps same-site paths', () => {
    expect(safeNext('/team')).toBe('/team');
    expect(safeNext('/settings?tab=sites')).toBe('/settings?tab=sites');
  });

  it('falls back to Home for anything that could leave the site', () => {
    for (const bad of ['https://elsewhere.test/', '//elsewhere.test', '/\\elsewhere.test', 'javascript:alert(1)', '', null, undefined]) {
      expect(safeNext(bad)).toBe('/');
    }
  });
});
