import { useContractMutation } from '../../../lib/contract';
import { requestPasswordReset } from '../../../shared/contract/auth';

/** Always answers 202, whether or not the address has an account. */
export const useRequestReset = () => useContractMutation(requestPasswordReset);
