import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, expect, test } from 'vitest';
import type { Page } from 'playwright-core';
import { ALLERGEN_CAUTION } from '../../src/shared/allergens';
import { SCREENSHOTS, serveDemo, type Served } from './harness';

// The second journey, in a real browser against the seeded demo café: the dairy announces a
// milk price rise; the owner enters it, reviews the impact, takes the suggested prices for the
// sizes that fell below target, applies them, and prints the price list.

let s: Served;
beforeAll(async () => {
  s = await serveDemo();
});
afterAll(() => s?.close());

const shot = (page: Page, name: string) => s.shot(page, `repricing/${name}`);

async function api<T>(page: Page, url: string, body?: unknown): Promise<T> {
  return page.evaluate(
    async ([u, b]) => {
      // A POST carries the session's CSRF token, as the app's own client does.
      const csrf = b === undefined ? '' : (await (await fetch('/api/auth/me')).json()).csrfToken;
      const r = await fetch(u as string, b === undefined ? undefined : { method: 'POST', headers: { 'content-type': 'application/json', 'x-csrf-token': csrf }, body: JSON.stringify(b) });
      if (!r.ok) throw new Error(`${u} answered ${r.status}`);
      return r.json();
    },
    [url, body] as const,
  ) as Promise<T>;
}

interface Row { drinkId: string; drinkName: string; size: string; belowTarget: boolean; suggestedPrice: string; currentPrice: string }

test('the owner reprices after a milk rise and prints the price list', { timeout: 120_000 }, async () => {
  const page = await s.newPage();
  try {
    await s.signIn(page, 'owner@demo.test');
    await page.goto(`${s.url}/repricing`);
    await page.getByRole('heading', { name: 'Repricing' }).waitFor();

    // Whole milk goes from 9.90 to 13.50 a case (a large rise, so some sizes fall below target).
    await page.getByLabel('Ingredient').selectOption({ label: 'Whole milk' });
    await page.getByLabel('New pack price').fill('13.50');
    await page.getByRole('button', { name: 'See the impact' }).click();
    await page.getByRole('heading', { name: /Impact on the menu/ }).waitFor();
    const table = page.getByRole('table', { name: /Drinks and sizes affected/ });
    await table.waitFor();
    await expect.poll(() => table.locator('tbody tr').count()).toBeGreaterThan(3);
    await expect.poll(() => table.locator('tbody tr', { hasText: 'Below target' }).count()).toBeGreaterThan(0);
    await shot(page, 'impact');

    // The same impact from the API, to know which sizes fell below target and their suggested prices.
    const ingredients = await api<{ ingredients: { id: string; name: string }[] }>(page, '/api/ingredients');
    const milk = ingredients.ingredients.find((i) => i.name === 'Whole milk')!;
    const impact = await api<{ rows: Row[] }>(page, '/api/reprice/preview', { changes: [{ ingredientId: milk.id, newPrice: '13.50' }] });
    const below = impact.rows.filter((r) => r.belowTarget);
    expect(below.length).toBeGreaterThan(0);
    // Below target in words (not colour alone) on exactly the rows the API marks.
    expect(await table.locator('tbody tr', { hasText: 'Below target' }).count()).toBe(below.length);

    await page.getByRole('button', { name: /Take suggested prices for the \d+ below target/ }).click();
    const applyButton = page.getByRole('button', { name: new RegExp(`Apply ${below.length} new price`) });
    await applyButton.waitFor();
    await shot(page, 'suggested-taken');
    await applyButton.click();
    const dialog = page.getByRole('dialog');
    await dialog.waitFor();
    await shot(page, 'confirm-apply');
    await dialog.getByRole('button', { name: 'Apply the new prices' }).click();
    await page.getByText(`${below.length} prices applied.`).waitFor();

    // The menu now carries the suggested prices, with a history row each.
    const menu = await api<{ drinks: { id: string; sizes: { name: string; currentPrice: string }[] }[] }>(page, '/api/menu/costing');
    for (const r of below) {
      const size = menu.drinks.find((d) => d.id === r.drinkId)!.sizes.find((x) => x.name === r.size)!;
      expect(size.currentPrice).toBe(r.suggestedPrice);
      const history = await api<{ history: { size: string; oldPrice: string; newPrice: string; changedBy: { name: string } }[] }>(page, `/api/drinks/${r.drinkId}/price-history`);
      expect(history.history.find((h) => h.size === r.size)).toMatchObject({ oldPrice: r.currentPrice, newPrice: r.suggestedPrice });
    }

    // The price history page of the first drink repriced.
    await page.goto(`${s.url}/drinks/${below[0].drinkId}/price-history`);
    await page.getByRole('table', { name: /Price history of/ }).waitFor();
    await shot(page, 'price-history');

    // The price list, printed: no navigation, the new prices, allergen marks and the caution.
    await page.goto(`${s.url}/price-list`);
    await page.getByRole('heading', { name: 'Price list' }).waitFor();
    const row = page.getByRole('row', { name: new RegExp(below[0].drinkName) }).first();
    await row.waitFor();
    await expect.poll(() => row.textContent()).toContain(below[0].suggestedPrice);
    await expect.poll(() => page.getByText(ALLERGEN_CAUTION).count()).toBe(1);
    await page.emulateMedia({ media: 'print' });
    expect(await page.getByRole('navigation', { name: 'Sections' }).filter({ visible: true }).count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Print' }).isVisible()).toBe(false);
    await shot(page, 'price-list-print');
    const pdf = await page.pdf({ format: 'A4', printBackground: false });
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    fs.writeFileSync(path.join(SCREENSHOTS, 'repricing', 'price-list-a4.pdf'), pdf);
    const letter = await page.pdf({ format: 'Letter' });
    expect(letter.subarray(0, 5).toString()).toBe('%PDF-');
    await page.emulateMedia({ media: 'screen' });
  } finally {
    await page.close();
  }
});
