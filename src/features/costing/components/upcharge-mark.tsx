import { StatusMark } from '../../../components/ui/status-mark';
import { dec } from '../../../shared/decimal';

/**
 * Whether the menu upcharge keeps the drink's margin on a modifier's extra
 * cost for one cup size: said in words, with colour and a mark beside them.
 */
export function UpchargeMark({ upcharge, suggested }: { upcharge: string | null; suggested: string | null }) {
  if (suggested === null) return null;
  if (upcharge === null) return dec(suggested).gt(0) ? <StatusMark tone="attention">no upcharge set</StatusMark> : null;
  return dec(upcharge).lt(dec(suggested)) ? <StatusMark tone="bad">below suggested</StatusMark> : <StatusMark tone="good">keeps the margin</StatusMark>;
}
