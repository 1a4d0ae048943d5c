import { useContractQuery } from '../../../lib/contract';
import {
  getCard,
  getDrink,
  getDrinkCosting,
  getIngredient,
  getMenuCosting,
  getModifier,
  getPreparation,
  getPricingPolicy,
  listCards,
  listDrinks,
  listIngredients,
  listModifiers,
  listPreparations,
  listSizes,
} from '../../../shared/contract/costing';
import { listSuppliers } from '../../../shared/contract/suppliers';

// The costing reads, each typed by its contract entry. A hook given no id yet waits for one.

export const useSizes = () => useContractQuery(listSizes);
export const useIngredients = () => useContractQuery(listIngredients);
export const useIngredient = (id: string) => useContractQuery(getIngredient, { params: { id } }, { enabled: id !== '' });
export const usePreparations = () => useContractQuery(listPreparations);
export const usePreparation = (id: string) => useContractQuery(getPreparation, { params: { id } }, { enabled: id !== '' });
export const useDrinks = () => useContractQuery(listDrinks);
export const useDrink = (id: string | undefined) => useContractQuery(getDrink, { params: { id: id ?? '' } }, { enabled: Boolean(id) });
export const useDrinkCosting = (id: string | undefined) => useContractQuery(getDrinkCosting, { params: { id: id ?? '' } }, { enabled: Boolean(id) });
export const useMenuCosting = () => useContractQuery(getMenuCosting);
export const useCards = () => useContractQuery(listCards);
export const useCard = (id: string) => useContractQuery(getCard, { params: { id } });
export const useModifiers = () => useContractQuery(listModifiers);
export const useModifier = (id: string | undefined) => useContractQuery(getModifier, { params: { id: id ?? '' } }, { enabled: Boolean(id) });
export const usePricingPolicy = () => useContractQuery(getPricingPolicy);
/** The suppliers a pack can name (the purchase-order pages own their editing). */
export const useSuppliers = () => useContractQuery(listSuppliers);
