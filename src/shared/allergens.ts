/**
 * The 14 substances or products causing allergies or intolerances listed in Annex II of
 * Regulation (EU) No 1169/2011 (retained in UK law), as stable codes with plain English labels.
 * Order: alphabetical by code, which is also how lists of them are sorted.
 */
export const ALLERGENS = {
  celery: 'Celery',
  'cereals-containing-gluten': 'Cereals containing gluten (wheat, rye, barley, oats)',
  crustaceans: 'Crustaceans',
  eggs: 'Eggs',
  fish: 'Fish',
  lupin: 'Lupin',
  milk: 'Milk',
  molluscs: 'Molluscs',
  mustard: 'Mustard',
  peanuts: 'Peanuts',
  sesame: 'Sesame seeds',
  soybeans: 'Soybeans',
  sulphites: 'Sulphur dioxide and sulphites (over 10 mg/kg or 10 mg/l)',
  'tree-nuts': 'Tree nuts',
} as const;

export type AllergenCode = keyof typeof ALLERGENS;
export const ALLERGEN_CODES = Object.keys(ALLERGENS).sort() as [AllergenCode, ...AllergenCode[]];

/** Shown wherever allergens derived by the app are displayed or printed. */
export const ALLERGEN_CAUTION =
  'Allergens shown here are derived only from what was entered for each ingredient and preparation. ' +
  "Check every supplier's product specification, watch for cross-contact in your kitchen, and follow " +
  'your local food-information rules (in the UK and EU, Regulation (EU) No 1169/2011) before telling a customer what a drink contains.';

export function isAllergenCode(value: string): value is AllergenCode {
  return Object.prototype.hasOwnProperty.call(ALLERGENS, value);
}

/** Sorted, de-duplicated allergen codes. */
export function sortAllergens(codes: Iterable<AllergenCode>): AllergenCode[] {
  return [...new Set(codes)].sort();
}
