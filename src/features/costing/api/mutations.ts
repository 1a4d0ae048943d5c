import { useContractMutation } from '../../../lib/contract';
import {
  createDrink,
  createModifier,
  createPreparation,
  createSize,
  deleteModifier,
  deleteSize,
  replaceDrink,
  replaceModifier,
  replacePreparation,
  savePricingPolicy,
  updateSize,
} from '../../../shared/contract/costing';
import { COSTING_PATHS } from './keys';

// The costing writes: each refreshes every costing read once it is done (see keys.ts).
const refreshing = { invalidates: [...COSTING_PATHS] };

export const useCreateSize = () => useContractMutation(createSize, refreshing);
export const useUpdateSize = () => useContractMutation(updateSize, refreshing);
export const useDeleteSize = () => useContractMutation(deleteSize, refreshing);
export const useCreateDrink = () => useContractMutation(createDrink, refreshing);
/** The whole drink, its sizes and their builds, replaced in one transaction. */
export const useReplaceDrink = () => useContractMutation(replaceDrink, refreshing);
export const useCreatePreparation = () => useContractMutation(createPreparation, refreshing);
/** The whole preparation, its lines replaced in one transaction. */
export const useReplacePreparation = () => useContractMutation(replacePreparation, refreshing);
export const useCreateModifier = () => useContractMutation(createModifier, refreshing);
/** The whole modifier and its lines for every cup size, replaced in one transaction. */
export const useReplaceModifier = () => useContractMutation(replaceModifier, refreshing);
export const useDeleteModifier = () => useContractMutation(deleteModifier, refreshing);
/** Replaces the business's policy and all its category overrides at once. */
export const useSavePricingPolicy = () => useContractMutation(savePricingPolicy, refreshing);
