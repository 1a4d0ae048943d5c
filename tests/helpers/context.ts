import { inject } from 'vitest';
import type { Express } from 'express';
import type { Knex } from 'knex';
import { createApp } from '../../server/app';
import { systemClock, type Clock } from '../../server/platform/clock';
import { loadConfig, type Config } from '../../server/platform/config';
import { createDb } from '../../server/platform/db';
import { createLogger } from '../../server/platform/logger';
import { createMailer } from '../../server/platform/mailer';
import { startMailFake, type MailFake } from '../../fakes/mail/server';

export interface TestContext {
  db: Knex;
  app: Express;
  mail: MailFake;
  config: Config;
  close(): Promise<void>;
}

/** A real app on the throwaway database with its own fake mailbox on a free port; `clock` pins "now" (fixedClock). */
export async function startTestApp(env: Record<string, string> = {}, databaseUrl = inject('databaseUrl'), clock: Clock = systemClock): Promise<TestContext> {
  const db = createDb(databaseUrl);
  const mail = await startMailFake({ smtpPort: 0, httpPort: 0 });
  const config = loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: databaseUrl,
    SMTP_PORT: String(mail.smtpPort),
    LOG_LEVEL: 'silent',
    APP_URL: 'http://127.0.0.1:3999',
    // Every test file signs in from 127.0.0.1; the per-address limit has its own test.
    LOGIN_MAX_FAILURES_PER_ADDRESS: '10000',
    ...env,
  });
  const mailer = createMailer({ host: '127.0.0.1', port: config.SMTP_PORT, from: config.MAIL_FROM });
  const app = createApp({ db, config, mailer, logger: createLogger('silent'), clock });
  return {
    db,
    app,
    mail,
    config,
    async close() {
      await app.locals.shutdown();
      await mail.close();
      await db.destroy();
    },
  };
}
