import path from 'node:path';
import { afterAll, beforeAll, expect, test } from 'vitest';
import type { Page } from 'playwright-core';
import { dec } from '../../src/shared/decimal';
import { getJson, SCREENSHOTS, serveDemo, type Served } from './harness';

// The first journey of the costing work done with the keyboard alone: from Home the owner
// reaches Drinks, starts a new drink, names it, keeps one cup size, builds it from the demo
// coffee and milk, reads the cost per cup and the suggested price, and saves. No clicks and
// no page loads after the first: only Tab, Shift+Tab, Enter, Space, arrows and typing. At
// every step the focused control must show its focus ring (the design guide asks for one on
// every control). The drink is archived through the API afterwards.

let s: Served;
beforeAll(async () => {
  s = await serveDemo();
});
afterAll(() => s?.close());
/** The journey's page; the helpers below read it. */
let page: Page;

// What the screen shows (not the full page), so the focused control is in the picture with its ring.
const shot = (name: string) => page.screenshot({ path: path.join(SCREENSHOTS, 'keyboard', `${name}.png`) });

/** What has the focus, and how it shows it. */
interface Focused {
  tag: string;
  /** Its accessible name as a reader would hear it, near enough: aria-label, its label, else its text. */
  name: string;
  value: string;
  outlineStyle: string;
  outlineWidth: string;
  boxShadow: string;
  /** Whether what is drawn at its centre is the control itself, not something over it (the sticky top bar). */
  inSight: boolean;
}

async function focused(p: Page): Promise<Focused | null> {
  return p.evaluate(() => {
    const el = document.activeElement as HTMLElement | null;
    if (!el || el === document.body || el === document.documentElement) return null;
    const labelled = el.getAttribute('aria-labelledby');
    const name =
      el.getAttribute('aria-label') ??
      (labelled ? document.getElementById(labelled)?.textContent : null) ??
      ((el as HTMLInputElement).labels?.[0]?.textContent || null) ??
      el.textContent ??
      '';
    const style = getComputedStyle(el);
    const box = el.getBoundingClientRect();
    const hit = document.elementFromPoint(box.left + box.width / 2, box.top + box.height / 2);
    return {
      tag: el.tagName.toLowerCase(),
      name: name.replace(/\s+/g, ' ').trim(),
      value: 'value' in el ? String((el as HTMLInputElement).value) : '',
      outlineStyle: style.outlineStyle,
      outlineWidth: style.outlineWidth,
      boxShadow: style.boxShadow,
      inSight: hit !== null && (hit === el || el.contains(hit) || (el as HTMLInputElement).labels?.[0]?.contains(hit) === true),
    };
  });
}

const describeFocus = (f: Focused) => `${f.tag} "${f.name}"`;

/** Focus is on a control (never lost to the page), shows a ring (an outline, or a box shadow) and can be seen. */
function expectVisibleFocus(f: Focused | null, after: string): asserts f is Focused {
  expect(f, `focus was lost after ${after}`).not.toBeNull();
  const outline = f!.outlineStyle !== 'none' && Number.parseFloat(f!.outlineWidth) > 0;
  const shadow = f!.boxShadow !== 'none';
  expect(outline || shadow, `${describeFocus(f!)} shows no focus ring after ${after} (outline ${f!.outlineStyle} ${f!.outlineWidth}, box-shadow ${f!.boxShadow})`).toBe(true);
  // Focus not obscured (WCAG 2.2, 2.4.11): scrolled into view, and not under the sticky top bar.
  expect(f!.inSight, `${describeFocus(f!)} is hidden after ${after}`).toBe(true);
}

/** Presses a key and checks where the focus went. */
async function press(key: string): Promise<Focused> {
  await page.keyboard.press(key);
  // Two frames, so React has rendered what the key did and run its effects; a page change may take
  // longer, so a focus that is not on a control yet gets a moment more before it counts as lost.
  await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r))));
  await page.waitForFunction(() => document.activeElement && document.activeElement !== document.body, null, { timeout: 1000 }).catch(() => undefined);
  const f = await focused(page);
  expectVisibleFocus(f, key);
  return f;
}

/** Tabs (or Shift+Tabs) until the focused control matches, checking the ring at every stop on the way. */
async function tabTo(want: (f: Focused) => boolean, what: string, { back = false, max = 60 } = {}): Promise<Focused> {
  const seen: string[] = [];
  for (let i = 0; i < max; i++) {
    const f = await press(back ? 'Shift+Tab' : 'Tab');
    if (want(f)) return f;
    seen.push(describeFocus(f));
  }
  throw new Error(`${what} was not reached in ${max} presses of ${back ? 'Shift+Tab' : 'Tab'}; focus went through: ${seen.join(', ')}`);
}

