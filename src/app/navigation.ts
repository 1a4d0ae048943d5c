import { matchPath } from 'react-router-dom';
import { can, type Capability, type Role } from '../shared/capabilities';
import { paths } from '../lib/paths';

/**
 * The app's sections, in menu order and in groups, each with the capability a role needs to see
 * it (the one role table in src/shared/capabilities.ts decides). The side navigation, the Home
 * page and the check on each page all read this list: adding a section is one line here plus
 * its route in router.tsx. A section's label is its page's title.
 */
export const GROUPS = ['Menu and costing', 'Buying and stock', 'Books', 'Business'] as const;
export type NavGroup = (typeof GROUPS)[number];

export interface NavEntry {
  label: string;
  path: string;
  href: () => string;
  /** Who sees it: a capability of the role table, or every signed-in user. */
  access: Capability | 'signed-in';
  group: NavGroup | null;
  /** One line for the Home page: what someone does there. */
  does: string;
}

function entry(route: { path: string; href: () => string }, label: string, access: NavEntry['access'], group: NavGroup | null, does: string): NavEntry {
  return { label, path: route.path, href: route.href, access, group, does };
}

export const navigation: readonly NavEntry[] = [
  entry(paths.home, 'Home', 'signed-in', null, 'What needs doing today.'),
  entry(paths.drinks, 'Drinks', 'costs.write', 'Menu and costing', 'Build each drink per cup size and see its cost per cup as you type.'),
  entry(paths.modifiers, 'Modifiers', 'costs.write', 'Menu and costing', 'Extra shots, syrups and milk swaps, costed per cup size, with the upcharge that keeps your margin.'),
  entry(paths.ingredients, 'Ingredients', 'costs.write', 'Menu and costing', 'What you buy, pack by pack, and its cost per gram, millilitre or measure.'),
  entry(paths.preparations, 'Preparations', 'costs.write', 'Menu and costing', 'Syrups, concentrates and cold brew made in house, costed per batch.'),
  entry(paths.menuCosting, 'Menu costing', 'costs.read', 'Menu and costing', 'Cost, margin and suggested price of every drink in every size.'),
  entry(paths.pricing, 'Cup sizes and pricing', 'costs.write', 'Menu and costing', 'Your cup sizes, target margin, tax on menu prices and price rounding.'),
  entry(paths.repricing, 'Repricing', 'costs.read', 'Menu and costing', "See what a supplier's price rise does to every drink, try scenarios, apply new prices."),
  entry(paths.priceList, 'Price list', 'cards.read', 'Menu and costing', 'The prices for the counter with allergen marks, to print or download.'),
  entry(paths.cards, 'Recipe cards', 'cards.read', 'Menu and costing', 'The build of each drink per cup size, for the bar.'),
  entry(paths.stock, 'Stock', 'orders.read', 'Buying and stock', 'Stock on hand at the site, par levels and reorder points, and the suggested order per supplier.'),
  entry(paths.orders, 'Purchase orders', 'orders.read', 'Buying and stock', 'Draft, place, pay and receive orders to suppliers, with their timeline and invoices.'),
  entry(paths.suppliers, 'Suppliers', 'costs.read', 'Buying and stock', 'Who you buy from, where orders go, minimums, delivery days and how they are paid.'),
  entry(paths.stockCounts, 'Stock counts', 'counts.write', 'Buying and stock', 'Count the stock on the shelves, pack by pack, by storage area, on your phone.'),
  entry(paths.waste, 'Waste', 'stock.read', 'Buying and stock', 'Record milk poured away, remade drinks and out-of-date stock.'),
  entry(paths.tillSales, 'Till sales', 'sales.import', 'Books', "Import the till's CSV of sales, match its items to your drinks, or enter a day by hand."),
  entry(paths.monthEnd, 'Month end', 'reports.read', 'Books', 'Cost of goods for a month, actual against theoretical, the exports and closing the month.'),
  entry(paths.team, 'Team', 'team.manage', 'Business', 'Invite people, choose their roles and remove access.'),
  entry(paths.settings, 'Settings', 'business.manage', 'Business', 'Business name, country, currency, tax on menu prices, time zone and your sites.'),
];

/** May this role open the section? */
export function mayOpen(role: Role, e: NavEntry): boolean {
  return e.access === 'signed-in' || can(role, e.access);
}

export function entriesFor(role: Role): NavEntry[] {
  return navigation.filter((e) => mayOpen(role, e));
}

/** The role's sections in their groups, in menu order (Home first, in no group). */
export function groupsFor(role: Role): { group: NavGroup | null; entries: NavEntry[] }[] {
  const mine = entriesFor(role);
  return [null, ...GROUPS].map((group) => ({ group, entries: mine.filter((e) => e.group === group) })).filter((g) => g.entries.length > 0);
}

/** The section a URL belongs to: the longest matching entry path ('/' only matches itself). */
export function entryForPath(pathname: string): NavEntry | undefined {
  return [...navigation]
    .sort((a, b) => b.path.length - a.path.length)
    .find((e) => matchPath({ path: e.path, end: e.path === '/' }, pathname));
}
