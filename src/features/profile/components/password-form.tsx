// Changing one's own password: the current one first, then the new one twice. The
// length rule is the shared PasswordChangeBody schema's; a wrong current password is
// shown under that field.
import { useForm } from 'react-hook-form';
import { readableResolver as zodResolver } from '@/lib/readable-resolver';
import { z } from 'zod';
import { PasswordChangeBody } from '@shared/schemas/admin';
import { isApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { FormAlert, FormField, inputClasses } from '@/components/ui/form-field';
import { Spinner } from '@/components/ui/page-loading';
import { useChangePassword } from '../api/profile';

const PasswordForm = PasswordChangeBody.extend({ confirm: z.string() }).refine(
  (values) => values.newPassword === values.confirm,
  { path: ['confirm'], message: 'the two new passwords are not the same' },
);
type PasswordForm = z.infer<typeof PasswordForm>;

export function PasswordChangeForm({ email }: { email: string }) {
  const change = useChangePassword();
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm<PasswordForm>({
    resolver: zodResolver(PasswordForm),
    defaultValues: { currentPassword: '', newPassword: '', confirm: '' },
  });

  const onSubmit = handleSubmit(({ currentPassword, newPassword }) => {
    change.mutate(
      { currentPassword, newPassword },
      {
        onSuccess: () => reset(),
        onError: (error) => {
          if (!isApiError(error)) return;
          if (error.code === 'wrong_password') {
            setError('currentPassword', { type: 'server', message: error.message });
            return;
          }
          for (const field of error.fields) {
            if (field.path === 'currentPassword' || field.path === 'newPassword') {
              setError(field.path, { type: 'server', message: field.message });
            }
          }
        },
      },
    );
  });

  const failure = change.error;
  const alert =
    failure && (!isApiError(failure) || (failure.code !== 'wrong_password' && failure.fields.length === 0))
      ? failure.message
      : null;

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Change password" className="flex flex-col gap-4">
      {alert && <FormAlert>{alert}</FormAlert>}
      <input type="hidden" name="username" autoComplete="username" value={email} readOnly />
      <FormField id="current-password" label="Current password" error={errors.currentPassword?.message}>
        <input
          type="password"
          autoComplete="current-password"
          className={inputClasses}
          {...register('currentPassword')}
        />
      </FormField>
      <FormField
        id="new-password"
        label="New password"
        hint="At least 10 characters."
        error={errors.newPassword?.message}
      >
        <input
          type="password"
          autoComplete="new-password"
          className={inputClasses}
          {...register('newPassword')}
        />
      </FormField>
      <FormField id="confirm-password" label="New password again" error={errors.confirm?.message}>
        <input
          type="password"
          autoComplete="new-password"
          className={inputClasses}
          {...register('confirm')}
        />
      </FormField>
      <div className="flex items-center gap-3">
        <Button type="submit" variant="secondary" disabled={change.isPending}>
          {change.isPending && <Spinner />}
          {change.isPending ? 'Changing…' : 'Change password'}
        </Button>
        {change.isSuccess && (
          <p role="status" className="text-[13px] font-bold text-pass-ink">
            Password changed. Other browsers stay signed in until their session ends.
          </p>
        )}
      </div>
    </form>
  );
}
