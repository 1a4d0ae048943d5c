import { afterAll, beforeAll, expect, test } from 'vitest';
import type { Page } from 'playwright-core';
import { formatMoney } from '../../src/lib/format';
import { D } from '../../src/shared/decimal';
import { DEMO } from '../../seeds/01_tenancy';
import { MENU_IDS } from '../../seeds/02_menu';
import type { CogsReport } from '../../src/shared/contract/books';
import { serveDemo, type Served, getJson } from './harness';

// The tables' shared behaviour in a real browser against the seeded demo café: sorting by a
// money column in the order of the real values, filtering, and moving with the arrow keys.
// Reads only: nothing here changes the demo data.

let s: Served;
beforeAll(async () => {
  s = await serveDemo();
});
afterAll(() => s?.close());

const shot = (page: Page, name: string) => s.shot(page, `tables/${name}`);

/** What has the focus: its tag, the row it is in (1 = first body row) and the column (0-based). */
async function focused(page: Page) {
  return page.evaluate(() => {
    const el = document.activeElement;
    const cell = el?.closest('td, th') as HTMLTableCellElement | null;
    const row = cell?.parentElement as HTMLTableRowElement | null;
    const body = row?.closest('tbody');
    return {
      tag: el?.tagName.toLowerCase() ?? null,
      label: el?.getAttribute('aria-label') ?? null,
      inBody: Boolean(body),
      row: body && row ? [...body.rows].indexOf(row) + 1 : 0,
      column: cell ? cell.cellIndex : -1,
      text: cell?.innerText.trim() ?? null,
    };
  });
}

test('month end: the cost of goods sorts by actual cost in the order of the real figures, filters to over theoretical, and the arrows move down the column', async () => {
  const page = await s.newPage();
  try {
    await s.signIn(page, 'bookkeeper@demo.test');
    const locale = await page.evaluate(() => navigator.language);
    // The page may ask for more than one report as it learns the site: compare with the last it asked for.
    const asked: string[] = [];
    page.on('request', (r) => {
      if (r.url().includes('/api/reports/cogs?')) asked.push(r.url());
    });
    await page.goto(`${s.url}/month-end`);
    const table = page.getByRole('table', { name: 'Cost of goods by ingredient category' });
    await table.locator('tbody tr').first().waitFor();
    await page.waitForLoadState('networkidle');
    const report = await getJson<CogsReport>(page, asked.at(-1)!);
    expect(report.rows.length).toBeGreaterThan(2);
    const money = (v: string) => formatMoney(v, report.currency, { locale });
    const actualColumn = async () => table.locator('tbody tr td:nth-child(5)').allInnerTexts();

    // Ascending, then descending: the figures as the server sent them, ordered with decimal.js.
    const byActual = [...report.rows].sort((a, b) => new D(a.actual).cmp(new D(b.actual)));
    expect(new D(byActual[0].actual).lt(new D(byActual.at(-1)!.actual))).toBe(true);
    const sortButton = table.getByRole('button', { name: 'Actual cost' });
    await sortButton.click();
    await expect.poll(() => table.getByRole('columnheader', { name: 'Actual cost' }).getAttribute('aria-sort')).toBe('ascending');
    expect(await actualColumn()).toEqual(byActual.map((r) => money(r.actual)));
    await sortButton.click();
    await expect.poll(() => table.getByRole('columnheader', { name: 'Actual cost' }).getAttribute('aria-sort')).toBe('descending');
    const descending = [...byActual].reverse();
    expect(await actualColumn()).toEqual(descending.map((r) => money(r.actual)));
    // The totals row stays last whatever the order.
    expect(await table.locator('tfoot tr').innerText()).toContain('All categories');
    await shot(page, 'cogs-sorted-by-actual');

    // The arrows: from the header button down into the column, then down a row and back up.
    await sortButton.focus();
    await page.keyboard.press('ArrowDown');
    expect(await focused(page)).toMatchObject({ tag: 'td', inBody: true, row: 1, column: 4, text: money(descending[0].actual) });
    await page.keyboard.press('ArrowDown');
    expect(await focused(page)).toMatchObject({ tag: 'td', row: 2, column: 4, text: money(descending[1].actual) });
    await page.keyboard.press('ArrowRight');
    expect(await focused(page)).toMatchObject({ tag: 'td', row: 2, column: 5, text: money(descending[1].theoretical) });
    await page.keyboard.press('ArrowUp');
    expect(await focused(page)).toMatchObject({ row: 1, column: 5 });
    await page.keyboard.press('Home');
    expect(await focused(page)).toMatchObject({ row: 1, column: 0 });
    await page.keyboard.press('Control+End');
    expect(await focused(page)).toMatchObject({ row: descending.length, column: 8 });
    await shot(page, 'cogs-cell-focused');

    // The filter: only the categories over their theoretical cost, still in the chosen order.
    const over = descending.filter((r) => new D(r.variance).gt(0));
    await page.getByLabel('Show categories').selectOption('over');
    await expect.poll(() => table.locator('tbody tr').count()).toBe(over.length);
    expect(await actualColumn()).toEqual(over.map((r) => money(r.actual)));
    await page.getByText(`${over.length} of ${report.rows.length} shown`).waitFor();
    const under = descending.filter((r) => new D(r.variance).lt(0));
    await page.getByLabel('Show categories').selectOption('under');
    await expect.poll(() => table.locator('tbody tr').count()).toBe(under.length);
    if (under.length === 0) await page.getByText('No category is under theoretical cost').waitFor();
    await page.getByLabel('Show categories').selectOption('');
    await expect.poll(() => table.locator('tbody tr').count()).toBe(report.rows.length);
  } finally {
    await page.close();
  }
});

