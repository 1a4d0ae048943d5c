import { StatusMark, type Tone } from '../../../components/ui/status-mark';
import type { Order, OrderStatus, PaymentTerms } from '../api/types';

const STATUS: Record<OrderStatus, { label: string; tone: Tone }> = {
  draft: { label: 'Draft, not sent', tone: 'neutral' },
  placed: { label: 'Sent to the supplier', tone: 'info' },
  paid: { label: 'Paid, awaiting delivery', tone: 'info' },
  part_received: { label: 'Partly delivered', tone: 'attention' },
  received: { label: 'Delivered', tone: 'good' },
  closed: { label: 'Closed', tone: 'good' },
  cancelled: { label: 'Cancelled', tone: 'bad' },
};

export function orderStatusLabel(status: OrderStatus): string {
  return STATUS[status].label;
}

export function OrderStatusMark({ status }: { status: OrderStatus }) {
  return <StatusMark tone={STATUS[status].tone}>{STATUS[status].label}</StatusMark>;
}

export function termsLabel(terms: PaymentTerms): string {
  return terms === 'card' ? 'By card when ordering' : 'On account';
}

/** The payment's state in plain words, or null when there is nothing to say. */
export function paymentWords(order: Order): { label: string; tone: Tone; detail: string | null } | null {
  const p = order.payment;
  if (order.paymentTerms === 'account') return { label: 'Paid on account', tone: 'neutral', detail: 'The supplier invoices you; no card payment here.' };
  if (!p) return order.status === 'draft' || order.status === 'cancelled' ? null : { label: 'Not paid yet', tone: 'attention', detail: null };
  if (p.confirming) return { label: 'Payment being confirmed', tone: 'attention', detail: p.message ?? 'We are checking with the card processor whether this payment went through. Nothing more will be charged.' };
  switch (p.status) {
    case 'succeeded':
      return { label: 'Paid by card', tone: 'good', detail: p.reference ? `Payment reference ${p.reference}` : null };
    case 'requires_action':
      return { label: 'Card needs the cardholder to confirm', tone: 'attention', detail: p.message };
    case 'failed':
      return { label: 'Payment did not go through', tone: 'bad', detail: p.message };
    case 'refunded':
      return { label: 'Refunded', tone: 'info', detail: p.reference ? `Payment reference ${p.reference}` : null };
    default:
      return { label: 'Payment being confirmed', tone: 'attention', detail: p.message };
  }
}

export function PaymentMark({ order }: { order: Order }) {
  const w = paymentWords(order);
  return w ? <StatusMark tone={w.tone}>{w.label}</StatusMark> : null;
}
