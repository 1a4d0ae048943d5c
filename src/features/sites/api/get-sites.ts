import { useContractQuery } from '../../../lib/contract';
import { listSites } from '../../../shared/contract/sites';

export const useSites = () => useContractQuery(listSites);
