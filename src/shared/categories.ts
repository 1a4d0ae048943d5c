/**
 * Ingredient categories, in the order the books list and store them (the database checks the
 * same list on ingredients.category).
 */
export const INGREDIENT_CATEGORIES = ['coffee', 'dairy', 'plant-milk', 'syrup-sauce', 'powder', 'tea', 'extras', 'packaging', 'other'] as const;

export type IngredientCategory = (typeof INGREDIENT_CATEGORIES)[number];
