import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input, Select } from '../../../components/ui/input';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import { ROLE_LABELS as roleLabels, ROLES as roles } from '../../../shared/capabilities';
import { applyServerErrors } from '../../../lib/form-errors';
import { useInviteMember } from '../api/invite-member';
import { inviteSchema } from '../schemas';

type Schema = typeof inviteSchema;

const roleHints: Record<(typeof roles)[number], string> = {
  owner: 'everything, including the team and settings',
  manager: 'menus, costs, suppliers, orders and stock',
  barista: 'recipe cards and stock counts, on a phone',
  bookkeeper: 'sales, cost of goods and month-end figures',
};

export function InviteForm() {
  const invite = useInviteMember();
  const { notify } = useToast();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, formState: { errors } } = useForm<z.input<Schema>, unknown, z.output<Schema>>({
    resolver: zodResolver(inviteSchema),
    defaultValues: { email: '', role: 'barista' },
  });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    invite.mutate({ body: values }, {
      onSuccess: () => {
        reset({ email: '', role: values.role });
        notify(`Invitation sent to ${values.email}.`);
      },
      onError: (err) => {
        if (isApiError(err) && err.status === 409)
          setError('email', { type: 'server', message: err.message || 'This person is already in the team or already invited.' }, { shouldFocus: true });
        else setFormError(applyServerErrors(err, setError, ['email', 'role']));
      },
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <FormMessage>{formError}</FormMessage>
      <div className="grid items-start gap-4 sm:grid-cols-[1fr_14rem_auto]">
        <Field label="E-mail" error={errors.email?.message}>
          <Input type="email" autoComplete="off" {...register('email')} />
        </Field>
        <Field label="Role" error={errors.role?.message}>
          <Select {...register('role')}>
            {roles.map((r) => (
              <option key={r} value={r}>
                {roleLabels[r]}
              </option>
            ))}
          </Select>
        </Field>
        <Button type="submit" busy={invite.isPending} className="sm:mt-6">
          Send invitation
        </Button>
      </div>
      <ul className="grid gap-1 text-sm text-muted sm:grid-cols-2">
        {roles.map((r) => (
          <li key={r}>
            <span className="font-medium text-ink">{roleLabels[r]}</span>: {roleHints[r]}
          </li>
        ))}
      </ul>
    </form>
  );
}
