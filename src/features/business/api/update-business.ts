import { useContractMutation } from '../../../lib/contract';
import { me } from '../../../shared/contract/auth';
import { getBusiness, updateBusiness } from '../../../shared/contract/business';

// The session carries the business too (its currency and time zone are read from there).
export const useUpdateBusiness = () => useContractMutation(updateBusiness, { invalidates: [getBusiness, me] });
