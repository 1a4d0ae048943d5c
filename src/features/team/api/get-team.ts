import { useContractQuery } from '../../../lib/contract';
import { team } from '../../../shared/contract/team';

export const useTeam = () => useContractQuery(team);
