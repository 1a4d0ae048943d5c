import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError } from './api-client';

/**
 * Puts a 400's field messages from the server beside the matching inputs and
 * focuses the first. Returns the message to show above the form for anything
 * that is not about one field (or null when every message found its field).
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  known: readonly string[],
): string | null {
  if (!isApiError(error)) return 'Something went wrong. Try again.';
  const entries = Object.entries(error.fields).filter(([name]) => known.includes(name));
  entries.forEach(([name, message], i) => setError(name as Path<T>, { type: 'server', message }, { shouldFocus: i === 0 }));
  if (entries.length > 0 && entries.length === Object.keys(error.fields).length) return null;
  return error.message;
}
