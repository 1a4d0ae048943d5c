import { useContractMutation } from '../../../lib/contract';
import { removeMember, team } from '../../../shared/contract/team';

export const useRemoveMember = () => useContractMutation(removeMember, { invalidates: [team] });
