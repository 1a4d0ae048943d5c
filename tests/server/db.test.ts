import { inject, test, expect } from 'vitest';
import { createDb } from '../../server/platform/db';

test('the throwaway database is migrated', async () => {
  const db = createDb(inject('databaseUrl'));
  const r = await db.raw("select to_regclass('public.businesses') as t");
  expect(r.rows[0].t).toBe('businesses');
  await db.destroy();
});
