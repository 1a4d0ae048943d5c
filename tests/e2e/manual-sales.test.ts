import path from 'node:path';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { formatDate } from '../../src/lib/format';
import { addMonths } from '../../src/shared/books';
import { DEMO } from '../../seeds/01_tenancy';
import { getJson, SCREENSHOTS, serveDemo, type Served } from './harness';

// The manager types in a day's sales by hand at Canal Yard, comes back to the page later, and
// the form holds what was saved, says that saving replaces it, and replaces it; a day of the
// closed month is shown but cannot be saved. The day is in last month (open in the seed), so
// today's sales and stock, which other journeys read, are not touched; its lines go at the end.

let s: Served;
const businessId = DEMO.businessId;
const siteId = DEMO.siteIds.canal;
beforeAll(async () => {
  s = await serveDemo();
});
afterAll(() => s?.close());

/** This machine's calendar month (the browser runs on it too), as the pages see it. */
function localMonth(): string {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}`;
}

interface Day { closed: boolean; lines: { drinkSizeId: string; label: string; quantity: string; netSales: string }[]; importedLines: number }

test('the manual day loads what was saved for it, says saving replaces it, replaces it, and a closed month cannot be saved', { timeout: 120_000 }, async () => {
  const page = await s.newPage();
  const day = `${addMonths(localMonth(), -1)}-02`;
  const closedDay = `${addMonths(localMonth(), -3)}-02`;
  try {
    await s.signIn(page, 'manager@demo.test');
    await page.evaluate(([b, id]) => localStorage.setItem(`tamp-tally.site.${b}`, id), [businessId, siteId]);
    const locale = await page.evaluate(() => navigator.language);
    const shown = formatDate(day, { locale });
    const form = page.getByRole('form', { name: "Enter a day's sales by hand" });
    const row = (n: number) => form.getByRole('listitem').nth(n);
    const open = async (d: string) => {
      await page.goto(`${s.url}/till-sales`);
      await page.getByRole('heading', { name: 'Till sales', level: 1 }).waitFor();
      await page.getByLabel('Day', { exact: true }).fill(d);
    };

    await open(day);
    const status = form.getByTestId('manual-day-status');
    await status.getByText(`Nothing typed in for ${shown} yet.`).waitFor();
    // The seed's till file for that day stays, and the form says so.
    const before = await getJson<Day>(page, `/api/sales/days/${day}?siteId=${siteId}`);
    expect(before.lines).toEqual([]);
    expect(before.importedLines).toBeGreaterThan(0);
    await status.getByText(`The ${before.importedLines} lines from till files for that day stay as they are.`).waitFor();
    expect(await form.getByTestId('manual-day-replaces').count()).toBe(0);

    await row(0).getByLabel('Drink 1', { exact: true }).selectOption({ label: 'Flat white (Regular)' });
    await row(0).getByLabel('Cups sold').fill('14');
    await row(0).getByLabel('Net sales').fill('40.25');
    await form.getByRole('button', { name: 'Add a drink' }).click();
    await row(1).getByLabel('Drink 2', { exact: true }).selectOption({ label: 'Breakfast tea (Small)' });
    await row(1).getByLabel('Cups sold').fill('6');
    await row(1).getByLabel('Net sales').fill('11.50');
    await form.getByRole('button', { name: 'Save the day' }).click();
    await form.getByText(`Saved 2 lines for ${shown}.`).waitFor();
    const first = await getJson<Day>(page, `/api/sales/days/${day}?siteId=${siteId}`);
    expect(first.lines.map((l) => [l.label, l.quantity, l.netSales])).toEqual([['Flat white (Regular)', '14', '40.25'], ['Breakfast tea (Small)', '6', '11.50']]);

    // Later, after a reload: the day's saved lines are in the form, and it says saving replaces them.
    await page.reload();
    await open(day);
    await status.getByText(`2 lines typed in for ${shown}, shown below.`).waitFor();
    await form.getByTestId('manual-day-replaces').getByText(`This replaces the 2 lines saved for ${shown}`).waitFor();
    expect(await form.getByRole('listitem').count()).toBe(2);
    // The form takes the loaded lines once they have arrived (a render after the status line).
    await expect.poll(() => row(0).getByLabel('Drink 1', { exact: true }).inputValue()).toBe(first.lines[0].drinkSizeId);
    expect(await row(0).getByLabel('Cups sold').inputValue()).toBe('14');
    expect(await row(0).getByLabel('Net sales').inputValue()).toBe('40.25');
    expect(await row(1).getByLabel('Drink 2', { exact: true }).inputValue()).toBe(first.lines[1].drinkSizeId);
    expect(await row(1).getByLabel('Cups sold').inputValue()).toBe('6');
    expect(await row(1).getByLabel('Net sales').inputValue()).toBe('11.50');
    await s.shot(page, 'manual-sales/loaded');
    await form.screenshot({ path: path.join(SCREENSHOTS, 'manual-sales/loaded-form.png') });
    await page.setViewportSize({ width: 390, height: 844 });
    await form.screenshot({ path: path.join(SCREENSHOTS, 'manual-sales/loaded-form-phone.png') });
    expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(0);
    await page.setViewportSize({ width: 1280, height: 860 });

    // One line corrected, the other taken out: the save replaces both with the one.
    await row(0).getByLabel('Cups sold').fill('15');
    await row(0).getByLabel('Net sales').fill('43.10');
    await form.getByRole('button', { name: 'Remove drink 2' }).click();
    await form.getByRole('button', { name: 'Replace the 2 lines' }).click();
    await form.getByText(`Saved 1 line for ${shown}, in place of the 2 lines saved before.`).waitFor();
    const second = await getJson<Day>(page, `/api/sales/days/${day}?siteId=${siteId}`);
    expect(second.lines.map((l) => [l.label, l.quantity, l.netSales])).toEqual([['Flat white (Regular)', '15', '43.10']]);
    expect(second.importedLines).toBe(before.importedLines);
    await form.getByTestId('manual-day-replaces').getByText(`This replaces the 1 line saved for ${shown}`).waitFor();

    await page.reload();
    await open(day);
    await status.getByText(`1 line typed in for ${shown}, shown below.`).waitFor();
    await expect.poll(() => row(0).getByLabel('Cups sold').inputValue()).toBe('15');

    // A day of the closed month: shown, not savable.
    await open(closedDay);
    await form.getByText(/is closed, so the sales of .* cannot change/).waitFor();
    expect(await form.getByRole('listitem').count()).toBe(0);
    expect(await form.getByRole('button', { name: /Save the day|Replace the/ }).count()).toBe(0);
    await form.screenshot({ path: path.join(SCREENSHOTS, 'manual-sales/closed-month.png') });
  } finally {
    await s.db('sales_lines').where({ site_id: siteId, sold_on: day }).whereNull('import_id').delete();
    await page.close();
  }
});
