import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { Page } from 'playwright-core';
import type { AxeResults, Result } from 'axe-core';
import { getJson, SCREENSHOTS, serveDemo, type Served } from './harness';

// An automated check of the main pages of each role against WCAG 2.2 level A and AA
// (the rules axe-core tags for them), on the demo data. It reads only: the one open count
// sheet it needs is made here and deleted afterwards.

const AXE_SOURCE = fs.readFileSync(path.resolve('node_modules/axe-core/axe.min.js'), 'utf8');
const WCAG_AA = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];
const PHONE = { width: 390, height: 844 };
const DESK = { width: 1280, height: 860 };

let s: Served;
let page: Page;
beforeAll(async () => {
  s = await serveDemo();
  page = await s.newPage();
});
afterAll(async () => {
  await page?.close();
  await s?.close();
});

/** The page has its title and nothing left loading: no skeleton, no request in flight. */
async function settled(p: Page) {
  await p.waitForLoadState('networkidle');
  await p.getByRole('heading', { level: 1 }).first().waitFor();
  await p.waitForFunction(() => !document.querySelector('.animate-pulse, [aria-busy="true"]'));
}

/** One line per violation: rule, impact, what it asks and where (the first few nodes). */
function describeViolations(violations: Result[]): string {
  return violations
    .map((v) => {
      const targets = v.nodes.slice(0, 4).map((n) => `    ${n.target.join(' ')}${n.failureSummary ? ` — ${n.failureSummary.split('\n').slice(1).join(' ').trim()}` : ''}`);
      const more = v.nodes.length > 4 ? [`    … and ${v.nodes.length - 4} more`] : [];
      return [`${v.id} (${v.impact ?? 'n/a'}): ${v.help} [${v.nodes.length} node(s)]`, ...targets, ...more].join('\n');
    })
    .join('\n');
}

/** Runs axe over the whole document and fails on any violation; a screenshot of what was checked goes beside the others. */
async function checkPage(p: Page, name: string, { fullPage = true } = {}) {
  // The app's Content Security Policy refuses inline scripts (addScriptTag); the DevTools
  // protocol's own evaluation is outside it, so axe goes in that way.
  if (!(await p.evaluate(() => 'axe' in window))) await p.evaluate(AXE_SOURCE);
  const results = (await p.evaluate(
    (tags) => {
      const axe = (window as unknown as { axe: { run: (c: unknown, o: unknown) => Promise<unknown> } }).axe;
      return axe.run(document, { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] });
    },
    WCAG_AA,
  )) as AxeResults;
  await p.screenshot({ path: path.join(SCREENSHOTS, `a11y-${name.replace(/[^a-z0-9]+/gi, '-').toLowerCase()}.png`), fullPage });
  const report = describeViolations(results.violations);
  if (report) console.log(`\n[axe] ${name} (${p.url()}):\n${report}`);
  expect(report, `axe found violations on ${name}`).toBe('');
}

async function visit(p: Page, url: string) {
  await p.goto(`${s.url}${url}`);
  await settled(p);
}

interface Ids {
  drink: string;
  ingredient: string;
  order: string;
  finishedCount: string;
  card: string;
  preparation: string;
  modifier: string;
  supplier: string;
  draftOrder: string;
}
// Read once, by whichever role's pages run first.
let ids: Ids;
let idsRead = false;
async function readIds(p: Page) {
  if (!idsRead) ids = await loadIds(p);
  idsRead = true;
}

/** The demo rows the pages below open, read through the signed-in page's session (any role that reads costs and orders). */
async function loadIds(p: Page): Promise<Ids> {
  const drinks = await getJson<{ drinks: { id: string }[] }>(p, '/api/drinks');
  const ingredients = await getJson<{ ingredients: { id: string; name: string }[] }>(p, '/api/ingredients');
  const orders = await getJson<{ orders: { id: string; status: string }[] }>(p, '/api/purchase-orders');
  const counts = await getJson<{ counts: { id: string; status: string }[] }>(p, '/api/stock-counts');
  const cards = await getJson<{ cards: { id: string }[] }>(p, '/api/cards');
  const preparations = await getJson<{ preparations: { id: string }[] }>(p, '/api/preparations');
  const modifiers = await getJson<{ modifiers: { id: string }[] }>(p, '/api/modifiers');
  const suppliers = await getJson<{ suppliers: { id: string }[] }>(p, '/api/suppliers');
  return {
    drink: drinks.drinks[0].id,
    ingredient: (ingredients.ingredients.find((i) => i.name === 'Whole milk') ?? ingredients.ingredients[0]).id,
    // A placed order shows its timeline and the most actions.
    order: (orders.orders.find((o) => o.status === 'placed') ?? orders.orders[0]).id,
    finishedCount: counts.counts.find((c) => c.status === 'finished')!.id,
    card: cards.cards[0].id,
    preparation: preparations.preparations[0].id,
    modifier: modifiers.modifiers[0].id,
    supplier: suppliers.suppliers[0].id,
    draftOrder: orders.orders.find((o) => o.status === 'draft')!.id,
  };
}

