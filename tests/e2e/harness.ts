import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Server } from 'node:http';
import { inject } from 'vitest';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { createApp } from '../../server/app';
import { systemClock } from '../../server/platform/clock';
import { loadConfig, type Config } from '../../server/platform/config';
import { createDb } from '../../server/platform/db';
import { createLogger } from '../../server/platform/logger';
import { createMailer } from '../../server/platform/mailer';
import { startMailFake, type MailFake } from '../../fakes/mail/server';
import { startPaymentsFake, type PaymentsFake } from '../../fakes/payments/server';
import type { Knex } from 'knex';
import { freePort } from '../../scripts/lib/postgres.mjs';

export const DEMO_PASSWORD = 'tamp-and-tally-demo';
export const SCREENSHOTS = path.resolve('tests/.screenshots');

export interface Served {
  url: string;
  db: Knex;
  mail: MailFake;
  /** The payments fake the app's SDK talks to; its webhooks reach the app. */
  payments: PaymentsFake;
  config: Config;
  browser: BrowserContext;
  newPage(): Promise<Page>;
  signIn(page: Page, email: string): Promise<void>;
  shot(page: Page, name: string): Promise<void>;
  close(): Promise<void>;
}

/**
 * The built client and the API served on a free loopback port from the
 * seeded demo database, with its own mailbox and a headless Debian Chromium.
 */
export async function serveDemo(): Promise<Served> {
  if (!fs.existsSync(path.resolve('dist/index.html'))) throw new Error('dist/ is missing: run `npx vite build` first (npm test does).');
  const databaseUrl = inject('e2eDatabaseUrl');
  const db = createDb(databaseUrl);
  const mail = await startMailFake({ smtpPort: 0, httpPort: 0 });
  // The app needs its own URL (for links in e-mails) before it listens.
  const port = await freePort();
  const webhookSecret = 'whsec_e2e_payments_fake';
  const payments = await startPaymentsFake({ port: 0, webhookUrl: `http://127.0.0.1:${port}/api/webhooks/payments`, webhookSecret, webhookRetryDelaysMs: [100, 300, 600] });
  const config = loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: databaseUrl,
    SMTP_PORT: String(mail.smtpPort),
    LOG_LEVEL: 'silent',
    APP_URL: `http://127.0.0.1:${port}`,
    DEV_MAILBOX_URL: mail.httpUrl,
    LOGIN_MAX_FAILURES_PER_ADDRESS: '10000',
    STRIPE_API_HOST: payments.host,
    STRIPE_API_PORT: String(payments.port),
    STRIPE_API_PROTOCOL: 'http',
    STRIPE_WEBHOOK_SECRET: webhookSecret,
  });
  const mailer = createMailer({ host: '127.0.0.1', port: mail.smtpPort, from: config.MAIL_FROM });
  const app = createApp({ db, config, mailer, logger: createLogger('silent'), clock: systemClock });
  const server = await new Promise<Server>((resolve) => {
    const s = app.listen(port, '127.0.0.1', () => resolve(s));
  });
  const userDir = fs.mkdtempSync(path.join(os.tmpdir(), 'tamp-chromium-'));
  const browser = await chromium.launchPersistentContext(userDir, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1280, height: 860 },
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--disable-dev-shm-usage'],
  });
  fs.mkdirSync(SCREENSHOTS, { recursive: true });
  const url = `http://127.0.0.1:${port}`;
  return {
    url,
    db,
    mail,
    payments,
    config,
    browser,
    async newPage() {
      const page = await browser.newPage();
      page.setDefaultTimeout(15_000);
      return page;
    },
    async signIn(page, email) {
      // Pages share one browser profile: sign in from a clean slate.
      await browser.clearCookies();
      await page.goto(`${url}/sign-in`);
      await page.getByLabel('E-mail').fill(email);
      await page.getByLabel('Password').fill(DEMO_PASSWORD);
      await page.getByRole('button', { name: /sign in/i }).click();
      await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    },
    async shot(page, name) {
      await page.screenshot({ path: path.join(SCREENSHOTS, `${name}.png`), fullPage: true });
    },
    async close() {
      await browser.close();
      fs.rmSync(userDir, { recursive: true, force: true });
      await new Promise((r) => server.close(r));
      await app.locals.shutdown();
      await mail.close();
      await payments.close();
      await db.destroy();
    },
  };
}


/** A GET through the page's own session (its cookie), as the client would make it; throws on an error status. */
export async function getJson<T>(page: Page, url: string): Promise<T> {
  return page.evaluate(async (u) => {
    const r = await fetch(u);
    if (!r.ok) throw new Error(`${u} answered ${r.status}`);
    return r.json();
  }, url) as Promise<T>;
}
