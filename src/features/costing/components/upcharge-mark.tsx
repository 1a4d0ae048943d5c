import { StatusMark, type Tone } from '../../../components/ui/status-mark';
import { dec } from '../../../shared/decimal';

/** What the upcharge does to the margin, or null when there is nothing to say (no suggestion, or none needed). */
export function upchargeStatus(upcharge: string | null, suggested: string | null): { tone: Tone; label: string } | null {
  if (suggested === null) return null;
  if (upcharge === null) return dec(suggested).gt(0) ? { tone: 'attention', label: 'no upcharge set' } : null;
  return dec(upcharge).lt(dec(suggested)) ? { tone: 'bad', label: 'below suggested' } : { tone: 'good', label: 'keeps the margin' };
}

/**
 * Whether the menu upcharge keeps the drink's margin on a modifier's extra
 * cost for one cup size: said in words, with colour and a mark beside them.
 */
export function UpchargeMark({ upcharge, suggested }: { upcharge: string | null; suggested: string | null }) {
  const status = upchargeStatus(upcharge, suggested);
  return status && <StatusMark tone={status.tone}>{status.label}</StatusMark>;
}
