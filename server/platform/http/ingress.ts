import type { NextFunction, Request, Response } from 'express';
import { formatFieldPath } from '../../../src/shared/schemas/field-errors';
import { CONTROL_MESSAGE, hasControlCharacters } from '../../../src/shared/schemas/fields';
import { invalidInput } from '../errors';

/** Deeper than any body the API takes: a request nested further is not a café's data. */
export const MAX_DEPTH = 12;
const FORBIDDEN_KEYS = new Set(['__proto__', 'constructor', 'prototype']);

/**
 * The first thing every JSON body and query string meets: text with control characters (a NUL
 * byte, which PostgreSQL refuses, or a text-direction override), keys that name an object's
 * prototype and nesting deeper than any real request are refused with 400 `invalid_input`
 * naming the field, before any schema or service sees them. The schemas check the same for
 * the fields they know; this net catches what they do not (an unknown key, a query parameter).
 */
export function refuseHostileInput(req: Request, _res: Response, next: NextFunction) {
  const fields: Record<string, string> = {};
  const walk = (value: unknown, path: (string | number)[]): void => {
    if (Object.keys(fields).length > 0) return;
    if (path.length > MAX_DEPTH) {
      fields[formatFieldPath(path)] = 'This is nested too deeply.';
      return;
    }
    if (typeof value === 'string') {
      if (hasControlCharacters(value)) fields[formatFieldPath(path)] = CONTROL_MESSAGE;
      return;
    }
    if (Array.isArray(value)) {
      value.forEach((v, i) => walk(v, [...path, i]));
      return;
    }
    if (value !== null && typeof value === 'object') {
      for (const key of Object.keys(value)) {
        if (FORBIDDEN_KEYS.has(key) || hasControlCharacters(key)) {
          fields[formatFieldPath([...path, key])] = 'This field is not accepted.';
          return;
        }
        walk((value as Record<string, unknown>)[key], [...path, key]);
      }
    }
  };
  walk(req.body, []);
  walk(req.query, []);
  if (Object.keys(fields).length > 0) return next(invalidInput(fields));
  next();
}
