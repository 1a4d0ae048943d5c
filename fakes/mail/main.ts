import { startMailFake } from './server';

// Starts the local mail fake for development: `tsx fakes/mail/main.ts`.
function port(name: string, fallback: number): number {
  const raw = process.env[name];
  if (raw === undefined || raw === '') return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < 0 || n > 65535) {
    process.stderr.write(`${name} must be a port number (0–65535), got "${raw}"\n`);
    process.exit(1);
  }
  return n;
}

const fake = await startMailFake({
  host: process.env.MAIL_FAKE_HOST || '127.0.0.1',
  smtpPort: port('MAIL_FAKE_SMTP_PORT', 1025),
  httpPort: port('MAIL_FAKE_HTTP_PORT', 8025),
});
process.stdout.write(`mail fake: SMTP on port ${fake.smtpPort}, mailbox at ${fake.httpUrl}\n`);

const stop = () => {
  fake.close().then(() => process.exit(0));
};
process.once('SIGINT', stop);
process.once('SIGTERM', stop);
