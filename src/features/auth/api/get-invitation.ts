import { useContractQuery } from '../../../lib/contract';
import { invitation } from '../../../shared/contract/auth';

export function useInvitation(token: string) {
  return useContractQuery(invitation, { params: { token } }, { enabled: token.length > 0, retry: false });
}
