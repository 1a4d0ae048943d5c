import { matchPath } from 'react-router-dom';
import { ROLES as roles, type Role } from '../shared/capabilities';
import { paths } from '../lib/paths';

/**
 * The app's sections, in menu order, with the roles that may see them. The side
 * navigation, the Home page's list and the role check on each page all read
 * this list: adding a section is one line here plus its route in router.tsx.
 */
export interface NavEntry {
  label: string;
  path: string;
  href: () => string;
  roles: readonly Role[];
  /** One line for the Home page: what someone does there. */
  does: string;
}

const everyone = roles;

function entry(route: { path: string; href: () => string }, label: string, who: readonly Role[], does: string): NavEntry {
  return { label, path: route.path, href: route.href, roles: who, does };
}

export const navigation: readonly NavEntry[] = [
  entry(paths.home, 'Home', everyone, 'See what you can do here.'),
  entry(paths.team, 'Team', ['owner'], 'Invite people, choose their roles and remove access.'),
  entry(paths.settings, 'Settings', ['owner'], 'Business name, country, currency, tax on menu prices and your sites.'),
  entry(paths.drinks, 'Drinks', ['owner', 'manager'], 'Build each drink per cup size and see its cost per cup as you type.'),
  entry(paths.modifiers, 'Modifiers', ['owner', 'manager'], 'Add-ons and swaps costed per cup size, with the upcharge that keeps your margin.'),
  entry(paths.ingredients, 'Ingredients', ['owner', 'manager'], 'What you buy, pack by pack, and its cost per gram, millilitre or measure.'),
  entry(paths.preparations, 'Preparations', ['owner', 'manager'], 'Syrups, concentrates and cold brew made in house, costed per batch.'),
  entry(paths.menuCosting, 'Menu costing', ['owner', 'manager', 'bookkeeper'], 'Cost, margin and suggested price of every drink in every size.'),
  entry(paths.cards, 'Recipe cards', everyone, 'The build of each drink per cup size, for the bar.'),
  entry(paths.pricing, 'Sizes and pricing', ['owner', 'manager'], 'Your cup sizes, target margin, tax on menu prices and price rounding.'),
  entry(paths.repricing, 'Repricing', ['owner', 'manager', 'bookkeeper'], "See what a supplier's price rise does to every drink, try scenarios, apply new prices."),
  entry(paths.priceList, 'Price list', everyone, 'The prices for the counter with allergen marks, to print or download.'),
  entry(paths.stock, 'Stock', ['owner', 'manager', 'bookkeeper'], 'Stock on hand at the site, par levels and reorder points, and the suggested order per supplier.'),
  entry(paths.orders, 'Purchase orders', ['owner', 'manager', 'bookkeeper'], 'Draft, place, pay and receive orders to suppliers, with their timeline and invoices.'),
  entry(paths.suppliers, 'Suppliers', ['owner', 'manager', 'bookkeeper'], 'Who you buy from, where orders go, minimums, delivery days and how they are paid.'),
  entry(paths.stockCounts, 'Stock counts', everyone, 'Count the stock on the shelves, pack by pack, by storage area, on your phone.'),
  entry(paths.waste, 'Waste', everyone, 'Record milk poured away, remade drinks and out-of-date stock, valued at cost.'),
  entry(paths.tillSales, 'Till sales', ['owner', 'manager', 'bookkeeper'], "Import the till's CSV of sales, match its items to your drinks, or enter a day by hand."),
  entry(paths.monthEnd, 'Month end', ['owner', 'manager', 'bookkeeper'], 'Cost of goods for a month, actual against theoretical, CSV exports and closing the month.'),
];

export function entriesFor(role: Role): NavEntry[] {
  return navigation.filter((e) => e.roles.includes(role));
}

/** The section a URL belongs to: the longest matching entry path ('/' only matches itself). */
export function entryForPath(pathname: string): NavEntry | undefined {
  return [...navigation]
    .sort((a, b) => b.path.length - a.path.length)
    .find((e) => matchPath({ path: e.path, end: e.path === '/' }, pathname));
}
