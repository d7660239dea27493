// The sign-in form. Field rules come from the shared SignInBody schema, so the browser
// and the server explain the same mistakes the same way; a wrong password gets only the
// server's one generic message.
import { useForm } from 'react-hook-form';
import { readableResolver as zodResolver } from '@/lib/readable-resolver';
import { SignInBody } from '@shared/schemas/auth';
import type { CurrentUser } from '@shared/schemas/auth';
import { useSignIn } from '@/lib/auth';
import { isApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Spinner } from '@/components/ui/page-loading';

const inputClasses =
  'h-10 w-full rounded-[3px] border border-rule-strong bg-sheet px-3 text-[15px] text-ink placeholder:text-ink-soft/80 aria-[invalid=true]:border-failed-ink aria-[invalid=true]:border-2';

export function SignInForm({ onSignedIn }: { onSignedIn: (user: CurrentUser) => void }) {
  const signIn = useSignIn();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<SignInBody>({ resolver: zodResolver(SignInBody), defaultValues: { email: '', password: '' } });

  const onSubmit = handleSubmit((values) => {
    signIn.mutate(values, {
      onSuccess: ({ user }) => onSignedIn(user),
      onError: (error) => {
        if (!isApiError(error)) return;
        for (const field of error.fields) {
          if (field.path === 'email' || field.path === 'password') {
            setError(field.path, { type: 'server', message: field.message });
          }
        }
      },
    });
  });

  const serverError = signIn.error;
  const serverMessage =
    serverError && (!isApiError(serverError) || serverError.fields.length === 0)
      ? serverError.message || 'Sign-in failed. Try again.'
      : null;

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Sign in" className="flex flex-col gap-4">
      {serverMessage && (
        <div
          role="alert"
          className="border-l-4 border-failed-ink bg-failed-tint px-3 py-2 text-sm font-bold text-failed-ink"
        >
          {serverMessage}
        </div>
      )}
      <div className="flex flex-col gap-1">
        <label htmlFor="email" className="text-sm font-bold">
          Work e-mail
        </label>
        <input
          id="email"
          type="email"
          autoComplete="username"
          autoFocus
          aria-invalid={errors.email ? true : undefined}
          aria-describedby={errors.email ? 'email-error' : undefined}
          className={inputClasses}
          {...register('email')}
        />
        {errors.email && (
          <p id="email-error" className="text-[13px] font-bold text-failed-ink">
            {errors.email.message}
          </p>
        )}
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor="password" className="text-sm font-bold">
          Password
        </label>
        <input
          id="password"
          type="password"
          autoComplete="current-password"
          aria-invalid={errors.password ? true : undefined}
          aria-describedby={errors.password ? 'password-error' : undefined}
          className={inputClasses}
          {...register('password')}
        />
        {errors.password && (
          <p id="password-error" className="text-[13px] font-bold text-failed-ink">
            {errors.password.message}
          </p>
        )}
      </div>
      <Button type="submit" variant="primary" disabled={signIn.isPending} className="mt-1 h-10 w-full">
        {signIn.isPending && <Spinner />}
        {signIn.isPending ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
