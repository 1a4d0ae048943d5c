import { useContractMutation } from '../../../lib/contract';
import { createSite, listSites } from '../../../shared/contract/sites';

export const useCreateSite = () => useContractMutation(createSite, { invalidates: [listSites] });
