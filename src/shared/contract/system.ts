import { z } from 'zod';
import { endpoint } from './endpoint';

export const health = endpoint({
  method: 'GET', path: '/api/health', access: 'public',
  summary: 'Whether the server and its database answer (503 when the database does not).',
  response: z.object({ ok: z.boolean(), db: z.enum(['up', 'down']) }),
  errors: { 503: '`{ok: false, db: "down"}`' },
});

export const publicConfig = endpoint({
  method: 'GET', path: '/api/config', access: 'public',
  summary: 'What the browser may know of the setup: whether payments are in test mode, the development mailbox.',
  response: z.object({ paymentsTestMode: z.boolean(), devMailboxUrl: z.string().nullable() }),
});