/** The main pages of the owner's sections, in menu order. */
const mainPages: [string, () => string][] = [
  ['home', () => '/'],
  ['drinks list', () => '/drinks'],
  ['drink editor', () => `/drinks/${ids.drink}`],
  ['ingredients', () => '/ingredients'],
  ['an ingredient', () => `/ingredients/${ids.ingredient}`],
  ['preparations', () => '/preparations'],
  ['menu costing', () => '/menu-costing'],
  ['sizes and pricing', () => '/pricing'],
  ['modifiers', () => '/modifiers'],
  ['repricing', () => '/repricing'],
  ['price list', () => '/price-list'],
  ['stock', () => '/stock'],
  ['purchase orders', () => '/orders'],
  ['an order', () => `/orders/${ids.order}`],
  ['suppliers', () => '/suppliers'],
  ['stock counts', () => '/stock-counts'],
  ['a finished count sheet', () => `/stock-counts/${ids.finishedCount}`],
  ['waste', () => '/waste'],
  ['till sales', () => '/till-sales'],
  ['month end', () => '/month-end'],
  ['settings', () => '/settings'],
  ['team', () => '/team'],
];
const otherPages: [string, () => string][] = [
  // Beyond the main pages: the other editors and lists a day's work opens (visited, never saved).
  ['a new drink', () => '/drinks/new'],
  ['a preparation', () => `/preparations/${ids.preparation}`],
  ['a modifier', () => `/modifiers/${ids.modifier}`],
  ['a supplier', () => `/suppliers/${ids.supplier}`],
  ['recipe cards', () => '/cards'],
  ['price history of a drink', () => `/drinks/${ids.drink}/price-history`],
  ['a draft order, editing', () => `/orders/${ids.draftOrder}/edit`],
  ['receiving a placed order', () => `/orders/${ids.order}/receive`],
  // What goes wrong: a drink that is not there, a page that is not there.
  ['a drink that does not exist', () => '/drinks/00000000-0000-4000-8000-000000000000'],
  ['a page that does not exist', () => '/no-such-page'],
];
const OWNER_ONLY = new Set(['settings', 'team']);
const mainPagesNamed = (names: string[]) => mainPages.filter(([name]) => names.includes(name));

test('sign-in page', async () => {
  await s.browser.clearCookies();
  await page.setViewportSize(DESK);
  await visit(page, '/sign-in');
  await checkPage(page, 'sign-in');
  // Sent empty: the inline messages and the fields marked invalid.
  await page.getByRole('button', { name: /sign in/i }).click();
  await page.locator('[aria-invalid="true"]').first().waitFor();
  await checkPage(page, 'sign-in, sent empty');
});

describe('owner', () => {
  beforeAll(async () => {
    await page.setViewportSize(DESK);
    await s.signIn(page, 'owner@demo.test');
    await readIds(page);
  });

  const pages = [...mainPages, ...otherPages];
  test.each(pages)('%s', async (name, url) => {
    await visit(page, url());
    await checkPage(page, `owner: ${name}`);
  });

  test("repricing, a price rise's impact (a preview saves nothing)", async () => {
    await visit(page, '/repricing');
    await page.getByLabel('Ingredient').selectOption({ label: 'Whole milk' });
    await page.getByLabel('New pack price').fill('13.50');
    await page.getByRole('button', { name: 'See the impact' }).click();
    await page.getByRole('table', { name: /Drinks and sizes affected/ }).waitFor();
    await settled(page);
    await checkPage(page, 'owner: repricing impact');
  });

  test('a search that matches nothing', async () => {
    await visit(page, '/preparations');
    await page.getByLabel('Search preparations').fill('nothing is called this');
    await expect.poll(() => page.locator('tbody tr').count()).toBeLessThanOrEqual(1);
    await checkPage(page, 'owner: preparations, nothing found');
  });

  test('the user menu, open', async () => {
    await visit(page, '/');
    await page.locator('header[data-app-bar] button[aria-expanded]').filter({ visible: true }).last().click();
    await page.getByRole('button', { name: /sign out/i }).waitFor();
    await checkPage(page, 'owner: user menu');
  });

  test('the close-month confirmation', async () => {
    await visit(page, '/month-end');
    await page.getByRole('button', { name: /^Close / }).click();
    const dialog = page.getByRole('dialog');
    await dialog.waitFor();
    await checkPage(page, 'owner: close-month dialog', { fullPage: false });
    // Nothing is closed: the dialog goes with Cancel.
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await dialog.waitFor({ state: 'hidden' });
  });
});

