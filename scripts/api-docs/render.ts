import { z } from 'zod';
import { CAPABILITIES } from '../../src/shared/capabilities';
import { isRawResponse, isSchema, successStatus, type Endpoint } from '../../src/shared/contract/endpoint';
import type { ContractEntry } from '../../src/shared/contract/registry';

/**
 * The README's list of endpoints, written from the contract: method, path, who may call, what
 * it does, its query, body and response shapes, its success status and its other answers.
 * `npm run docs:api` writes it between the markers; a test fails when the README is stale.
 */

export const START = '<!-- api:start (written by npm run docs:api from src/shared/contract; do not edit by hand) -->';
export const END = '<!-- api:end -->';

interface JsonSchema {
  type?: string | string[];
  properties?: Record<string, JsonSchema>;
  required?: string[];
  items?: JsonSchema;
  anyOf?: JsonSchema[];
  enum?: unknown[];
  const?: unknown;
  format?: string;
  additionalProperties?: JsonSchema | boolean;
}

/** A JSON schema as a short TypeScript-like type: `{name, email?, lines: [{…}]}`. */
function typeText(s: JsonSchema, depth: number): string {
  if (s.anyOf) {
    const parts = s.anyOf.map((x) => typeText(x, depth));
    return [...new Set(parts)].join(' | ');
  }
  if (s.const !== undefined) return JSON.stringify(s.const);
  if (s.enum) return s.enum.map((v) => JSON.stringify(v)).join(' | ');
  const type = Array.isArray(s.type) ? s.type.join(' | ') : s.type;
  if (type === 'array') return `[${s.items ? typeText(s.items, depth) : '…'}]`;
  if (type === 'object') {
    const props = Object.entries(s.properties ?? {});
    if (props.length === 0) {
      if (s.additionalProperties && typeof s.additionalProperties === 'object') return `{[key]: ${typeText(s.additionalProperties, depth + 1)}}`;
      return '{}';
    }
    if (depth >= 3) return '{…}';
    const req = new Set(s.required ?? []);
    return `{${props.map(([k, v]) => `${k}${req.has(k) ? '' : '?'}: ${typeText(v, depth + 1)}`).join(', ')}}`;
  }
  if (type === 'string' && s.format === 'uuid') return 'uuid';
  return type ?? 'any';
}

function shape(schema: z.ZodType, io: 'input' | 'output'): string {
  return typeText(z.toJSONSchema(schema, { io, unrepresentable: 'any' }) as JsonSchema, 0);
}

function who(e: Endpoint): string {
  if (e.access === 'public') return 'anyone';
  if (e.access === 'signed-in') return 'any signed-in user';
  return `${CAPABILITIES[e.access].join(', ')} (\`${e.access}\`)`;
}

function line(e: Endpoint): string {
  const parts = [`- \`${e.method} ${e.path}\` — ${e.summary} *Who:* ${who(e)}.`];
  if (e.query) parts.push(`  Query: \`${shape(e.query, 'input')}\`.`);
  if (isSchema(e.body)) parts.push(`  Body: \`${shape(e.body, 'input')}\`.`);
  else if (e.body === 'multipart') parts.push('  Body: a multipart upload.');
  else if (e.body === 'raw') parts.push('  Body: the raw bytes, as signed.');
  const status = successStatus(e);
  if (e.response === null) parts.push(`  → ${status}, no body.`);
  else if (isRawResponse(e.response)) parts.push(`  → ${status} \`${e.response.raw}\`.`);
  else parts.push(`  → ${status} \`${shape(e.response, 'output')}\`.`);
  const errors = Object.entries(e.errors ?? {});
  if (errors.length > 0) parts.push(`  Also: ${errors.map(([code, why]) => `${code} ${why}`).join('; ')}.`);
  return parts.join('\n');
}

const TITLES: Record<string, string> = {
  auth: 'Sign-in and accounts', team: 'Team', sites: 'Sites', business: 'The business', system: 'Health and configuration',
  suppliers: 'Suppliers', costing: 'Costing', repricing: 'Repricing', purchasing: 'Purchasing', stock: 'Stock', books: 'Books',
};

const METHODS = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE'];

/** The whole generated section, markers included. */
export function renderApi(contract: readonly ContractEntry[]): string {
  const domains = [...new Set(contract.map((c) => c.domain))];
  const body = domains
    .map((d) => {
      const entries = contract.filter((c) => c.domain === d).sort((a, b) => a.endpoint.path.localeCompare(b.endpoint.path) || METHODS.indexOf(a.endpoint.method) - METHODS.indexOf(b.endpoint.method));
      return `#### ${TITLES[d] ?? d} (${entries.length})\n\n${entries.map((c) => line(c.endpoint)).join('\n')}`;
    })
    .join('\n\n');
  return `${START}\n\n${contract.length} endpoints. Shapes are written as TypeScript-like types: \`?\` marks an optional field, \`[…]\` a list; money and quantities are decimal strings.\n\n${body}\n\n${END}`;
}

/** The README with its generated section replaced (or an error when the markers are missing). */
export function withApi(readme: string, contract: readonly ContractEntry[]): string {
  const from = readme.indexOf(START);
  const to = readme.indexOf(END);
  if (from < 0 || to < from) throw new Error(`README.md has no ${START} … ${END} section`);
  return readme.slice(0, from) + renderApi(contract) + readme.slice(to + END.length);
}
