// Creating a site or editing one: name, the code that starts every package reference,
// address, time zone (dates and times on the site's pages and returns use it) and the unit
// system of the site's documents (or each package's own), and the review's turnaround and margin
// before the lift (the due date of each submission). Rules from the shared SiteBody schema.
import { useForm } from 'react-hook-form';
import { readableResolver as zodResolver } from '@/lib/readable-resolver';
import type { z } from 'zod';
import { SiteBody } from '@shared/schemas/admin';
import { isApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { FormAlert, FormField, inputClasses } from '@/components/ui/form-field';
import { Spinner } from '@/components/ui/page-loading';
import { useCreateSite, useUpdateSite, type AdminSite } from '../api/sites';

type SiteForm = z.input<typeof SiteBody>;
const FIELDS = [
  'name',
  'code',
  'address',
  'timeZone',
  'unitSystem',
  'reviewTurnaroundDays',
  'reviewMarginDays',
] as const;

function browserTimeZone(): string {
  try {
    return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
  } catch {
    return 'UTC';
  }
}

export function SiteDialog({ site, onClose }: { site?: AdminSite; onClose: () => void }) {
  const create = useCreateSite();
  const update = useUpdateSite();
  const saving = site ? update : create;
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<SiteForm, unknown, z.output<typeof SiteBody>>({
    resolver: zodResolver(SiteBody),
    defaultValues: site
      ? {
          name: site.name,
          code: site.code,
          address: site.address,
          timeZone: site.timeZone,
          unitSystem: site.unitSystem,
          reviewTurnaroundDays: site.reviewTurnaroundDays,
          reviewMarginDays: site.reviewMarginDays,
        }
      : {
          name: '',
          code: '',
          address: '',
          timeZone: browserTimeZone(),
          unitSystem: null,
          reviewTurnaroundDays: 5,
          reviewMarginDays: 2,
        },
  });

  const onError = (error: Error) => {
    if (!isApiError(error)) return;
    if (error.code === 'code_taken' || (error.status === 409 && error.fields.length === 0)) {
      setError('code', { type: 'server', message: error.message });
      return;
    }
    for (const field of error.fields) {
      const name = FIELDS.find((known) => known === field.path);
      if (name) setError(name, { type: 'server', message: field.message });
    }
  };

  const onSubmit = handleSubmit((values) => {
    if (site) update.mutate({ id: site.id, body: values }, { onSuccess: onClose, onError });
    else create.mutate(values, { onSuccess: onClose, onError });
  });

  const failure = saving.error;
  const alert =
    failure &&
    (!isApiError(failure) ||
      (failure.status !== 409 && !failure.fields.some((field) => FIELDS.some((f) => f === field.path))))
      ? failure.message
      : null;

  return (
    <Dialog
      title={site ? `Edit ${site.name}` : 'New site'}
      description={
        site
          ? 'Changing the code does not rename packages already submitted.'
          : 'Add lift coordinators and adjust the review policy once the site exists.'
      }
      onClose={onClose}
    >
      <form
        onSubmit={onSubmit}
        noValidate
        aria-label={site ? 'Edit site' : 'New site'}
        className="flex flex-col gap-3.5"
      >
        {alert && <FormAlert>{alert}</FormAlert>}
        <FormField id="site-name" label="Site name" error={errors.name?.message}>
          <input type="text" autoComplete="off" className={inputClasses} {...register('name')} />
        </FormField>
        <div className="grid grid-cols-1 gap-3.5 sm:grid-cols-[160px_1fr]">
          <FormField
            id="site-code"
            label="Code"
            hint="Starts every package reference."
            error={errors.code?.message}
          >
            <input
              type="text"
              autoComplete="off"
              className={`${inputClasses} font-mono uppercase`}
              {...register('code')}
            />
          </FormField>
          <FormField
            id="site-time-zone"
            label="Time zone"
            hint="IANA name, e.g. Europe/London or America/Chicago."
            error={errors.timeZone?.message}
          >
            <input type="text" autoComplete="off" className={inputClasses} {...register('timeZone')} />
          </FormField>
        </div>
        <FormField id="site-address" label="Address" error={errors.address?.message}>
          <textarea rows={2} className={`${inputClasses} h-auto py-1.5`} {...register('address')} />
        </FormField>
        <FormField
          id="site-unit-system"
          label="Units of stamped returns"
          hint="Every stamped return and calculation sheet of the site's packages uses this unit system, whoever issues it."
          error={errors.unitSystem?.message}
        >
          <select
            className={inputClasses}
            {...register('unitSystem', { setValueAs: (v: string | null) => (v ? v : null) })}
          >
            <option value="">Each package's own (its contractor's when created)</option>
            <option value="metric">Metric (m, t, kN, kPa)</option>
            <option value="imperial">US customary (ft, lb, kip, psf)</option>
          </select>
        </FormField>
        <div className="grid grid-cols-2 gap-3">
          <FormField
            id="site-review-turnaround"
            label="Review turnaround (working days)"
            hint="From submission; Monday to Friday, public holidays not counted out."
            error={errors.reviewTurnaroundDays?.message}
          >
            <input
              type="number"
              min={1}
              max={60}
              className={inputClasses}
              {...register('reviewTurnaroundDays', { valueAsNumber: true })}
            />
          </FormField>
          <FormField
            id="site-review-margin"
            label="Done before the lift by (days)"
            hint="The review is due this many days before the planned lift, if that is sooner."
            error={errors.reviewMarginDays?.message}
          >
            <input
              type="number"
              min={0}
              max={30}
              className={inputClasses}
              {...register('reviewMarginDays', { valueAsNumber: true })}
            />
          </FormField>
        </div>
        <div className="mt-1 flex justify-end gap-2 border-t border-rule pt-3">
          <Button onClick={onClose}>Cancel</Button>
          <Button type="submit" variant="primary" disabled={saving.isPending}>
            {saving.isPending && <Spinner />}
            {saving.isPending ? 'Saving…' : site ? 'Save site' : 'Create site'}
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
