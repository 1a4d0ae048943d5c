import { missingParam, paramError } from './errors';

/**
 * Form-encoded parameters arrive as strings, arrays and nested objects (qs
 * parsing of `metadata[k]=v`, `expand[0]=x`). These helpers coerce them the way
 * the API does and answer its parameter errors.
 */
export type Params = Record<string, unknown>;

export function asParams(value: unknown): Params {
  return value && typeof value === 'object' && !Array.isArray(value) ? (value as Params) : {};
}

export function rejectUnknown(params: Params, allowed: readonly string[]): void {
  for (const name of Object.keys(params)) {
    if (!allowed.includes(name)) {
      throw paramError(
        `Received unknown parameter: ${name} (the local payments fake does not implement it)`,
        name,
        'parameter_unknown',
      );
    }
  }
}

export function optString(params: Params, name: string): string | undefined {
  const v = params[name];
  if (v === undefined) return undefined;
  if (typeof v !== 'string') throw paramError(`Invalid string: ${JSON.stringify(v)}`, name, 'parameter_invalid_string');
  return v;
}

export function reqString(params: Params, name: string): string {
  const v = optString(params, name);
  if (v === undefined || v === '') throw missingParam(name);
  return v;
}

/** Integers: only plain decimal digits with an optional sign, as the API parses them. */
export function optInt(params: Params, name: string): number | undefined {
  const v = params[name];
  if (v === undefined) return undefined;
  if (typeof v !== 'string' || !/^-?\d+$/.test(v) || !Number.isSafeInteger(Number(v))) {
    throw paramError(`Invalid integer: ${String(v)}`, name, 'parameter_invalid_integer');
  }
  return Number(v);
}

export function optBool(params: Params, name: string): boolean | undefined {
  const v = params[name];
  if (v === undefined) return undefined;
  if (v === 'true') return true;
  if (v === 'false') return false;
  throw paramError(`Invalid boolean: ${String(v)}`, name, 'parameter_invalid_boolean');
}

export function optEnum<T extends string>(params: Params, name: string, values: readonly T[]): T | undefined {
  const v = optString(params, name);
  if (v === undefined) return undefined;
  if (!(values as readonly string[]).includes(v)) {
    throw paramError(`Invalid ${name}: must be one of ${values.join(', ')}`, name, 'parameter_invalid_string');
  }
  return v as T;
}

export function optHash(params: Params, name: string): Params | undefined {
  const v = params[name];
  if (v === undefined || v === '') return undefined;
  if (typeof v !== 'object' || Array.isArray(v) || v === null) {
    throw paramError(`Invalid object`, name, 'parameter_invalid_object');
  }
  return v as Params;
}

export function optStringArray(params: Params, name: string): string[] | undefined {
  const v = params[name];
  if (v === undefined) return undefined;
  const list = Array.isArray(v) ? v : v && typeof v === 'object' ? Object.values(v) : [v];
  if (!list.every((x): x is string => typeof x === 'string')) {
    throw paramError(`Invalid array`, name, 'parameter_invalid_array');
  }
  return list;
}

export function expandList(params: Params): string[] {
  return optStringArray(params, 'expand') ?? [];
}

// Limits of the API's metadata (common practice of the API's docs, from memory):
// 50 keys, keys up to 40 characters, values up to 500 characters.
const METADATA_MAX_KEYS = 50;
const METADATA_MAX_KEY = 40;
const METADATA_MAX_VALUE = 500;

/**
 * Applies a `metadata` parameter to existing metadata: an empty string for the
 * whole hash clears it, an empty value removes that key.
 */
export function applyMetadata(current: Record<string, string>, params: Params): Record<string, string> {
  const v = params.metadata;
  if (v === undefined) return current;
  if (v === '') return {};
  if (typeof v !== 'object' || Array.isArray(v) || v === null) {
    throw paramError('Invalid object', 'metadata', 'parameter_invalid_object');
  }
  const next = { ...current };
  for (const [key, value] of Object.entries(v as Params)) {
    if (typeof value !== 'string') {
      throw paramError(`Invalid value for metadata[${key}]: must be a string`, `metadata[${key}]`, 'parameter_invalid_string');
    }
    if (key.length > METADATA_MAX_KEY) {
      throw paramError(`Metadata keys can have a maximum length of ${METADATA_MAX_KEY} characters.`, `metadata[${key}]`);
    }
    if (value.length > METADATA_MAX_VALUE) {
      throw paramError(`Metadata values can have a maximum length of ${METADATA_MAX_VALUE} characters.`, `metadata[${key}]`);
    }
    if (value === '') delete next[key];
    else next[key] = value;
  }
  if (Object.keys(next).length > METADATA_MAX_KEYS) {
    throw paramError(`You can have a maximum of ${METADATA_MAX_KEYS} metadata keys.`, 'metadata');
  }
  return next;
}
