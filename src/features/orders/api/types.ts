// Shapes of the purchase-order API (docs: api-orders contract) as the client reads them.

export type OrderStatus = 'draft' | 'placed' | 'paid' | 'part_received' | 'received' | 'closed' | 'cancelled';
export type PaymentTerms = 'card' | 'account';
export type PaymentStatus = 'pending' | 'unknown' | 'requires_action' | 'succeeded' | 'failed' | 'refunded';

export interface OrderLine {
  id: string;
  packId: string;
  description: string;
  quantity: string;
  unitPrice: string;
  taxPct: string;
  lineTotal: string;
  quantityReceived: string;
  note: string | null;
  /** The pack's price in force today, to compare with the invoice. */
  packPrice: string | null;
}

export interface OrderPayment {
  status: PaymentStatus;
  /** True while the outcome is not known yet: show "payment being confirmed". */
  confirming: boolean;
  reference: string | null;
  message: string | null;
  code: string | null;
  attempt: number;
  nextActionUrl: string | null;
  updatedAt: string;
}

export interface TimelineEvent {
  id: string;
  kind: string;
  message: string;
  actor: string | null;
  at: string;
}

export interface Receipt {
  id: string;
  receivedOn: string;
  invoiceNumber: string | null;
  notes: string | null;
  receivedBy: string | null;
  lines: { orderLineId: string; packId: string; quantity: string; unitPrice: string; net: string; note: string | null }[];
}

export interface Order {
  id: string;
  number: string;
  status: OrderStatus;
  version: number;
  site: { id: string; name: string };
  supplier: { id: string; name: string; orderEmail: string | null; paymentTerms: PaymentTerms; minimumOrder: string };
  currency: string;
  paymentTerms: PaymentTerms;
  lines: OrderLine[];
  subtotal: string;
  tax: string;
  deliveryCharge: string;
  total: string;
  minimumShortfall: string | null;
  notes: string | null;
  expectedOn: string | null;
  placedAt: string | null;
  email: { sentAt: string; to: string } | null;
  paidAt: string | null;
  paymentReference: string | null;
  payment: OrderPayment | null;
  receivedAt: string | null;
  closedAt: string | null;
  cancelledAt: string | null;
  supplierInvoiceNumber: string | null;
  invoice: { url: string; contentType: string; name: string } | null;
  receipts: Receipt[];
  timeline: TimelineEvent[];
  createdAt: string;
}

export interface OrderSummary {
  id: string;
  number: string;
  status: OrderStatus;
  site: { id: string; name: string };
  supplier: { id: string; name: string };
  total: string;
  currency: string;
  paymentTerms: PaymentTerms;
  expectedOn: string | null;
  createdAt: string;
  placedAt: string | null;
}

export interface CataloguePack {
  id: string;
  description: string;
  ingredient: string;
  supplierCode: string | null;
  price: string | null;
  taxPct: string;
}

export interface SuggestedOrder {
  site: { id: string; name: string };
  supplier: { id: string; name: string; paymentTerms: PaymentTerms; minimumOrder: string };
  currency: string;
  lines: { packId: string; description: string; onHand: string; par: string; reorderPoint: string; quantity: string; unitPrice: string | null; lineTotal: string }[];
  subtotal: string;
  tax: string;
  deliveryCharge: string;
  total: string;
  minimumShortfall: string | null;
  nextDelivery: string | null;
}

export interface SavedCard {
  card: { paymentMethodId: string; brand: string | null; last4: string | null; expMonth: number | null; expYear: number | null } | null;
  testMode: boolean;
  testCards: { id: string; label: string }[];
}

export interface ReceiptResult {
  receiptId: string;
  shortages: { lineId: string; description: string; ordered: string; received: string; short: string }[];
  priceChanges: { lineId: string; packId: string; description: string; orderedPrice: string; invoicePrice: string; packPrice: string | null; receivedOn: string }[];
}
