import { afterAll, beforeAll, expect, test } from 'vitest';
import type { Page } from 'playwright-core';
import { formatMoney } from '../../src/lib/format';
import { dec } from '../../src/shared/decimal';
import { serveDemo, type Served, getJson } from './harness';

// Modifiers in a real browser against the seeded demo café: the owner reviews and reprices
// the oat swap, then adds a new add-on with one line per cup size.
// Every figure on screen is checked against the server's own answer for the same modifier.

let s: Served;
beforeAll(async () => {
  s = await serveDemo();
});
afterAll(() => s?.close());

const shot = (page: Page, name: string) => s.shot(page, `modifiers/${name}`);

interface ModifierBody {
  id: string;
  name: string;
  kind: 'add' | 'swap';
  upcharge: string | null;
  sizes: { sizeId: string; name: string; lines: { itemName: string; action: string }[]; costDelta: string | null; suggestedUpcharge: string | null }[];
}

/** The editor's saved figures per size equal the server's, as the user's locale writes them. */
async function expectFigures(page: Page, m: ModifierBody, currency: string, locale: string) {
  for (const size of m.sizes) {
    const box = page.locator(`[data-figures-for="${size.name}"]`);
    await expect.poll(() => box.locator('[data-figure="extra-cost"]').textContent()).toBe(formatMoney(size.costDelta!, currency, { detail: true, locale }));
    expect(await box.locator('[data-figure="suggested"]').textContent()).toBe(formatMoney(size.suggestedUpcharge!, currency, { locale }));
  }
}