test('preparations: sorted by cost per batch with the uncostable last, then searched', async () => {
  const page = await s.newPage();
  try {
    await s.signIn(page, 'owner@demo.test');
    const locale = await page.evaluate(() => navigator.language);
    const answer = page.waitForResponse((r) => new URL(r.url()).pathname === '/api/preparations' && r.ok());
    await page.goto(`${s.url}/preparations`);
    const { preparations } = (await (await answer).json()) as { preparations: { name: string; batchCost: string | null }[] };
    const { currency } = await getJson<{ currency: string }>(page, '/api/pricing-policy');
    expect(preparations.length).toBeGreaterThanOrEqual(2);
    const table = page.getByRole('table', { name: 'Preparations' });
    await table.locator('tbody tr').first().waitFor();
    const batchColumn = () => table.locator('tbody tr td:nth-child(3)').allInnerTexts();
    const shown = (p: { batchCost: string | null }) => (p.batchCost === null ? 'cannot be costed' : formatMoney(p.batchCost, currency, { detail: true, locale }));
    const costed = preparations.filter((p) => p.batchCost !== null);
    const blanks = preparations.filter((p) => p.batchCost === null);

    await table.getByRole('button', { name: 'Cost per batch' }).click();
    const ascending = [...costed].sort((a, b) => new D(a.batchCost!).cmp(new D(b.batchCost!)));
    await expect.poll(batchColumn).toEqual([...ascending, ...blanks].map(shown));
    await table.getByRole('button', { name: 'Cost per batch' }).click();
    await expect.poll(batchColumn).toEqual([...ascending.reverse(), ...blanks].map(shown));
    await shot(page, 'preparations-by-batch-cost');

    const one = preparations[0].name;
    await page.getByLabel('Search preparations').fill(one.toUpperCase());
    await expect.poll(() => table.locator('tbody tr').allInnerTexts()).toEqual(expect.arrayContaining([expect.stringContaining(one)]));
    const matching = preparations.filter((p) => p.name.toLowerCase().includes(one.toLowerCase()));
    await expect.poll(() => table.locator('tbody tr').count()).toBe(matching.length);
    await page.getByText(`${matching.length} of ${preparations.length} shown`).waitFor();
    await page.getByLabel('Search preparations').fill('no such preparation');
    await page.getByText('No preparation matches').waitFor();
  } finally {
    await page.close();
  }
});

test('ArrowDown leaves a select or a text box for the same column of the next row; typing and Left/Right stay in the text box', async () => {
  const page = await s.newPage();
  try {
    await s.signIn(page, 'owner@demo.test');

    // The team: a role select per person. Down moves to the next person's select, changing no role.
    await page.goto(`${s.url}/team`);
    const team = page.getByRole('table', { name: 'People in the business' });
    await team.locator('tbody tr').nth(1).waitFor();
    const selects = team.locator('tbody select');
    const before = await selects.evaluateAll((els) => els.map((e) => (e as HTMLSelectElement).value));
    await selects.first().focus();
    await page.keyboard.press('ArrowDown');
    expect(await focused(page)).toMatchObject({ tag: 'select', row: 2, column: 2 });
    await page.keyboard.press('ArrowUp');
    expect(await focused(page)).toMatchObject({ tag: 'select', row: 1, column: 2 });
    expect(await selects.evaluateAll((els) => els.map((e) => (e as HTMLSelectElement).value))).toEqual(before);

    // A new order from a supplier's suggested lines (not saved): the packs boxes one under another.
    const site = DEMO.siteIds.market;
    let supplierId: string | null = null;
    for (const id of Object.values(MENU_IDS.suppliers)) {
      const suggested = await getJson<{ lines: unknown[] }>(page, `/api/sites/${site}/suggested-order?supplierId=${id}`).catch(() => ({ lines: [] }));
      if (suggested.lines.length >= 2) {
        supplierId = id;
        break;
      }
    }
    expect(supplierId, 'a demo supplier with two or more packs to reorder').not.toBeNull();
    await page.goto(`${s.url}/orders/new?siteId=${site}&supplierId=${supplierId}&suggested=1`);
    await page.locator('tr[data-line]').nth(1).waitFor();
    const packs = page.locator('tr[data-line] input[aria-label^="Packs of"]');
    const first = packs.first();
    await first.focus();
    await page.keyboard.press('Control+a');
    await page.keyboard.type('12');
    await page.keyboard.press('ArrowLeft');
    await page.keyboard.press('ArrowRight');
    expect(await focused(page)).toMatchObject({ tag: 'input', row: 1, label: await first.getAttribute('aria-label') });
    expect(await first.inputValue()).toBe('12');
    expect(await first.evaluate((el: HTMLInputElement) => el.selectionStart)).toBe(2);
    await page.keyboard.press('ArrowDown');
    const second = await focused(page);
    expect(second).toMatchObject({ tag: 'input', row: 2, label: await packs.nth(1).getAttribute('aria-label') });
    await page.keyboard.type('3');
    expect(await packs.nth(1).inputValue()).toMatch(/3/);
    await shot(page, 'order-editor-arrow-down');
  } finally {
    await page.close();
  }
});
