import { DEFAULT_WEBHOOK_SECRET, startPaymentsFake } from './server';

/** Runs the payments fake for development: PAYMENTS_FAKE_PORT, PAYMENTS_WEBHOOK_URL, PAYMENTS_WEBHOOK_SECRET. */
const rawPort = process.env.PAYMENTS_FAKE_PORT ?? '12111';
const port = Number(rawPort);
if (!Number.isInteger(port) || port < 0 || port > 65535) {
  console.error(`PAYMENTS_FAKE_PORT must be a port number, got '${rawPort}'`);
  process.exit(1);
}

const fake = await startPaymentsFake({
  host: process.env.PAYMENTS_FAKE_HOST ?? '127.0.0.1',
  port,
  webhookUrl: process.env.PAYMENTS_WEBHOOK_URL || undefined,
  webhookSecret: process.env.PAYMENTS_WEBHOOK_SECRET || DEFAULT_WEBHOOK_SECRET,
});
console.log(`payments fake listening on ${fake.url} (webhooks to ${process.env.PAYMENTS_WEBHOOK_URL || 'nowhere yet'})`);

const stop = () => {
  void fake.close().then(() => process.exit(0));
};
process.once('SIGINT', stop);
process.once('SIGTERM', stop);
