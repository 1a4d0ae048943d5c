import { describe, expect, it } from 'vitest';
import { ALLERGEN_CAUTION, ALLERGEN_CODES, ALLERGENS, isAllergenCode, sortAllergens } from '../../src/shared/allergens';

describe('allergens', () => {
  it('are exactly the 14 of Regulation (EU) No 1169/2011 Annex II (EU1169, secondary)', () => {
    expect(ALLERGEN_CODES).toEqual([
      'celery', 'cereals-containing-gluten', 'crustaceans', 'eggs', 'fish', 'lupin', 'milk',
      'molluscs', 'mustard', 'peanuts', 'sesame', 'soybeans', 'sulphites', 'tree-nuts',
    ]);
    expect(ALLERGENS.sulphites).toMatch(/10 mg\/kg/);
    expect(ALLERGENS['cereals-containing-gluten']).toMatch(/gluten/);
  });

  it('recognises only those codes and sorts unions', () => {
    expect(isAllergenCode('milk')).toBe(true);
    expect(isAllergenCode('wheat')).toBe(false);
    expect(isAllergenCode('constructor')).toBe(false);
    expect(sortAllergens(['tree-nuts', 'milk', 'milk', 'celery'])).toEqual(['celery', 'milk', 'tree-nuts']);
  });

  it('carries the caution to check suppliers and local rules', () => {
    expect(ALLERGEN_CAUTION).toMatch(/derived only from what was entered/);
    expect(ALLERGEN_CAUTION).toMatch(/supplier/);
    expect(ALLERGEN_CAUTION).toMatch(/local food-information rules/);
  });
});
