import { useContractMutation } from '../../../lib/contract';
import { completePasswordReset, me } from '../../../shared/contract/auth';

// A reset ends every session of that user; ask again who is signed in.
export const useCompleteReset = () => useContractMutation(completePasswordReset, { invalidates: [me] });
