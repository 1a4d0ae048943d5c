import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input } from '../../../components/ui/input';
import { SkeletonRows } from '../../../components/ui/skeleton';
import { useToast } from '../../../components/ui/toast';
import { type Site } from '../../../shared/contract/sites';
import { applyServerErrors } from '../../../lib/form-errors';
import { useCreateSite } from '../api/create-site';
import { useSites } from '../api/get-sites';
import { useRenameSite } from '../api/rename-site';
import { siteNameSchema } from '../schemas';

type Schema = typeof siteNameSchema;

/** One line of the sites list, with its name editable in place. */
function SiteRow({ site }: { site: Site }) {
  const rename = useRenameSite();
  const { notify } = useToast();
  const [editing, setEditing] = useState(false);
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, formState: { errors } } = useForm<z.input<Schema>, unknown, z.output<Schema>>({
    resolver: zodResolver(siteNameSchema),
    values: { name: site.name },
  });

  if (!editing)
    return (
      <li className="flex items-center justify-between gap-4 border-t border-rule py-3 first:border-t-0">
        <span className="font-medium text-ink">{site.name}</span>
        <Button variant="secondary" size="sm" onClick={() => setEditing(true)}>
          Rename<span className="sr-only"> {site.name}</span>
        </Button>
      </li>
    );

  const onSubmit = handleSubmit(({ name }) => {
    setFormError(null);
    rename.mutate(
      { params: { id: site.id }, body: { name } },
      {
        onSuccess: () => {
          setEditing(false);
          notify('Site renamed.');
        },
        onError: (err) => setFormError(applyServerErrors(err, setError, ['name'])),
      },
    );
  });

  return (
    <li className="border-t border-rule py-3 first:border-t-0">
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-2">
        <FormMessage>{formError}</FormMessage>
        <div className="flex flex-wrap items-start gap-2">
          <Field label={`New name for ${site.name}`} error={errors.name?.message} className="min-w-48 flex-1">
            <Input autoFocus {...register('name')} />
          </Field>
          <div className="flex gap-2 sm:mt-6">
            <Button type="submit" size="md" busy={rename.isPending}>
              Save
            </Button>
            <Button
              variant="secondary"
              onClick={() => {
                reset();
                setEditing(false);
              }}
            >
              Cancel
            </Button>
          </div>
        </div>
      </form>
    </li>
  );
}

export function SitesEditor() {
  const sites = useSites();
  const create = useCreateSite();
  const { notify } = useToast();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, formState: { errors } } = useForm<z.input<Schema>, unknown, z.output<Schema>>({
    resolver: zodResolver(siteNameSchema),
    defaultValues: { name: '' },
  });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    create.mutate({ body: values }, {
      onSuccess: ({ site }) => {
        reset({ name: '' });
        notify(`${site.name} added.`);
      },
      onError: (err) => setFormError(applyServerErrors(err, setError, ['name'])),
    });
  });

  return (
    <div className="flex flex-col gap-4">
      {sites.isPending ? (
        <SkeletonRows rows={2} label="Loading sites" />
      ) : sites.isError ? (
        <ErrorState error={sites.error} onRetry={() => sites.refetch()} />
      ) : sites.data.sites.length === 0 ? (
        <EmptyState title="No sites yet" next="Add the café or kiosk where you trade with the form below." />
      ) : (
        <ul className="rounded-lg border border-rule bg-card px-4">
          {sites.data.sites.map((s) => (
            <SiteRow key={s.id} site={s} />
          ))}
        </ul>
      )}
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-2">
        <FormMessage>{formError}</FormMessage>
        <div className="flex flex-wrap items-start gap-2">
          <Field label="Add a site" hint="A café, kiosk or cart with its own stock." error={errors.name?.message} className="min-w-48 flex-1">
            <Input placeholder="e.g. Station kiosk" {...register('name')} />
          </Field>
          <Button type="submit" busy={create.isPending} className="sm:mt-11">
            Add site
          </Button>
        </div>
      </form>
    </div>
  );
}
