import type { Endpoint } from './endpoint';
import * as suppliers from './suppliers';

/**
 * Every endpoint of the API, by domain. The server mounts each; the route table, the
 * hostile-input walk and the README's API section are read from this list.
 */
export const DOMAINS = {
  suppliers,
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
