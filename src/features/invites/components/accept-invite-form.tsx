// Setting a password from an invitation link. The length rule comes from the shared
// AcceptInviteBody schema, so the form and the server name the same limit; the second
// entry is only checked here, to catch a typing slip before it locks the person out.
import { useForm } from 'react-hook-form';
import { readableResolver as zodResolver } from '@/lib/readable-resolver';
import { z } from 'zod';
import { AcceptInviteBody } from '@shared/schemas/admin';
import type { CurrentUser } from '@shared/schemas/auth';
import { isApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { FormAlert, FormField, inputClasses } from '@/components/ui/form-field';
import { Spinner } from '@/components/ui/page-loading';
import { useAcceptInvite } from '../api/invites';

const AcceptForm = AcceptInviteBody.extend({ confirm: z.string() }).refine(
  (values) => values.password === values.confirm,
  { path: ['confirm'], message: 'the two passwords are not the same' },
);
type AcceptForm = z.infer<typeof AcceptForm>;

export function AcceptInviteForm({
  token,
  email,
  onAccepted,
}: {
  token: string;
  email: string;
  onAccepted: (user: CurrentUser) => void;
}) {
  const accept = useAcceptInvite(token);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<AcceptForm>({
    resolver: zodResolver(AcceptForm),
    defaultValues: { password: '', confirm: '' },
  });

  const onSubmit = handleSubmit(({ password }) => {
    accept.mutate(
      { password },
      {
        onSuccess: ({ user }) => onAccepted(user),
        onError: (error) => {
          if (!isApiError(error)) return;
          for (const field of error.fields) {
            if (field.path === 'password') setError('password', { type: 'server', message: field.message });
          }
        },
      },
    );
  });

  const failure = accept.error;
  const alert =
    failure && (!isApiError(failure) || !failure.fields.some((field) => field.path === 'password'))
      ? isApiError(failure) && failure.status === 410
        ? 'This invitation link expired while the page was open. Ask your desk administrator to send a new one.'
        : failure.message
      : null;

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Set your password" className="flex flex-col gap-4">
      {alert && <FormAlert>{alert}</FormAlert>}
      {/* For password managers: the account the new password belongs to. */}
      <input type="hidden" name="username" autoComplete="username" value={email} readOnly />
      <FormField
        id="invite-password"
        label="New password"
        hint="At least 10 characters. A short sentence is easier to remember than symbols."
        error={errors.password?.message}
      >
        <input
          type="password"
          autoComplete="new-password"
          className={inputClasses}
          {...register('password')}
        />
      </FormField>
      <FormField id="invite-confirm" label="The same password again" error={errors.confirm?.message}>
        <input
          type="password"
          autoComplete="new-password"
          className={inputClasses}
          {...register('confirm')}
        />
      </FormField>
      <Button type="submit" variant="primary" disabled={accept.isPending} className="mt-1 h-10 w-full">
        {accept.isPending && <Spinner />}
        {accept.isPending ? 'Setting your password…' : 'Set password and sign in'}
      </Button>
    </form>
  );
}
