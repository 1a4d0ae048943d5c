import type Stripe from 'stripe';
import { noSuchParam } from '../errors';
import type { Account } from '../state';

/** A customer named in a parameter: 400 resource_missing when absent (404 is for ids in the URL). */
export function findCustomer(account: Account, id: string, param: string): Stripe.Customer {
  const customer = account.customers.get(id);
  if (!customer) throw noSuchParam('customer', id, param);
  return customer;
}
