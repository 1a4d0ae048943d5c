import { useContractMutation } from '../../../lib/contract';
import { listSites, renameSite } from '../../../shared/contract/sites';

export const useRenameSite = () => useContractMutation(renameSite, { invalidates: [listSites] });
