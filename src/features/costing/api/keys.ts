import type { QueryClient } from '@tanstack/react-query';
import { invalidate } from '../../../lib/contract';

/**
 * The paths of every costing read. A change to one ingredient, pack, preparation, size or
 * policy moves the cost of drinks, preparations, the menu and their cards alike, so every
 * costing write refreshes them all.
 */
export const COSTING_PATHS = [
  '/api/sizes',
  '/api/ingredients',
  '/api/packs',
  '/api/preparations',
  '/api/drinks',
  '/api/menu',
  '/api/cards',
  '/api/modifiers',
  '/api/pricing-policy',
  '/api/costing',
] as const;

/** Marks every costing read as stale (after a write elsewhere that moves a cost, such as a delivery's new price). */
export function invalidateCosting(queryClient: QueryClient): Promise<void> {
  return invalidate(queryClient, ...COSTING_PATHS);
}
