import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { useCostingMutation } from './keys';
import type { Drink, DrinkIn } from './types';

export function createDrink(input: DrinkIn): Promise<{ drink: Drink }> {
  return apiClient.post(paths.api.drinks(), input);
}

/** The whole drink, its sizes and their builds, replaced in one transaction. */
export function replaceDrink({ id, ...input }: DrinkIn & { id: string }): Promise<{ drink: Drink }> {
  return apiClient.put(paths.api.drink(id), input);
}

export function archiveDrink(id: string): Promise<void> {
  return apiClient.delete(paths.api.drink(id));
}

export const useCreateDrink = () => useCostingMutation(createDrink);
export const useReplaceDrink = () => useCostingMutation(replaceDrink);
export const useArchiveDrink = () => useCostingMutation(archiveDrink);
