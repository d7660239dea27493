// The person's own settings: name, the unit system every page shows figures in, and
// whether to receive the daily lift-date reminder. Hand-off messages (submitted,
// assigned, returned, resubmitted) always go out: a review cannot wait on a muted inbox.
import { useForm } from 'react-hook-form';
import { readableResolver as zodResolver } from '@/lib/readable-resolver';
import { z } from 'zod';
import { ProfilePatch } from '@shared/schemas/admin';
import { isApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { FormAlert, FormField, inputClasses } from '@/components/ui/form-field';
import { Spinner } from '@/components/ui/page-loading';
import type { Profile } from '@shared/schemas/admin';
import { useUpdateProfile } from '../api/profile';

const ProfileForm = ProfilePatch.required();
type ProfileForm = z.infer<typeof ProfileForm>;

const UNIT_CHOICES = [
  { value: 'metric', label: 'Metric', example: 'm, kg, t, kN, kPa' },
  { value: 'imperial', label: 'US customary', example: 'ft, lb, kip, psf' },
] as const;

export function ProfileSettingsForm({ profile }: { profile: Profile }) {
  const update = useUpdateProfile();
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, dirtyFields, isDirty },
  } = useForm<ProfileForm>({
    resolver: zodResolver(ProfileForm),
    values: { name: profile.name, unitSystem: profile.unitSystem, notifyReminders: profile.notifyReminders },
  });

  const onSubmit = handleSubmit((values) => {
    // Only what changed, so a stale tab cannot put back an old name or unit choice.
    const body: z.output<typeof ProfilePatch> = {};
    if (dirtyFields.name) body.name = values.name;
    if (dirtyFields.unitSystem) body.unitSystem = values.unitSystem;
    if (dirtyFields.notifyReminders) body.notifyReminders = values.notifyReminders;
    update.mutate(body, {
      onSuccess: (saved) => reset(saved),
      onError: (error) => {
        if (!isApiError(error)) return;
        for (const field of error.fields) {
          if (field.path === 'name' || field.path === 'unitSystem' || field.path === 'notifyReminders') {
            setError(field.path, { type: 'server', message: field.message });
          }
        }
      },
    });
  });

  const failure = update.error;
  const alert = failure && (!isApiError(failure) || failure.fields.length === 0) ? failure.message : null;

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Your settings" className="flex flex-col gap-4">
      {alert && <FormAlert>{alert}</FormAlert>}
      <FormField
        id="profile-name"
        label="Name"
        hint="As it appears on findings and stamped returns."
        error={errors.name?.message}
      >
        <input type="text" autoComplete="name" className={inputClasses} {...register('name')} />
      </FormField>
      <FormField
        id="profile-email"
        label="E-mail"
        hint="Your sign-in. Ask the desk administrator to change it."
      >
        <input
          type="email"
          value={profile.email}
          readOnly
          className={`${inputClasses} bg-sheet-alt text-ink-soft`}
        />
      </FormField>

      <fieldset className="flex flex-col gap-1.5">
        <legend className="mb-1 text-[13.5px] font-bold">Units</legend>
        <div className="grid grid-cols-2 gap-2">
          {UNIT_CHOICES.map((choice) => (
            <label
              key={choice.value}
              className="flex cursor-pointer items-start gap-2 border border-rule-strong bg-sheet px-3 py-2 has-[:checked]:border-2 has-[:checked]:border-verdigris has-[:checked]:bg-verdigris-tint"
            >
              <input
                type="radio"
                value={choice.value}
                className="mt-1 accent-verdigris"
                {...register('unitSystem')}
              />
              <span>
                <span className="block text-sm font-bold">{choice.label}</span>
                <span className="block text-[12.5px] text-ink-soft">{choice.example}</span>
              </span>
            </label>
          ))}
        </div>
        <p className="text-[12.5px] text-ink-soft">
          Every page shows figures in these units. Counterpoise stores SI values, so switching changes only
          how they are shown.
        </p>
      </fieldset>

      <fieldset className="flex flex-col gap-1.5">
        <legend className="mb-1 text-[13.5px] font-bold">E-mail</legend>
        <label className="flex items-start gap-2 text-sm">
          <input type="checkbox" className="mt-1 accent-verdigris" {...register('notifyReminders')} />
          <span>
            <span className="font-bold">Daily reminder</span> of packages whose planned lift date is near and
            that are not yet accepted
          </span>
        </label>
        <p className="text-[12.5px] text-ink-soft">
          Hand-off messages — package submitted, engineer assigned, decision recorded, decision returned,
          finding answered, package resubmitted — always go out and cannot be turned off: the next person in a
          review depends on them.
        </p>
      </fieldset>

      <div className="flex items-center gap-3">
        <Button type="submit" variant="primary" disabled={update.isPending || !isDirty}>
          {update.isPending && <Spinner />}
          {update.isPending ? 'Saving…' : 'Save settings'}
        </Button>
        {update.isSuccess && !isDirty && (
          <p role="status" className="text-[13px] font-bold text-pass-ink">
            Saved.
          </p>
        )}
      </div>
    </form>
  );
}
