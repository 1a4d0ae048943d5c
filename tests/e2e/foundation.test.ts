import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { entriesFor } from '../../src/app/navigation';
import { serveDemo, type Served } from './harness';

let s: Served;
beforeAll(async () => {
  s = await serveDemo();
});
afterAll(() => s?.close());

describe('each demo role signs in and sees its own navigation', () => {
  test.each([
    ['owner@demo.test', 'owner'],
    ['manager@demo.test', 'manager'],
    ['barista@demo.test', 'barista'],
    ['bookkeeper@demo.test', 'bookkeeper'],
  ] as const)('%s', async (email, role) => {
    const page = await s.newPage();
    try {
      await s.signIn(page, email);
      const nav = page.getByRole('navigation', { name: 'Sections' }).filter({ visible: true });
      await expect.poll(() => nav.getByRole('link').count()).toBeGreaterThan(0);
      const labels = (await nav.getByRole('link').allTextContents()).map((t) => t.trim());
      expect(labels).toEqual(entriesFor(role).map((e) => e.label));
      await expect.poll(() => page.getByText('Lantern Row Coffee').first().isVisible()).toBe(true);
      await s.shot(page, `home-${role}`);
      // The server, not the menu, decides: a barista asking for the team gets 403.
      if (role !== 'owner') {
        const status = await page.evaluate(async () => (await fetch('/api/team')).status);
        expect(status).toBe(403);
      }
    } finally {
      await page.close();
    }
  });
});

test('the owner invites a barista, who accepts through the e-mailed link and lands signed in', async () => {
  const page = await s.newPage();
  const email = `new-barista-${Date.now()}@demo.test`;
  try {
    await s.signIn(page, 'owner@demo.test');
    await page.goto(`${s.url}/team`);
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Role', { exact: true }).selectOption('barista');
    await page.getByRole('button', { name: /send invitation/i }).click();
    await expect.poll(() => page.getByText(email).count()).toBeGreaterThan(0);
    await s.shot(page, 'team-invited');
    const msg = await s.mail.waitForMessage((m) => m.to.includes(email));
    const link = msg.text.match(/http:\/\/127\.0\.0\.1:\d+\/accept-invite\?token=[A-Za-z0-9_-]+/)?.[0];
    expect(link).toBeTruthy();

    // The invitee is someone else: drop the owner's session first.
    await s.browser.clearCookies();
    const invitee = await s.newPage();
    await invitee.goto(link!);
    await invitee.getByLabel('Your name').fill('Rosa Quill');
    await invitee.getByLabel('Choose a password').fill('a-barista-password');
    await s.shot(invitee, 'accept-invite');
    await invitee.getByRole('button').filter({ hasText: /join|accept|start/i }).click();
    await invitee.waitForURL((u) => !u.pathname.startsWith('/accept-invite'));
    const me = await invitee.evaluate(async () => (await fetch('/api/auth/me')).json());
    expect(me.user).toMatchObject({ email, role: 'barista', name: 'Rosa Quill' });
    await invitee.close();
  } finally {
    await page.close();
  }
});