const named = (tag: string, name: string) => (f: Focused) => f.tag === tag && f.name === name;

/** Types into the focused box; the focus stays there. */
async function type(text: string) {
  await page.keyboard.type(text);
  expectVisibleFocus(await focused(page), `typing "${text}"`);
}

interface Costing {
  sizes: { name: string; cost: string; suggestedPrice: string }[];
}

test('the owner costs a new drink with the keyboard alone', async () => {
  const name = `Keyboard flat white ${Date.now().toString(36)}`;
  let drinkId = '';
  page = await s.newPage();
  try {
    await s.signIn(page, 'owner@demo.test');
    const { sizes } = await getJson<{ sizes: { id: string; name: string }[] }>(page, '/api/sizes');
    expect(sizes.length).toBeGreaterThanOrEqual(2);
    // The build goes in the second size; every other size is left out.
    const kept = sizes[1].name;
    await page.goto(`${s.url}/`);
    await page.getByRole('heading', { level: 1 }).waitFor();

    // Home → Drinks.
    await tabTo(named('a', 'Drinks'), 'the Drinks link');
    await shot('home-drinks-link');
    await press('Enter');
    await page.getByRole('heading', { name: 'Drinks', level: 1 }).waitFor();

    // Drinks → a new drink.
    await tabTo(named('a', 'Add a drink'), 'Add a drink');
    await press('Enter');
    await page.getByRole('heading', { name: 'New drink', level: 1 }).waitFor();
    await page.locator('#drink-form').waitFor();
    await shot('new-drink');

    // Its name, its category, served hot (the arrows move between the two choices).
    await tabTo(named('input', 'Drink name'), 'the drink name');
    await type(name);
    expect(describeFocus(await press('Tab'))).toBe('input "Category"');
    await type('Espresso');
    const served = await tabTo((f) => f.tag === 'input' && (f.name === 'Hot' || f.name === 'Iced'), 'the served choice');
    expect(served.name).toBe('Hot');
    expect((await press('ArrowRight')).name).toBe('Iced');
    expect((await press('ArrowLeft')).name).toBe('Hot');
    expect(await page.getByLabel('Hot', { exact: true }).isChecked()).toBe(true);

    // Keep one cup size: Space unticks "Offered" on the sizes before it.
    for (const size of sizes) {
      await tabTo(named('input', 'Offered'), `"Offered" for ${size.name}`);
      if (size.name === kept) break;
      await press('Space');
      expect(await page.locator(`section[data-size="${size.name}"] input[type="checkbox"]`).isChecked()).toBe(false);
    }
    const column = page.locator(`section[data-size="${kept}"]`);

    // Line 1: a shot of the house espresso beans (the unit chosen with the arrows).
    await tabTo(named('button', 'Add a line'), `Add a line for ${kept}`);
    let f = await press('Enter');
    expect(f.name, 'focus goes to the new line').toBe('Item, line 1');
    await type('House espresso beans');
    f = await press('Tab');
    expect(f.name).toBe('Quantity, line 1');
    await type('2');
    f = await press('Tab');
    expect(f.name).toBe('Unit or measure, line 1');
    const unit1 = column.getByLabel('Unit or measure, line 1', { exact: true });
    const unitShown = () => unit1.evaluate((el: HTMLSelectElement) => el.selectedOptions[0]?.textContent ?? '');
    // The item brought its first measure, the shot; the arrows step through the list and back.
    expect(await unitShown()).toMatch(/^shot/);
    await press('ArrowDown');
    expect(await unitShown()).toBe('g');
    await press('ArrowUp');
    expect(await unitShown()).toMatch(/^shot/);
    await shot('line-1');

    // Line 2: whole milk in millilitres.
    await tabTo(named('button', 'Add a line'), 'Add a line, again');
    f = await press('Enter');
    expect(f.name, 'focus goes to the new line').toBe('Item, line 2');
    await type('Whole milk');
    await press('Tab');
    await type('220');
    f = await press('Tab');
    expect(f.name).toBe('Unit or measure, line 2');
    expect(await column.getByLabel('Unit or measure, line 2', { exact: true }).evaluate((el: HTMLSelectElement) => el.selectedOptions[0]?.textContent)).toBe('ml');

    // A third line added by mistake: moved up (focus stays on the move button), then removed
    // (focus goes to the line that takes its place).
    await tabTo(named('button', 'Add a line'), 'Add a line, a third time');
    f = await press('Enter');
    expect(f.name).toBe('Item, line 3');
    await type('House vanilla syrup');
    f = await tabTo(named('button', 'Move line 3 up'), 'Move line 3 up');
    f = await press('Enter');
    expect(describeFocus(f), 'the moved line keeps the focus').toBe('button "Move line 2 up"');
    expect(await column.getByLabel('Item, line 2', { exact: true }).inputValue()).toBe('House vanilla syrup');
    f = await tabTo(named('button', 'Remove line 2'), 'Remove line 2');
    f = await press('Enter');
    expect(f.name, 'focus goes to the line that took its place').toBe('Item, line 2');
    await shot('line-removed');
    expect(f.value).toBe('Whole milk');
    expect(await column.locator('ol > li').count()).toBe(2);

    // The menu price; the cost per cup and the suggested price appear.
    await tabTo(named('input', `Menu price, ${kept}`), 'the menu price');
    await type('3.40');
    const ready = page.locator(`[data-figures-for="${kept}"][data-state="ready"]`);
    const figures = page.getByTestId(`figures-${kept}`);
    const cost = figures.locator('[data-figure="cost"]');
    const suggested = figures.locator('[data-figure="suggested"]');
    await ready.waitFor();
    expect(await cost.isVisible()).toBe(true);
    expect(await suggested.isVisible()).toBe(true);
    const first = (await cost.getAttribute('data-value'))!;
    expect(dec(first).gt(0)).toBe(true);
    await shot('figures');

    // Back up the form to pour less milk (Shift+Tab), and the figures follow.
    f = await tabTo(named('input', 'Quantity, line 2'), 'the milk quantity', { back: true });
    expect(f.value).toBe('220');
    await shot('back-to-the-milk');
    await press('ControlOrMeta+a');
    await type('200');
    await expect.poll(() => cost.getAttribute('data-value')).not.toBe(first);
    await ready.waitFor();
    const shownCost = (await cost.getAttribute('data-value'))!;
    const shownSuggested = (await suggested.getAttribute('data-value'))!;
    expect(dec(shownCost).lt(dec(first))).toBe(true);
    expect(dec(shownSuggested).gt(dec(shownCost))).toBe(true);

    // Leave the sizes after it out, then save with the button at the foot of the form.
    const after = sizes.slice(sizes.findIndex((x) => x.name === kept) + 1);
    for (const size of after) {
      await tabTo(named('input', 'Offered'), `"Offered" for ${size.name}`);
      await press('Space');
    }
    await tabTo(named('button', 'Save drink'), 'Save drink');
    // The save is held back a moment, as on a slow connection, to see the button while it works:
    // it keeps the focus (a disabled button would drop it to the page).
    let posts = 0;
    await page.route('**/api/drinks', async (route) => {
      if (route.request().method() === 'POST') {
        posts++;
        await new Promise((r) => setTimeout(r, 1500));
      }
      await route.continue();
    });
    f = await press('Enter');
    expect(describeFocus(f)).toBe('button "Save drink"');
    expect(await page.evaluate(() => document.activeElement?.getAttribute('aria-busy'))).toBe('true');
    await shot('saving');
    // A second press while it works sends nothing more.
    await press('Enter');
    await page.waitForURL((u) => /\/drinks\/[0-9a-f-]{36}$/.test(u.pathname));
    drinkId = new URL(page.url()).pathname.split('/').pop()!;
    await page.getByText(`${name} saved.`).waitFor();
    await page.getByRole('heading', { name, level: 1 }).waitFor();
    // The editor opens again for the saved drink: its title, now the drink's name, has the focus.
    f = (await focused(page))!;
    expectVisibleFocus(f, 'saving');
    expect(describeFocus(f)).toBe(`h1 "${name}"`);
    await shot('saved');

    // What the editor showed is what the server costs for the saved drink.
    const saved = await getJson<Costing>(page, `/api/drinks/${drinkId}/costing`);
    expect(saved.sizes.map((x) => x.name)).toEqual([kept]);
    expect(posts, 'one save sent').toBe(1);
    expect(saved.sizes[0].cost).toBe(shownCost);
    expect(saved.sizes[0].suggestedPrice).toBe(shownSuggested);
    const reloaded = page.getByTestId(`figures-${kept}`).locator('[data-figure="cost"]');
    await expect.poll(() => reloaded.getAttribute('data-value')).toBe(saved.sizes[0].cost);
  } finally {
    // Deleting a drink archives it (decision 18): the demo menu the other browser tests read is unchanged.
    if (drinkId) {
      const status = await page.evaluate(async (id) => {
        const me = await (await fetch('/api/auth/me')).json();
        return (await fetch(`/api/drinks/${id}`, { method: 'DELETE', headers: { 'X-CSRF-Token': me.csrfToken } })).status;
      }, drinkId);
      expect(status).toBe(204);
    }
    await page.close();
  }
}, 120_000);
