import { afterAll, beforeAll, expect, test } from 'vitest';
import type { Page } from 'playwright-core';
import { formatMoney } from '../../src/lib/format';
import { serveDemo, type Served, getJson } from './harness';

// The first journey of the costing work, in a real browser against the seeded demo café:
// the owner costs a new drink in three sizes, finds it in menu costing, a barista reads its card.

let s: Served;
beforeAll(async () => {
  s = await serveDemo();
});
afterAll(() => s?.close());

const shot = (page: Page, name: string) => s.shot(page, `costing/${name}`);

interface Costing {
  currency: string;
  sizes: { name: string; cost: string; suggestedPrice: string; atCurrent: { marginPct: string } | null; lines: { cost: string }[] }[];
  allergens: string[];
}

/** Picks an item by typing its name, then sets the quantity (the unit follows the item). */
async function fillLine(page: Page, size: string, n: number, item: string, quantity: string, unit?: string) {
  const col = page.locator(`section[data-size="${size}"]`);
  await col.getByLabel(`Item, line ${n}`, { exact: true }).fill(item);
  await col.getByLabel(`Quantity, line ${n}`, { exact: true }).fill(quantity);
  if (unit) await col.getByLabel(`Unit or measure, line ${n}`, { exact: true }).selectOption({ label: unit });
}

