import { useContractQuery } from '../../../lib/contract';
import { publicConfig } from '../../../shared/contract/system';

/** The server's explicit list of what the client may know about its setup. */
export const useConfig = () => useContractQuery(publicConfig, {}, { staleTime: Infinity });
