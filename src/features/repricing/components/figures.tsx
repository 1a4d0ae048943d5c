import { StatusMark } from '../../../components/ui/status-mark';
import { formatMoney, formatQuantity } from '../../../lib/format';

/** A money figure, or a dash when there is none. */
export function Money({ value, currency, detail }: { value: string | null; currency: string; detail?: boolean }) {
  return <>{value === null ? '—' : formatMoney(value, currency, { detail })}</>;
}

/** A percentage written by the server ("74.65"), or a dash. */
export function Pct({ value }: { value: string | null }) {
  return <>{value === null ? '—' : formatQuantity(value, '%', { maxDecimals: 2 })}</>;
}

/** Below target in words and colour (never colour alone). */
export function TargetMark({ below, hasPrice = true }: { below: boolean; hasPrice?: boolean }) {
  if (!hasPrice) return <StatusMark tone="neutral">No price</StatusMark>;
  return below ? <StatusMark tone="bad">Below target</StatusMark> : <StatusMark tone="good">On target</StatusMark>;
}