test('the owner costs a new drink in three sizes, finds it in menu costing, and a barista opens its card', async () => {
  const page = await s.newPage();
  const name = `Spiced oat latte ${Date.now().toString(36)}`;
  try {
    await s.signIn(page, 'owner@demo.test');
    const locale = await page.evaluate(() => navigator.language);
    const { sizes } = await getJson<{ sizes: { id: string; name: string }[] }>(page, '/api/sizes');
    expect(sizes.length).toBeGreaterThanOrEqual(3);
    const [small, regular, large] = sizes.map((x) => x.name);

    await page.goto(`${s.url}/drinks`);
    await page.getByRole('heading', { name: 'Drinks', level: 1 }).waitFor();
    await page.locator('table tbody tr').first().waitFor();
    await shot(page, 'drinks');

    await page.getByRole('link', { name: 'Add a drink' }).first().click();
    await page.getByLabel('Drink name').fill(name);
    await page.getByLabel('Category').fill('Espresso');
    // Only three sizes: untick any others the business offers.
    for (const extra of sizes.slice(3)) await page.locator(`section[data-size="${extra.name}"]`).getByLabel('Offered').uncheck();

    // The Small build from existing ingredients and the house syrup (a preparation).
    const smallCol = page.locator(`section[data-size="${small}"]`);
    for (let i = 0; i < 3; i++) await smallCol.getByRole('button', { name: 'Add a line' }).click();
    await fillLine(page, small, 1, 'House espresso beans', '1');
    await fillLine(page, small, 2, 'Oat drink', '180');
    await fillLine(page, small, 3, 'House vanilla syrup', '1');
    await smallCol.getByRole('button', { name: 'Add a line' }).click();
    await fillLine(page, small, 4, '8 oz hot cup', '1');
    await expect.poll(() => smallCol.getByLabel('Unit or measure, line 1', { exact: true }).inputValue()).toMatch(/^m:/);
    await expect.poll(() => smallCol.getByLabel('Unit or measure, line 3', { exact: true }).inputValue()).toMatch(/^m:/);

    // Copy it to the other two sizes, then adjust.
    await smallCol.getByLabel('Copy this build to').selectOption({ label: regular });
    await smallCol.getByRole('button', { name: `Copy the ${small} build` }).click();
    await smallCol.getByLabel('Copy this build to').selectOption({ label: large });
    await smallCol.getByRole('button', { name: `Copy the ${small} build` }).click();
    await fillLine(page, regular, 1, 'House espresso beans', '2');
    await fillLine(page, regular, 2, 'Oat drink', '260');
    await fillLine(page, regular, 4, '12 oz hot cup', '1');
    await fillLine(page, large, 1, 'House espresso beans', '2');
    await fillLine(page, large, 2, 'Oat drink', '340');
    await fillLine(page, large, 3, 'House vanilla syrup', '2');
    await fillLine(page, large, 4, '16 oz hot cup', '1');
    const prices: Record<string, string> = { [small]: '3.30', [regular]: '3.70', [large]: '4.05' };
    for (const [size, price] of Object.entries(prices)) await page.getByLabel(`Menu price, ${size}`).fill(price);

    // Cost and suggested price per size appear as the owner types (the preview route).
    const shown: Record<string, { cost: string; suggested: string; costText: string; suggestedText: string }> = {};
    for (const size of [small, regular, large]) {
      const figures = page.getByTestId(`figures-${size}`);
      await figures.waitFor();
      // Wait until the figures answer the finished build, not one typed a moment before.
      await page.locator(`[data-figures-for="${size}"][data-state="ready"]`).waitFor();
      shown[size] = {
        cost: (await figures.locator('[data-figure="cost"]').getAttribute('data-value'))!,
        suggested: (await figures.locator('[data-figure="suggested"]').getAttribute('data-value'))!,
        costText: (await figures.locator('[data-figure="cost"]').textContent())!,
        suggestedText: (await figures.locator('[data-figure="suggested"]').textContent())!,
      };
    }
    await shot(page, 'drink-editor-new');

    await page.getByRole('button', { name: 'Save drink' }).first().click();
    await page.waitForURL((u) => /\/drinks\/[0-9a-f-]{36}$/.test(u.pathname));
    const drinkId = new URL(page.url()).pathname.split('/').pop()!;
    await page.getByText(`${name} saved.`).waitFor();

    // What the editor showed is what the server costs for the saved drink.
    const saved = await getJson<Costing>(page, `/api/drinks/${drinkId}/costing`);
    expect(saved.sizes.map((x) => x.name)).toEqual([small, regular, large]);
    for (const size of saved.sizes) {
      expect(shown[size.name].cost).toBe(size.cost);
      expect(shown[size.name].suggested).toBe(size.suggestedPrice);
      expect(shown[size.name].costText).toBe(formatMoney(size.cost, saved.currency, { locale }));
      expect(shown[size.name].suggestedText).toBe(formatMoney(size.suggestedPrice, saved.currency, { locale }));
      expect(Number(size.cost)).toBeGreaterThan(0);
    }
    // Bigger cups cost more: more coffee, more oat drink, a bigger cup.
    expect(Number(saved.sizes[0].cost)).toBeLessThan(Number(saved.sizes[1].cost));
    expect(Number(saved.sizes[1].cost)).toBeLessThan(Number(saved.sizes[2].cost));
    // Oat drink carries cereals containing gluten in the demo data; the syrup adds none.
    expect(saved.allergens).toContain('cereals-containing-gluten');
    // After saving, the reloaded editor shows the same figures.
    const reloaded = page.getByTestId(`figures-${regular}`).locator('[data-figure="cost"]');
    await expect.poll(() => reloaded.getAttribute('data-value')).toBe(saved.sizes[1].cost);
    await shot(page, 'drink-editor-saved');

    // Menu costing lists it, every size, with the same figures.
    await page.goto(`${s.url}/menu-costing`);
    await page.getByLabel('Search drinks').fill(name);
    for (const size of saved.sizes) {
      const row = page.locator(`tr[data-row="${name} · ${size.name}"]`);
      await row.waitFor();
      expect((await row.locator('[data-col="cost"]').textContent())?.trim()).toBe(formatMoney(size.cost, saved.currency, { locale }));
      expect((await row.locator('[data-col="suggested"]').textContent())?.trim()).toBe(formatMoney(size.suggestedPrice, saved.currency, { locale }));
      expect((await row.locator('[data-col="margin"]').textContent())?.trim()).toBe(`${size.atCurrent!.marginPct} %`);
    }
    await shot(page, 'menu-costing-filtered');
    await page.getByLabel('Search drinks').fill('');
    await page.locator('figure svg').first().waitFor();
    await shot(page, 'menu-costing');
    // The demo menu has drinks below target: each says so in words, not only colour.
    await page.getByLabel('Only below target').check();
    await expect.poll(() => page.locator('tbody tr').count()).toBeGreaterThan(0);
    expect(await page.locator('tbody tr').filter({ hasText: 'below target' }).count()).toBe(await page.locator('tbody tr').count());

    // A barista finds the card on Home and opens it: the build in large type, allergens, no costs.
    await s.signIn(page, 'barista@demo.test');
    await page.setViewportSize({ width: 390, height: 844 });
    await page.getByRole('link', { name: new RegExp(name) }).waitFor();
    await shot(page, 'barista-home-phone');
    await page.getByRole('link', { name: new RegExp(name) }).click();
    await page.getByRole('heading', { name, level: 1 }).waitFor();
    const card = await getJson<{ card: { sizes: { name: string; lines: { itemName: string; quantity: string; unitLabel: string }[] }[] } }>(page, `/api/drinks/${drinkId}/card`);
    expect(card.card.sizes.map((x) => x.name)).toEqual([small, regular, large]);
    const article = page.locator('article.recipe-card');
    await expect.poll(() => article.getByText('House vanilla syrup').count()).toBe(3);
    await expect.poll(() => article.getByText('Cereals containing gluten').count()).toBeGreaterThan(0);
    expect(await article.getByText(/derived only from what was entered/).count()).toBe(1);
    const text = (await article.textContent()) ?? '';
    expect(text).not.toMatch(/£|cost|margin/i);
    const width = await page.evaluate(() => document.documentElement.scrollWidth);
    expect(width).toBeLessThanOrEqual(390);
    await shot(page, 'card-phone');
    await page.emulateMedia({ media: 'print' });
    await page.setViewportSize({ width: 794, height: 1123 });
    await shot(page, 'card-print');
    await page.emulateMedia({ media: 'screen' });
    // The barista's navigation offers the cards, not the costs.
    const status = await page.evaluate(async () => (await fetch('/api/menu/costing')).status);
    expect(status).toBe(403);
  } finally {
    await page.close();
  }
}, 180_000);

