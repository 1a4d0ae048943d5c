import { describe, expect, it } from 'vitest';
import { entriesFor, entryForPath, navigation } from '../../src/app/navigation';
import { ROLES as roles } from '../../src/shared/capabilities';
import { paths } from '../../src/lib/paths';

describe('navigation', () => {
  it('shows Team and Settings to owners only, Home to every role', () => {
    const labels = (role: (typeof roles)[number]) => entriesFor(role).map((e) => e.label);
    expect(labels('owner')).toEqual(expect.arrayContaining(['Home', 'Team', 'Settings']));
    for (const role of roles.filter((r) => r !== 'owner')) {
      expect(labels(role)).toContain('Home');
      expect(labels(role)).not.toContain('Team');
      expect(labels(role)).not.toContain('Settings');
    }
  });

  it('finds the section a URL belongs to, sub-pages included, and Home only for "/"', () => {
    expect(entryForPath('/')?.label).toBe('Home');
    expect(entryForPath('/team')?.label).toBe('Team');
    expect(entryForPath('/settings/cup-sizes')?.label).toBe('Settings');
    expect(entryForPath('/getting-started')).toBeUndefined();
    expect(entryForPath('/teams')).toBeUndefined();
  });

  it('lists each path once', () => {
    expect(new Set(navigation.map((e) => e.path)).size).toBe(navigation.length);
  });
});

describe('paths', () => {
  it('builds links with their query', () => {
    expect(paths.signIn.href('/team?x=1')).toBe('/sign-in?next=%2Fteam%3Fx%3D1');
    expect(paths.signIn.href()).toBe('/sign-in');
    expect(paths.api.teamMember('a b')).toBe('/api/team/members/a%20b');
  });
});
