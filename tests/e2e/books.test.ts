import fs from 'node:fs';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { parse } from 'csv-parse/sync';
import { serveDemo, type Served } from './harness';

let s: Served;
beforeAll(async () => {
  s = await serveDemo();
});
afterAll(() => s?.close());

/** "£4,218.92" or "-£0.60" on the page → "4218.92" / "-0.60", as the CSV writes money. */
const plain = (text: string) => text.replace(/[^0-9.-]/g, '');

test('the bookkeeper opens last month, sees the figures and the charts, downloads the CSV, and its totals equal the page', async () => {
  const page = await s.newPage();
  try {
    await s.signIn(page, 'bookkeeper@demo.test');
    await page.getByRole('navigation', { name: 'Sections' }).filter({ visible: true }).getByRole('link', { name: 'Month end' }).click();
    await page.getByRole('heading', { name: 'Month end', level: 1 }).waitFor();
    const d = new Date();
    d.setUTCDate(1);
    d.setUTCMonth(d.getUTCMonth() - 1);
    const month = d.toISOString().slice(0, 7);
    await expect.poll(() => page.getByLabel('Month').inputValue()).toBe(month);

    const totals = page.getByTestId('cogs-totals');
    await totals.waitFor();
    const figure = async (k: string) => plain(await totals.locator(`[data-figure="${k}"]`).innerText());
    const onPage = { actual: await figure('actual'), theoretical: await figure('theoretical'), purchases: await figure('purchases'), closing: await figure('closing') };
    expect(Number(onPage.actual)).toBeGreaterThan(0);
    const netSales = plain(await page.locator('[data-summary="netSales"]').innerText());
    await page.getByText('Cost of goods as % of net sales, by month').waitFor();
    await page.getByText('Actual against theoretical cost, by category').waitFor();
    await expect.poll(() => page.locator('.recharts-surface').count()).toBeGreaterThanOrEqual(3);
    await s.shot(page, 'month-end-bookkeeper');

    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download cost of goods (CSV)' }).click()]);
    expect(download.suggestedFilename()).toBe(`cost-of-goods_${month}_market-street.csv`);
    const file = fs.readFileSync((await download.path()) as string, 'utf8');
    const rows = parse(file, { bom: true, columns: true }) as Record<string, string>[];
    const total = rows.at(-1)!;
    expect(total.category).toBe('All categories');
    expect(total.actual_cost).toBe(onPage.actual);
    expect(total.theoretical_cost).toBe(onPage.theoretical);
    expect(total.purchases_net).toBe(onPage.purchases);
    expect(total.closing_stock).toBe(onPage.closing);
    expect(total.net_sales).toBe(netSales);
    // Every category row of the file adds up to the totals row.
    const sum = rows.slice(0, -1).reduce((a, r) => a + Math.round(Number(r.actual_cost) * 100), 0);
    expect(sum).toBe(Math.round(Number(total.actual_cost) * 100));
  } finally {
    await page.close();
  }
});