describe('manager', () => {
  beforeAll(async () => {
    await page.setViewportSize(DESK);
    await s.signIn(page, 'manager@demo.test');
    await readIds(page);
  });
  // A manager keeps the menu, the stock and the orders; Team and Settings are the owner's.
  const pages = mainPages.filter(([name]) => !OWNER_ONLY.has(name));
  test.each(pages)('%s', async (name, url) => {
    await visit(page, url());
    await checkPage(page, `manager: ${name}`);
  });
});

describe('owner on a phone', () => {
  beforeAll(async () => {
    await page.setViewportSize(PHONE);
    await s.signIn(page, 'owner@demo.test');
    await readIds(page);
  });
  afterAll(async () => {
    await page.setViewportSize(DESK);
  });
  const pages = mainPagesNamed(['home', 'drinks list', 'drink editor', 'ingredients', 'menu costing', 'stock', 'purchase orders', 'month end']);
  test.each(pages)('%s', async (name, url) => {
    await visit(page, url());
    await checkPage(page, `owner on a phone: ${name}`, { fullPage: false });
    // Reflow (WCAG 1.4.10), which axe cannot see: the page itself never scrolls sideways;
    // wide tables and the cup-size columns scroll inside their own box.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
  });
});

describe('barista on a phone', () => {
  let openCount = '';
  beforeAll(async () => {
    await page.setViewportSize(PHONE);
    await s.signIn(page, 'barista@demo.test');
    // An open count long before the demo's books, so the sheet shows its inputs; deleted after.
    const site = await s.db('sites as st').join('businesses as b', 'b.id', 'st.business_id').where({ 'b.name': 'Lantern Row Coffee', 'st.name': 'Canal Yard' }).first('st.id', 'st.business_id');
    const barista = await s.db('users').where({ email: 'barista@demo.test' }).first('id');
    const [row] = await s.db('stock_counts').insert({ business_id: site.business_id, site_id: site.id, count_date: '2001-03-31', started_by: barista.id }).returning('id');
    openCount = row.id;
  });
  afterAll(async () => {
    if (openCount) await s.db('stock_counts').where({ id: openCount }).delete();
    await page.setViewportSize(DESK);
  });

  const pages: [string, () => string][] = [
    ['home', () => '/'],
    ['a recipe card', () => `/cards/${ids.card}`],
    ['waste', () => '/waste'],
    ['an open count sheet', () => `/stock-counts/${openCount}`],
    ['stock counts', () => '/stock-counts'],
    ['recipe cards', () => '/cards'],
    ['price list', () => '/price-list'],
  ];
  test.each(pages)('%s', async (name, url) => {
    await visit(page, url());
    // Phone pages are long: the shot is what the first screen shows.
    await checkPage(page, `barista: ${name}`, { fullPage: false });
  });

  test('the phone menu, open', async () => {
    await visit(page, '/');
    await page.getByRole('button', { name: 'Menu' }).click();
    await page.getByRole('navigation', { name: 'Sections' }).filter({ visible: true }).waitFor();
    await checkPage(page, 'barista: phone menu', { fullPage: false });
  });
});

describe('bookkeeper', () => {
  beforeAll(async () => {
    await page.setViewportSize(DESK);
    await s.signIn(page, 'bookkeeper@demo.test');
  });
  test.each([
    ['month end', '/month-end'],
    ['menu costing', '/menu-costing'],
    ['stock', '/stock'],
    ['till sales', '/till-sales'],
  ])('%s', async (name, url) => {
    await visit(page, url);
    await checkPage(page, `bookkeeper: ${name}`);
  });
});