test('the owner reads ingredients, a preparation and the pricing settings; figures match the API', async () => {
  const page = await s.newPage();
  try {
    await s.signIn(page, 'owner@demo.test');
    const locale = await page.evaluate(() => navigator.language);
    const { currency } = await getJson<{ currency: string }>(page, '/api/pricing-policy');

    // Ingredients: the table's cost per base unit is the server's, to 4 decimals.
    const { ingredients } = await getJson<{ ingredients: { id: string; name: string; unitCost: string | null; category: string }[] }>(page, '/api/ingredients');
    await page.goto(`${s.url}/ingredients`);
    await page.locator('tbody tr').first().waitFor();
    await shot(page, 'ingredients');
    const milk = ingredients.find((i) => i.name === 'Whole milk')!;
    const milkRow = page.locator(`tr[data-row="Whole milk"]`);
    expect(await milkRow.locator('[data-col="unit-cost"]').textContent()).toContain(formatMoney(milk.unitCost!, currency, { detail: true, locale }));
    await page.getByLabel('Category').selectOption('packaging');
    await expect.poll(() => page.locator('tbody tr').count()).toBe(ingredients.filter((i) => i.category === 'packaging').length);
    await page.getByLabel('Search ingredients').fill('no such thing');
    await page.getByText('No ingredient matches').waitFor();

    // One ingredient's page: its packs, measures and allergens with the caution.
    await page.goto(`${s.url}/ingredients/${milk.id}`);
    await page.getByRole('heading', { name: 'Whole milk', level: 1 }).waitFor();
    expect(await page.getByLabel('Milk', { exact: true }).isChecked()).toBe(true);
    await page.getByText(/derived only from what was entered/).first().waitFor();
    await shot(page, 'ingredient');

    // A new ingredient refused inline, with the shared schema's words.
    await page.goto(`${s.url}/ingredients/new`);
    await page.getByRole('button', { name: 'Add a pack' }).click();
    await page.getByLabel('Price before tax').fill('abc');
    await page.getByRole('button', { name: 'Save ingredient' }).last().click();
    await page.getByText('Name the ingredient.').waitFor();
    await page.getByText(/Enter a plain decimal number/).first().waitFor();
    await shot(page, 'ingredient-new-errors');

    // A preparation: the live batch cost equals the saved one.
    const { preparations } = await getJson<{ preparations: { id: string; name: string; batchCost: string; unitCost: string }[] }>(page, '/api/preparations');
    await page.goto(`${s.url}/preparations`);
    await page.locator('tbody tr').first().waitFor();
    await shot(page, 'preparations');
    const chai = preparations.find((p) => p.name === 'Chai concentrate')!;
    await page.goto(`${s.url}/preparations/${chai.id}`);
    const batch = page.locator('[data-figure="batch"]');
    await batch.waitFor();
    expect(await batch.textContent()).toBe(formatMoney(chai.batchCost, currency, { detail: true, locale }));
    expect(await page.locator('[data-figure="unit"]').textContent()).toBe(formatMoney(chai.unitCost, currency, { detail: true, locale }));
    await shot(page, 'preparation');

    // Cup sizes and the pricing policy, with the tax caution.
    await page.goto(`${s.url}/pricing`);
    await page.getByText(/Confirm your rates and treatment with your tax authority or an accountant/).waitFor();
    await page.getByRole('table', { name: 'Cup sizes' }).waitFor();
    await shot(page, 'pricing');

    // Phone width: the menu costing table scrolls inside its own box.
    await page.setViewportSize({ width: 390, height: 844 });
    await page.goto(`${s.url}/menu-costing`);
    await page.locator('tbody tr').first().waitFor();
    await shot(page, 'menu-costing-phone');
  } finally {
    await page.close();
  }
}, 120_000);
