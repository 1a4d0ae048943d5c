import { useContractMutation } from '../../../lib/contract';
import { revokeInvitation, team } from '../../../shared/contract/team';

export const useRevokeInvitation = () => useContractMutation(revokeInvitation, { invalidates: [team] });
