import fs from 'node:fs';
import { loadConfig, ConfigError } from './platform/config';
import { createDb } from './platform/db';
import { createLogger } from './platform/logger';
import { createMailer } from './platform/mailer';
import { createApp } from './app';
import { systemClock } from './platform/clock';

// A local .env (see .env.example) fills in what the shell did not set.
if (fs.existsSync('.env')) process.loadEnvFile('.env');

let config;
try {
  config = loadConfig();
} catch (err) {
  if (err instanceof ConfigError) {
    console.error(err.message);
    process.exit(1);
  }
  throw err;
}

const logger = createLogger(config.LOG_LEVEL);
const db = createDb(config.DATABASE_URL);
const mailer = createMailer({ host: config.SMTP_HOST, port: config.SMTP_PORT, from: config.MAIL_FROM });
const app = createApp({ db, config, mailer, logger, clock: systemClock });

const server = app.listen(config.PORT, config.HOST, () => {
  logger.info({ url: config.APP_URL }, 'Tamp & Tally is listening');
});

async function shutdown(signal: string) {
  logger.info({ signal }, 'shutting down');
  server.close();
  await app.locals.shutdown();
  await db.destroy();
  process.exit(0);
}
process.once('SIGINT', () => void shutdown('SIGINT'));
process.once('SIGTERM', () => void shutdown('SIGTERM'));
