import { inject, test, expect } from 'vitest';
import { createDb } from '../../../server/platform/db';
import { seedLargeMenu } from '../../../scripts/bench/large-menu';
import { benchRepricing } from '../../../scripts/bench/repricing';

// The bench function runs on the large menu and reports figures measured in the same run.
test('the repricing bench times the preview and the full-menu costing on the large menu', { timeout: 120_000 }, async () => {
  const db = createDb(inject('databaseUrl'));
  try {
    const menu = await seedLargeMenu(db);
    const r = await benchRepricing(db, menu.businessId, 3);
    expect(r.affectedRows).toBeGreaterThan(0);
    expect(r.preview.runs).toBe(3);
    expect(r.preview.p50).toBeGreaterThan(0);
    expect(r.menuCosting.p50).toBeGreaterThan(0);
    expect(r.ratio).toBeCloseTo(r.preview.p50 / r.menuCosting.p50, 10);
    console.log(`repricing bench: preview p50 ${r.preview.p50.toFixed(1)} ms, menu costing p50 ${r.menuCosting.p50.toFixed(1)} ms, ${r.affectedRows} rows`);
  } finally {
    await db.destroy();
  }
});
