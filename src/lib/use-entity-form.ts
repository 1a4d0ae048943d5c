import { useState } from 'react';
import { useForm, type DefaultValues, type FieldValues, type Path, type UseFormProps } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { isApiError } from './api-client';

interface EntityFormOptions<S extends z.ZodType<FieldValues, FieldValues>> extends Omit<UseFormProps<z.input<S>, unknown, z.output<S>>, 'resolver'> {
  schema: S;
  defaultValues?: DefaultValues<z.input<S>>;
  /** Saves the checked values (a create or a replace); its 400 field errors land on the fields. */
  save: (values: z.output<S>) => Promise<unknown>;
}

/**
 * A create-or-replace form: react-hook-form checked by the server's own zod schema, a save that
 * cannot be sent twice while it runs (Enter in a field), and the server's answer shown where it
 * belongs: each field message beside its field (the first focused), anything else above the form.
 */
export function useEntityForm<S extends z.ZodType<FieldValues, FieldValues>>({ schema, save, ...options }: EntityFormOptions<S>) {
  const form = useForm<z.input<S>, unknown, z.output<S>>({ ...options, resolver: zodResolver(schema as never) as never, shouldFocusError: true });
  const [formError, setFormError] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);

  const onSubmit = form.handleSubmit(async (values) => {
    if (saving) return;
    setFormError(null);
    setSaving(true);
    try {
      await save(values);
    } catch (err) {
      setFormError(showServerErrors(err, (name, message, focus) => form.setError(name as Path<z.input<S>>, { type: 'server', message }, { shouldFocus: focus }), Object.keys(form.getValues())));
    } finally {
      setSaving(false);
    }
  });

  return { ...form, onSubmit, formError, saving };
}

/**
 * Puts a 400's field messages beside the fields the form knows (a field or a path under it,
 * "lines[0].quantity"), focusing the first; answers what is left to show above the form.
 */
export function showServerErrors(error: unknown, setError: (name: string, message: string, focus: boolean) => void, known: readonly string[]): string | null {
  if (!isApiError(error)) return 'Something went wrong. Try again.';
  const fields = Object.entries(error.fields);
  const mine = fields.filter(([name]) => known.some((k) => name === k || name.startsWith(`${k}.`) || name.startsWith(`${k}[`)));
  mine.forEach(([name, message], i) => setError(name, message, i === 0));
  if (mine.length > 0 && mine.length === fields.length) return null;
  return error.message;
}
