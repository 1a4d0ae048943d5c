import path from 'node:path';
import { afterAll, beforeAll, expect, test } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO } from '../../seeds/01_tenancy';
import { getJson as api, SCREENSHOTS, serveDemo, type Served } from './harness';

// The owner names a new storage area at Market Street, moves it up the counting order,
// renames it, puts one pack in it from the stock table, and a new count sheet lists that pack
// under it, in that order; then deletes it (the pack stays stocked, in no area). What this
// journey changes is put back at the end, so the other journeys see the seed's areas.

let s: Served;
beforeAll(async () => {
  s = await serveDemo();
});
afterAll(() => s?.close());

const site = DEMO.siteIds.market;
const shot = (page: Page, name: string) => s.shot(page, `storage-areas/${name}`);

interface Area { id: string; name: string; position: number; packCount: number }
interface Item { packId: string; description: string; storageArea: { id: string; name: string } | null }
const areaNames = async (page: Page) => (await api<{ areas: Area[] }>(page, `/api/sites/${site}/storage-areas`)).areas.map((a) => a.name);

test('the owner adds a storage area, orders and renames it, puts a pack there, and the count sheet lists it there', async () => {
  const page = await s.newPage();
  let countId: string | null = null;
  let moved: Item | null = null;
  try {
    await s.signIn(page, 'owner@demo.test');
    await page.getByLabel('Site', { exact: true }).selectOption({ label: 'Market Street' });
    await page.goto(`${s.url}/stock`);
    await page.getByRole('heading', { name: 'Stock and ordering at Market Street', level: 1 }).waitFor();
    const section = page.getByRole('region', { name: 'Storage areas' });
    const list = section.getByRole('list', { name: 'Storage areas, in counting order' });
    await list.getByRole('listitem').nth(2).waitFor();
    // The seed's three areas, in its order.
    expect(await areaNames(page)).toEqual(['Fridge', 'Bar', 'Dry store']);

    // A name the site already has, in another case, is refused beside the field.
    await section.getByLabel('New storage area').fill('fridge');
    await section.getByRole('button', { name: 'Add area' }).click();
    await section.getByText('This site already has a storage area with that name.').waitFor();
    await section.screenshot({ path: path.join(SCREENSHOTS, 'storage-areas/duplicate-name.png') });

    await section.getByLabel('New storage area').fill('Back shelf');
    await section.getByRole('button', { name: 'Add area' }).click();
    await list.getByText('Back shelf').waitFor();
    await expect.poll(() => section.getByLabel('New storage area').inputValue()).toBe('');
    expect(await areaNames(page)).toEqual(['Fridge', 'Bar', 'Dry store', 'Back shelf']);

    // Up one place, then renamed inline (Enter saves).
    await section.getByRole('button', { name: 'Move Back shelf up' }).click();
    await expect.poll(() => areaNames(page)).toEqual(['Fridge', 'Bar', 'Back shelf', 'Dry store']);
    await expect.poll(() => list.getByRole('listitem').nth(2).innerText()).toContain('Back shelf');
    await section.getByRole('button', { name: 'Rename Back shelf' }).click();
    await section.getByLabel('New name for Back shelf').fill('Top shelf');
    await section.screenshot({ path: path.join(SCREENSHOTS, 'storage-areas/rename.png') });
    await section.getByLabel('New name for Back shelf').press('Enter');
    await list.getByText('Top shelf').waitFor();
    // Focus returns to the area's Rename button, not to the top of the page.
    await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute('aria-label'))).toBe('Rename Top shelf');
    expect(await areaNames(page)).toEqual(['Fridge', 'Bar', 'Top shelf', 'Dry store']);

    // One pack from the bar onto the new shelf, from the stock table's Area column.
    const before = await api<{ items: Item[] }>(page, `/api/sites/${site}/stock`);
    moved = before.items.find((i) => i.storageArea?.name === 'Bar') as Item;
    expect(moved).toBeDefined();
    await page.getByLabel(`Storage area, ${moved.description}`).selectOption({ label: 'Top shelf' });
    await expect.poll(async () => (await api<{ items: Item[] }>(page, `/api/sites/${site}/stock`)).items.find((i) => i.packId === moved!.packId)?.storageArea?.name).toBe('Top shelf');
    await list.getByRole('listitem').filter({ hasText: 'Top shelf' }).getByText('1 pack').waitFor();
    await shot(page, 'stock-page');
    await section.screenshot({ path: path.join(SCREENSHOTS, 'storage-areas/areas-section.png') });
    await page.getByRole('table', { name: 'Stock at this site, in packs' }).screenshot({ path: path.join(SCREENSHOTS, 'storage-areas/stock-table.png') });
    await page.setViewportSize({ width: 390, height: 844 });
    await section.screenshot({ path: path.join(SCREENSHOTS, 'storage-areas/areas-section-phone.png') });
    expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(0);
    await page.setViewportSize({ width: 1280, height: 860 });

    await page.goto(`${s.url}/stock-counts`);
    await page.getByRole('button', { name: 'Start count' }).click();
    await page.waitForURL(/\/stock-counts\/[0-9a-f-]{36}$/);
    countId = page.url().split('/').at(-1) as string;
    const shelf = page.locator('section', { has: page.getByRole('heading', { name: 'Top shelf', level: 2, exact: true }) });
    await shelf.waitFor();
    const ingredient = moved.description.split(':')[0];
    await shelf.getByRole('heading', { name: ingredient, exact: true }).waitFor();
    expect(await shelf.locator('li[data-pack]').count()).toBe(1);
    // The sheet walks the areas in the owner's order, the new one between the bar and the dry store.
    const nav = page.getByRole('navigation', { name: 'Storage areas' });
    const walked = (await nav.getByRole('link').allInnerTexts()).map((t) => t.replace(/\s*\(\d+\)$/, ''));
    expect(walked.filter((n) => n !== 'Not in an area')).toEqual(['Fridge', 'Bar', 'Top shelf', 'Dry store']);
    await page.setViewportSize({ width: 390, height: 844 });
    await shelf.scrollIntoViewIfNeeded();
    await page.screenshot({ path: path.join(SCREENSHOTS, 'storage-areas/count-sheet-phone.png') });
    await page.setViewportSize({ width: 1280, height: 860 });

    // Deleting the area asks first and says the pack becomes unassigned.
    await page.goto(`${s.url}/stock`);
    await section.getByRole('button', { name: 'Delete Top shelf' }).click();
    const dialog = page.getByRole('dialog', { name: 'Delete Top shelf?' });
    await dialog.getByText(/The 1 pack kept there stays in stock but becomes unassigned/).waitFor();
    await page.screenshot({ path: path.join(SCREENSHOTS, 'storage-areas/delete-dialog.png') });
    await dialog.getByRole('button', { name: 'Delete area' }).click();
    await dialog.waitFor({ state: 'hidden' });
    await expect.poll(() => areaNames(page)).toEqual(['Fridge', 'Bar', 'Dry store']);
    expect((await api<{ items: Item[] }>(page, `/api/sites/${site}/stock`)).items.find((i) => i.packId === moved!.packId)?.storageArea).toBeNull();
    await expect.poll(() => page.getByLabel(`Storage area, ${moved!.description}`).inputValue()).toBe('');

    // Back to the bar, as the seed had it.
    await page.getByLabel(`Storage area, ${moved.description}`).selectOption({ label: 'Bar' });
    await expect.poll(async () => (await api<{ items: Item[] }>(page, `/api/sites/${site}/stock`)).items.find((i) => i.packId === moved!.packId)?.storageArea?.name).toBe('Bar');
  } finally {
    // The open count this journey started goes, whatever happened.
    if (countId) await s.db('stock_counts').where({ id: countId }).delete();
    await page.close();
  }
});
