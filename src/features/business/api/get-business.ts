import { useContractQuery } from '../../../lib/contract';
import { getBusiness } from '../../../shared/contract/business';

export const useBusiness = () => useContractQuery(getBusiness, {}, { select: (d) => d.business });
