import { useContractMutation } from '../../../lib/contract';
import { invite, team } from '../../../shared/contract/team';

export const useInviteMember = () => useContractMutation(invite, { invalidates: [team] });
