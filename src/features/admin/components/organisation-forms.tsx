// Adding an organisation (a lifting contractor or a site owner) and renaming one. Rules
// come from the shared OrganisationBody and OrganisationPatch schemas; a field the server
// refuses is shown under that field.
import { useForm } from 'react-hook-form';
import { readableResolver as zodResolver } from '@/lib/readable-resolver';
import type { z } from 'zod';
import { OrganisationBody, OrganisationPatch } from '@shared/schemas/admin';
import { isApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { FormAlert, FormField, inputClasses } from '@/components/ui/form-field';
import type { AdminOrganisation } from '@shared/schemas/admin';
import { useCreateOrganisation, useRenameOrganisation } from '../api/organisations';

type NewOrganisation = z.input<typeof OrganisationBody>;

export function NewOrganisationForm() {
  const create = useCreateOrganisation();
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm<NewOrganisation>({
    resolver: zodResolver(OrganisationBody),
    defaultValues: { name: '', kind: 'contractor' },
  });

  const onSubmit = handleSubmit((values) =>
    create.mutate(values, {
      onSuccess: () => reset({ name: '', kind: values.kind }),
      onError: (error) => {
        if (!isApiError(error)) return;
        // The kind is fixed here; any other refusal is the form's message below.
        const name = error.fields.find((field) => field.path === 'name');
        if (name) setError('name', { message: name.message });
        else if (error.status === 409) setError('name', { message: error.message });
      },
    }),
  );

  const failure = create.error;
  const alert =
    failure &&
    (!isApiError(failure) ||
      (failure.status !== 409 && !failure.fields.some((field) => field.path === 'name')))
      ? failure.message
      : null;

  return (
    <form
      onSubmit={onSubmit}
      noValidate
      aria-label="Add a lifting contractor"
      className="flex flex-col gap-3 border border-rule bg-sheet px-4 py-3"
    >
      <div>
        <h2 className="text-base font-bold">Add a lifting contractor</h2>
        <p className="text-[13px] text-ink-soft">
          Your own organisation is the site owner. Add each contractor that submits lift packages to your
          sites, then invite its lift planners.
        </p>
      </div>
      {alert && <FormAlert>{alert}</FormAlert>}
      <div className="flex flex-wrap items-start gap-2">
        <FormField id="org-name" label="Name" error={errors.name?.message} className="min-w-[200px] flex-1">
          <input type="text" autoComplete="organization" className={inputClasses} {...register('name')} />
        </FormField>
        <Button type="submit" variant="primary" disabled={create.isPending} className="mt-[25px]">
          {create.isPending ? 'Adding…' : 'Add contractor'}
        </Button>
      </div>
      {create.isSuccess && (
        <p role="status" className="text-[13px] font-bold text-pass-ink">
          {create.data.name} added. Invite its people from the People page.
        </p>
      )}
    </form>
  );
}

export function RenameOrganisationForm({
  organisation,
  onDone,
}: {
  organisation: AdminOrganisation;
  onDone: () => void;
}) {
  const rename = useRenameOrganisation();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<z.input<typeof OrganisationPatch>>({
    resolver: zodResolver(OrganisationPatch),
    defaultValues: { name: organisation.name },
  });

  const onSubmit = handleSubmit((values) =>
    rename.mutate(
      { id: organisation.id, body: values },
      {
        onSuccess: onDone,
        onError: (error) => {
          if (!isApiError(error)) return;
          setError('name', {
            message: error.fields.find((field) => field.path === 'name')?.message ?? error.message,
          });
        },
      },
    ),
  );

  return (
    <form
      onSubmit={onSubmit}
      noValidate
      aria-label={`Rename ${organisation.name}`}
      className="flex flex-wrap items-start gap-2"
      onKeyDown={(event) => event.key === 'Escape' && onDone()}
    >
      <div className="flex min-w-[240px] flex-1 flex-col gap-1">
        <input
          type="text"
          aria-label="New name"
          autoFocus
          aria-invalid={errors.name ? true : undefined}
          aria-describedby={errors.name ? `rename-${organisation.id}-error` : undefined}
          className={`${inputClasses} h-8`}
          {...register('name')}
        />
        {errors.name && (
          <p id={`rename-${organisation.id}-error`} className="text-[13px] font-bold text-failed-ink">
            {errors.name.message}
          </p>
        )}
      </div>
      <Button type="submit" size="sm" variant="primary" disabled={rename.isPending} className="h-8">
        Save
      </Button>
      <Button size="sm" onClick={onDone} className="h-8">
        Cancel
      </Button>
    </form>
  );
}
