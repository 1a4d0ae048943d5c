import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { Button } from '../../../components/ui/button';
import { ErrorState } from '../../../components/ui/error-state';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input } from '../../../components/ui/input';
import { SkeletonRows } from '../../../components/ui/skeleton';
import { isApiError } from '../../../lib/api-client';
import { ROLE_LABELS as roleLabels } from '../../../shared/capabilities';
import { applyServerErrors } from '../../../lib/form-errors';
import { useAcceptInvitation } from '../api/accept-invitation';
import { useInvitation } from '../api/get-invitation';
import { acceptInvitationSchema } from '../schemas';

type Schema = typeof acceptInvitationSchema;

export function AcceptInvitationForm({ token, onJoined }: { token: string; onJoined: () => void }) {
  const invitation = useInvitation(token);
  const accept = useAcceptInvitation();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState: { errors } } = useForm<z.input<Schema>, unknown, z.output<Schema>>({
    resolver: zodResolver(acceptInvitationSchema),
    defaultValues: { name: '', password: '' },
  });

  if (!token || (invitation.isError && isApiError(invitation.error) && invitation.error.status === 404))
    return (
      <FormMessage>
        This invitation link is not valid any more: it may have expired, been withdrawn or already been used. Ask the person who invited you to
        send a new one.
      </FormMessage>
    );
  if (invitation.isPending) return <SkeletonRows rows={3} label="Reading the invitation" />;
  if (invitation.isError) return <ErrorState error={invitation.error} onRetry={() => invitation.refetch()} />;

  const { email, role, businessName } = invitation.data;
  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    accept.mutate(
      { params: { token }, body: values },
      { onSuccess: onJoined, onError: (err) => setFormError(applyServerErrors(err, setError, ['name', 'password'])) },
    );
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <p className="text-ink">
        You have been invited to join <strong>{businessName}</strong> as <strong>{roleLabels[role].toLowerCase()}</strong>. Your account will
        use <strong>{email}</strong>.
      </p>
      <FormMessage>{formError}</FormMessage>
      <Field label="Your name" error={errors.name?.message}>
        <Input autoComplete="name" autoFocus {...register('name')} />
      </Field>
      <Field label="Choose a password" hint="At least 10 characters." error={errors.password?.message}>
        <Input type="password" autoComplete="new-password" {...register('password')} />
      </Field>
      <Button type="submit" busy={accept.isPending} size="lg">
        Join {businessName}
      </Button>
    </form>
  );
}
