import type { Endpoint } from './endpoint';
import * as auth from './auth';
import * as team from './team';
import * as sites from './sites';
import * as business from './business';
import * as system from './system';
import * as suppliers from './suppliers';
import * as costing from './costing';
import * as repricing from './repricing';
import * as purchasing from './purchasing';
import * as stock from './stock';
import * as books from './books';

/**
 * Every endpoint of the API, by domain. The server mounts each; the route table, the
 * hostile-input walk and the README's API section are read from this list.
 */
export const DOMAINS = {
  auth,
  team,
  sites,
  business,
  system,
  suppliers,
  costing,
  repricing,
  purchasing,
  stock,
  books,
} as const;

function isEndpoint(x: unknown): x is Endpoint {
  return typeof x === 'object' && x !== null && 'method' in x && 'path' in x && 'access' in x && 'response' in x;
}

export interface ContractEntry {
  domain: string;
  name: string;
  endpoint: Endpoint;
}

export const CONTRACT: readonly ContractEntry[] = Object.entries(DOMAINS).flatMap(([domain, mod]) =>
  Object.entries(mod)
    .filter(([, v]) => isEndpoint(v))
    .map(([name, v]) => ({ domain, name, endpoint: v as Endpoint })),
);

/** `GET /api/suppliers/:id` */
export const routeKey = (e: Pick<Endpoint, 'method' | 'path'>) => `${e.method} ${e.path}`;
