// Inviting a person: their e-mail, name, role and organisation. The server queues an
// e-mail with a one-time link to set a password and answers with the link, shown once. Rules come from the shared InviteBody
// schema; an address already in use (409 email_taken) is shown under the e-mail field.
import { useForm, useWatch } from 'react-hook-form';
import { readableResolver as zodResolver } from '@/lib/readable-resolver';
import type { z } from 'zod';
import { InviteBody } from '@shared/schemas/admin';
import { ROLES, type Role } from '@shared/schemas/common';
import { isApiError } from '@/lib/api-client';
import { ROLE_LABELS } from '@/lib/roles';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { FormAlert, FormField, inputClasses, selectClasses } from '@/components/ui/form-field';
import { Spinner } from '@/components/ui/page-loading';
import type { AdminOrganisation } from '@shared/schemas/admin';
import { useInvitePerson, type InvitedPerson } from '../api/people';
import { ORGANISATION_KIND_LABELS } from '../lib/labels';

type InviteForm = z.input<typeof InviteBody>;
const FIELDS = ['email', 'name', 'role', 'organisationId'] as const;

/** Contractors' people plan lifts; the site owner's people coordinate, review and run the desk. */
function rolesFor(organisation: AdminOrganisation | undefined): readonly Role[] {
  if (!organisation) return ROLES;
  return organisation.kind === 'contractor' ? ['contractor'] : ['reviewer', 'engineer', 'admin'];
}

export function InviteDialog({
  organisations,
  initialOrganisationId,
  onClose,
  onInvited,
}: {
  organisations: AdminOrganisation[];
  initialOrganisationId?: string;
  onClose: () => void;
  onInvited: (person: InvitedPerson) => void;
}) {
  const invite = useInvitePerson();
  // Most invitations are for the desk's own people: start with the owner organisation.
  const first =
    organisations.find((org) => org.id === initialOrganisationId) ??
    organisations.find((org) => org.kind === 'owner') ??
    organisations[0];
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    getValues,
    control,
    formState: { errors },
  } = useForm<InviteForm>({
    resolver: zodResolver(InviteBody),
    defaultValues: {
      email: '',
      name: '',
      organisationId: first?.id ?? '',
      role: rolesFor(first)[0],
    },
  });

  const organisationField = register('organisationId', {
    onChange: () => {
      const chosen = organisations.find((org) => org.id === getValues('organisationId'));
      const allowed = rolesFor(chosen);
      if (!allowed.includes(getValues('role'))) setValue('role', allowed[0]!);
    },
  });

  const organisationId = useWatch({ control, name: 'organisationId' });
  const allowedRoles = rolesFor(organisations.find((org) => org.id === organisationId));

  const onSubmit = handleSubmit((values) =>
    invite.mutate(values, {
      onSuccess: onInvited,
      onError: (error) => {
        if (!isApiError(error)) return;
        if (error.code === 'email_taken') {
          setError('email', { type: 'server', message: error.message });
          return;
        }
        for (const field of error.fields) {
          const name = FIELDS.find((known) => known === field.path);
          if (name) setError(name, { type: 'server', message: field.message });
        }
      },
    }),
  );

  const failure = invite.error;
  const alert =
    failure &&
    (!isApiError(failure) ||
      (failure.code !== 'email_taken' &&
        !failure.fields.some((field) => FIELDS.some((f) => f === field.path))))
      ? failure.message
      : null;

  return (
    <Dialog
      title="Invite a person"
      description="They receive an e-mail with a one-time link to set their password. The link expires; you can send a new one from the list."
      onClose={onClose}
    >
      <form onSubmit={onSubmit} noValidate aria-label="Invite a person" className="flex flex-col gap-3.5">
        {alert && <FormAlert>{alert}</FormAlert>}
        <FormField id="invite-email" label="Work e-mail" error={errors.email?.message}>
          <input type="email" autoComplete="off" className={inputClasses} {...register('email')} />
        </FormField>
        <FormField id="invite-name" label="Name" error={errors.name?.message}>
          <input type="text" autoComplete="off" className={inputClasses} {...register('name')} />
        </FormField>
        <div className="grid grid-cols-1 gap-3.5 sm:grid-cols-2">
          <FormField id="invite-organisation" label="Organisation" error={errors.organisationId?.message}>
            <select className={selectClasses} {...organisationField}>
              {organisations.map((org) => (
                <option key={org.id} value={org.id}>
                  {org.name} ({ORGANISATION_KIND_LABELS[org.kind].toLowerCase()})
                </option>
              ))}
            </select>
          </FormField>
          <FormField
            id="invite-role"
            label="Role"
            hint="Contractors' people plan lifts; the owner's people coordinate, review and run the desk."
            error={errors.role?.message}
          >
            <select className={selectClasses} {...register('role')}>
              {allowedRoles.map((role) => (
                <option key={role} value={role}>
                  {ROLE_LABELS[role]}
                </option>
              ))}
            </select>
          </FormField>
        </div>
        <div className="mt-1 flex justify-end gap-2 border-t border-rule pt-3">
          <Button onClick={onClose}>Cancel</Button>
          <Button type="submit" variant="primary" disabled={invite.isPending}>
            {invite.isPending && <Spinner />}
            {invite.isPending ? 'Sending…' : 'Send invitation'}
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
