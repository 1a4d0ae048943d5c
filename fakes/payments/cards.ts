/**
 * The payment method ids published for test mode, and what each does when a
 * payment is confirmed with it. Card numbers' last four digits follow the
 * published test cards (from memory).
 */
export type CardOutcome =
  | { kind: 'succeed' }
  | { kind: 'decline'; declineCode: string; message: string }
  | { kind: 'authenticate' };

export interface TestCard {
  brand: 'visa' | 'mastercard';
  last4: string;
  funding: 'credit' | 'debit';
  country: string;
  outcome: CardOutcome;
}

const visa = (last4: string, outcome: CardOutcome): TestCard => ({
  brand: 'visa', last4, funding: 'credit', country: 'US', outcome,
});

const declined: CardOutcome = { kind: 'decline', declineCode: 'generic_decline', message: 'Your card was declined.' };
const insufficient: CardOutcome = {
  kind: 'decline', declineCode: 'insufficient_funds', message: 'Your card has insufficient funds.',
};

export const TEST_PAYMENT_METHODS: Readonly<Record<string, TestCard>> = {
  pm_card_visa: visa('4242', { kind: 'succeed' }),
  pm_card_mastercard: { brand: 'mastercard', last4: '4444', funding: 'credit', country: 'US', outcome: { kind: 'succeed' } },
  pm_card_visa_chargeDeclined: visa('0002', declined),
  pm_card_chargeDeclined: visa('0002', declined),
  pm_card_visa_chargeDeclinedInsufficientFunds: visa('9995', insufficient),
  pm_card_chargeDeclinedInsufficientFunds: visa('9995', insufficient),
  pm_card_authenticationRequired: visa('3184', { kind: 'authenticate' }),
};

export function testCard(id: string): TestCard | undefined {
  return Object.hasOwn(TEST_PAYMENT_METHODS, id) ? TEST_PAYMENT_METHODS[id] : undefined;
}