test('the owner reviews the oat swap per size, changes its upcharge, and adds a new add-on', async () => {
  const page = await s.newPage();
  let oat: ModifierBody | undefined;
  const name = `Caramel pump ${Date.now().toString(36)}`;
  try {
    await s.signIn(page, 'owner@demo.test');
    const locale = await page.evaluate(() => navigator.language);
    const { currency } = await getJson<{ currency: string }>(page, '/api/pricing-policy');
    const { sizes } = await getJson<{ sizes: { id: string; name: string }[] }>(page, '/api/sizes');
    const { modifiers } = await getJson<{ modifiers: ModifierBody[] }>(page, '/api/modifiers');
    oat = modifiers.find((m) => m.name === 'Oat drink instead of milk');
    expect(oat, 'the demo seed has the oat swap').toBeDefined();
    expect(oat!.kind).toBe('swap');

    // The list, reached from the navigation next to Drinks.
    await page.getByRole('navigation', { name: 'Sections' }).filter({ visible: true }).getByRole('link', { name: 'Modifiers' }).click();
    await page.getByRole('heading', { name: 'Modifiers', level: 1 }).waitFor();
    const oatRow = page.locator(`tr[data-modifier="${oat!.name}"]`);
    await oatRow.waitFor();
    for (const size of oat!.sizes) {
      const cell = oatRow.locator(`td[data-size="${size.name}"]`);
      expect(await cell.locator('[data-figure="extra-cost"]').textContent()).toBe(formatMoney(size.costDelta!, currency, { detail: true, locale }));
      expect(await cell.locator('[data-figure="suggested"]').textContent()).toBe(formatMoney(size.suggestedUpcharge!, currency, { locale }));
    }
    await shot(page, 'list');

    // The editor: per size what the swap takes out and puts in, and the server's figures.
    await oatRow.getByRole('link', { name: oat!.name }).click();
    await page.getByRole('heading', { name: oat!.name, level: 1 }).waitFor();
    const detail = (await getJson<{ modifier: ModifierBody }>(page, `/api/modifiers/${oat!.id}`)).modifier;
    expect(detail.sizes.map((x) => x.name)).toEqual(sizes.map((x) => x.name));
    for (const size of detail.sizes) {
      const col = page.locator(`section[data-size="${size.name}"]`);
      expect(await col.locator('fieldset[data-action="remove"] li').count()).toBe(size.lines.filter((l) => l.action === 'remove').length);
      expect(await col.locator('fieldset[data-action="add"] li').count()).toBe(size.lines.filter((l) => l.action === 'add').length);
      // Oat drink costs more than whole milk in the demo data: the swap costs extra.
      expect(dec(size.costDelta!).gt(0)).toBe(true);
    }
    await expectFigures(page, detail, currency, locale);
    await shot(page, 'oat-swap');

    // A menu upcharge below every suggestion is marked, in words, for each size.
    const low = '0.05';
    expect(detail.sizes.every((x) => dec(x.suggestedUpcharge!).gt(low))).toBe(true);
    await page.getByLabel('Menu upcharge').fill(low);
    await page.getByRole('button', { name: 'Save modifier' }).first().click();
    await page.getByText(`${oat!.name} saved.`).waitFor();
    await expect.poll(async () => (await getJson<{ modifier: ModifierBody }>(page, `/api/modifiers/${oat!.id}`)).modifier.upcharge).toBe(low);
    await expect.poll(() => page.getByText('below suggested').count()).toBe(detail.sizes.length);
    const afterSave = (await getJson<{ modifier: ModifierBody }>(page, `/api/modifiers/${oat!.id}`)).modifier;
    // The lines came back unchanged: same figures per size.
    expect(afterSave.sizes.map((x) => [x.name, x.costDelta, x.suggestedUpcharge])).toEqual(detail.sizes.map((x) => [x.name, x.costDelta, x.suggestedUpcharge]));
    await expectFigures(page, afterSave, currency, locale);
    await shot(page, 'oat-swap-below-suggested');

    // A new add-on: one pump of caramel syrup in each size, two in the largest.
    await page.goto(`${s.url}/modifiers/new`);
    await page.getByRole('heading', { name: 'New modifier', level: 1 }).waitFor();
    await page.getByLabel('Modifier name').fill(name);
    await page.getByLabel('Menu upcharge').fill('0.50');
    const pumps = sizes.map((_, i) => (i === sizes.length - 1 ? '2' : '1'));
    for (const [i, size] of sizes.entries()) {
      const side = page.locator(`section[data-size="${size.name}"] fieldset[data-action="add"]`);
      await side.getByRole('button', { name: 'Add a line' }).click();
      await side.getByLabel('Item, line 1', { exact: true }).fill('Caramel syrup');
      await side.getByLabel('Quantity, line 1', { exact: true }).fill(pumps[i]);
      await expect.poll(() => side.getByLabel('Unit or measure, line 1', { exact: true }).inputValue()).toMatch(/^m:/);
      // The live cost of what it adds, from the preview route.
      await expect.poll(() => side.locator('[data-line-cost]').textContent()).not.toBe('—');
    }
    // With nothing taken out, the extra cost and suggested upcharge are shown as typed.
    const live: Record<string, [string | null, string | null]> = {};
    for (const size of sizes) {
      const box = page.locator(`[data-figures-for="${size.name}"]`);
      await box.locator('[data-figure="extra-cost"]').waitFor();
      live[size.name] = [await box.locator('[data-figure="extra-cost"]').textContent(), await box.locator('[data-figure="suggested"]').textContent()];
    }
    await shot(page, 'new-add-on');
    await page.getByRole('button', { name: 'Save modifier' }).first().click();
    await page.waitForURL((u) => /\/modifiers\/[0-9a-f-]{36}$/.test(u.pathname));
    await page.getByText(`${name} saved.`).waitFor();
    const id = new URL(page.url()).pathname.split('/').pop()!;
    const created = (await getJson<{ modifier: ModifierBody }>(page, `/api/modifiers/${id}`)).modifier;
    expect(created.kind).toBe('add');
    expect(created.upcharge).toBe('0.50');
    expect(created.sizes.map((x) => x.name)).toEqual(sizes.map((x) => x.name));
    for (const size of created.sizes) expect(size.lines.map((l) => [l.itemName, l.action])).toEqual([['Caramel syrup', 'add']]);
    // Two pumps cost twice one pump (costs written to 4 places from the same unrounded figure, so within 0.0001).
    const [one, two] = [dec(created.sizes[0].costDelta!), dec(created.sizes[created.sizes.length - 1].costDelta!)];
    expect(two.minus(one.times(2)).abs().lte('0.0001')).toBe(true);
    await expectFigures(page, created, currency, locale);
    // What the editor showed before saving is what the server works out for the saved modifier.
    for (const size of created.sizes)
      expect(live[size.name]).toEqual([formatMoney(size.costDelta!, currency, { detail: true, locale }), formatMoney(size.suggestedUpcharge!, currency, { locale })]);
    await shot(page, 'new-add-on-saved');

    await page.goto(`${s.url}/modifiers`);
    const row = page.locator(`tr[data-modifier="${name}"]`);
    await row.waitFor();
    expect((await row.locator('td').nth(1).textContent())?.trim()).toBe('Add-on');
    expect((await row.locator('td').nth(2).textContent())?.trim()).toBe(formatMoney('0.50', currency, { locale }));
    for (const size of created.sizes)
      expect(await row.locator(`td[data-size="${size.name}"] [data-figure="extra-cost"]`).textContent()).toBe(formatMoney(size.costDelta!, currency, { detail: true, locale }));
    await shot(page, 'list-with-new');

    // Deleting asks first and says what is lost.
    await row.getByRole('link', { name }).click();
    await page.getByRole('button', { name: 'Delete modifier' }).click();
    const dialog = page.getByRole('dialog', { name: `Delete ${name}?` });
    await dialog.waitFor();
    expect(await dialog.textContent()).toContain(`for ${sizes.map((x) => x.name).join(', ')} and its menu upcharge of ${formatMoney('0.50', currency, { locale })} are deleted`);
    await shot(page, 'delete-confirm');
    await dialog.getByRole('button', { name: 'Delete modifier' }).click();
    await page.waitForURL((u) => u.pathname === '/modifiers');
    await page.getByText(`${name} deleted.`).waitFor();
    expect(await page.evaluate(async (u) => (await fetch(u)).status, `/api/modifiers/${id}`)).toBe(404);
    // The list refetches after the toast: wait for it rather than read it once.
    await expect.poll(() => page.locator(`tr[data-modifier="${name}"]`).count()).toBe(0);
  } finally {
    // Put the demo's oat upcharge back for whoever reads it next.
    if (oat) await s.db('modifiers').where({ id: oat.id }).update({ upcharge: oat.upcharge });
    await page.close();
  }
});
