import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { EmptyState } from '../../../components/ui/empty-state';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input } from '../../../components/ui/input';
import { Table, Td, Th, THead } from '../../../components/ui/table';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import { formatQuantity } from '../../../lib/format';
import { applyServerErrors } from '../../../lib/form-errors';
import { useCreateSize, useDeleteSize, useUpdateSize } from '../api/mutations';
import type { CupSize } from '../../../shared/contract/costing';
import { sizeFormSchema } from '../schemas';

type Values = z.input<typeof sizeFormSchema>;

function SizeForm({ size, onDone, nextPosition }: { size?: CupSize; onDone?: () => void; nextPosition: number }) {
  const create = useCreateSize();
  const update = useUpdateSize();
  const { notify } = useToast();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, formState: { errors } } = useForm<Values>({
    resolver: zodResolver(sizeFormSchema),
    defaultValues: { name: size?.name ?? '', volumeMl: size?.volumeMl ?? '' },
  });
  const onSubmit = handleSubmit(async (v) => {
    setFormError(null);
    try {
      if (size) await update.mutateAsync({ params: { id: size.id }, body: v });
      else await create.mutateAsync({ body: { ...v, position: nextPosition } });
      notify(`${v.name} saved.`);
      reset({ name: '', volumeMl: '' });
      onDone?.();
    } catch (err) {
      if (isApiError(err) && err.code === 'name_taken') setError('name', { type: 'server', message: 'You already have a cup size with that name.' }, { shouldFocus: true });
      else setFormError(applyServerErrors(err, setError, ['name', 'volumeMl']));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-2">
      <FormMessage>{formError}</FormMessage>
      <div className="grid items-start gap-3 sm:grid-cols-[1fr_10rem_auto]">
        <Field label={size ? `Name of ${size.name}` : 'New cup size'} error={errors.name?.message}>
          <Input autoComplete="off" placeholder="e.g. Regular" {...register('name')} />
        </Field>
        <Field label="Holds" unit="ml" error={errors.volumeMl?.message}>
          <Input inputMode="decimal" autoComplete="off" {...register('volumeMl')} />
        </Field>
        <div className="flex gap-2 sm:mt-6">
          <Button type="submit" busy={create.isPending || update.isPending}>
            {size ? 'Save' : 'Add cup size'}
          </Button>
          {onDone && size && (
            <Button variant="secondary" onClick={onDone}>
              Cancel
            </Button>
          )}
        </div>
      </div>
    </form>
  );
}

/** The business's own ladder of cup sizes: names of its choosing and what each holds. */
export function CupSizesEditor({ sizes, canEdit }: { sizes: CupSize[]; canEdit: boolean }) {
  const [editing, setEditing] = useState<string | null>(null);
  const [removing, setRemoving] = useState<CupSize | null>(null);
  const remove = useDeleteSize();
  const { notify } = useToast();
  const nextPosition = Math.max(0, ...sizes.map((s) => s.position)) + 1;
  return (
    <div className="flex flex-col gap-4">
      {sizes.length === 0 ? (
        <EmptyState title="No cup sizes yet" next="Add the cups you serve, smallest first, e.g. Small 227 ml, Regular 341 ml, Large 455 ml." />
      ) : (
        <Table caption="Cup sizes">
          <THead>
            <tr>
              <Th>Cup size</Th>
              <Th figure>Holds</Th>
              <th scope="col" className="px-3 py-2">
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          </THead>
          <tbody>
            {sizes.map((s) =>
              editing === s.id ? (
                <tr key={s.id}>
                  <Td colSpan={3}>
                    <SizeForm size={s} nextPosition={nextPosition} onDone={() => setEditing(null)} />
                  </Td>
                </tr>
              ) : (
                <tr key={s.id}>
                  <Td className="font-medium">{s.name}</Td>
                  <Td figure>{formatQuantity(s.volumeMl, 'ml')}</Td>
                  <Td className="text-right">
                    {canEdit && (
                      <span className="inline-flex gap-2">
                        <Button variant="secondary" size="sm" onClick={() => setEditing(s.id)}>
                          Edit<span className="sr-only"> {s.name}</span>
                        </Button>
                        <Button variant="secondary" size="sm" onClick={() => setRemoving(s)}>
                          Remove<span className="sr-only"> {s.name}</span>
                        </Button>
                      </span>
                    )}
                  </Td>
                </tr>
              ),
            )}
          </tbody>
        </Table>
      )}
      {canEdit && <SizeForm nextPosition={nextPosition} />}
      <ConfirmDialog
        open={removing !== null}
        title={`Remove the ${removing?.name ?? ''} size?`}
        consequence={<p>Drinks can no longer be built or priced in this size. A size that a drink still offers cannot be removed: take it off those drinks first.</p>}
        confirmLabel="Remove cup size"
        busy={remove.isPending}
        error={remove.isError ? (isApiError(remove.error) && remove.error.code === 'in_use' ? 'Some drinks still offer this size. Take it off those drinks first.' : remove.error.message) : undefined}
        onCancel={() => {
          remove.reset();
          setRemoving(null);
        }}
        onConfirm={() => {
          if (!removing) return;
          const name = removing.name;
          remove.mutate({ params: { id: removing.id } }, {
            onSuccess: () => {
              setRemoving(null);
              notify(`${name} removed.`);
            },
          });
        }}
      />
    </div>
  );
}
