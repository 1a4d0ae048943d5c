import { useContractMutation } from '../../../lib/contract';
import { changeRole, team } from '../../../shared/contract/team';

// Refetch on failure too, so the select shows the role the server kept.
export const useChangeRole = () => useContractMutation(changeRole, { invalidates: [team] });
