// /packages/new: a contractor starts a lift package — title, site and planned lift date —
// and goes straight on to the submission editor.
import { useForm } from 'react-hook-form';
import { readableResolver as zodResolver } from '@/lib/readable-resolver';
import { Link, useNavigate } from 'react-router-dom';
import { z } from 'zod';
import { isApiError } from '@/lib/api-client';
import { PageHeader } from '@/components/layouts/page-header';
import { Button } from '@/components/ui/button';
import { PageLoading, Spinner } from '@/components/ui/page-loading';
import { ErrorPanel } from '@/components/ui/panel-message';
import { useSites } from '@/features/packages/api/get-sites';
import { useCreatePackage } from '@/features/packages/api/create-package';

const NewPackageForm = z.object({
  title: z
    .string()
    .trim()
    .min(3, 'The title must be at least 3 characters')
    .max(200, 'The title must be at most 200 characters'),
  siteId: z.string().min(1, 'Choose the site the lift is for'),
  plannedLiftDate: z.string(),
});
type NewPackageForm = z.infer<typeof NewPackageForm>;

const input =
  'h-9 w-full rounded-[3px] border border-rule-strong bg-sheet px-2.5 text-[14px] text-ink aria-[invalid=true]:border-2 aria-[invalid=true]:border-failed-ink';

export default function PackageNewRoute() {
  const navigate = useNavigate();
  const sites = useSites();
  const create = useCreatePackage();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<NewPackageForm>({
    resolver: zodResolver(NewPackageForm),
    mode: 'onTouched',
    defaultValues: { title: '', siteId: '', plannedLiftDate: '' },
  });

  const onSubmit = handleSubmit((values) => {
    create.mutate(
      { title: values.title, siteId: values.siteId, plannedLiftDate: values.plannedLiftDate || null },
      {
        onSuccess: (detail) => navigate(`/packages/${detail.package.id}/edit`),
        onError: (error) => {
          if (!isApiError(error)) return;
          for (const field of error.fields) {
            if (field.path === 'title' || field.path === 'siteId' || field.path === 'plannedLiftDate') {
              setError(field.path, { type: 'server', message: field.message });
            }
          }
        },
      },
    );
  });

  if (sites.isPending) return <PageLoading label="Loading your sites" />;
  if (sites.isError)
    return (
      <ErrorPanel
        title="The sites could not be loaded"
        message={isApiError(sites.error) ? sites.error.message : 'Try again in a moment.'}
      />
    );

  const serverMessage =
    create.error && (!isApiError(create.error) || create.error.fields.length === 0)
      ? isApiError(create.error)
        ? create.error.message
        : 'The package could not be created. Try again.'
      : null;

  return (
    <>
      <PageHeader
        title="New lift package"
        context="Name the lift and choose its site; the lift data comes next."
      />
      <form
        onSubmit={onSubmit}
        noValidate
        className="flex max-w-[40rem] flex-col gap-4 border border-rule bg-sheet px-5 py-4"
      >
        {serverMessage && (
          <p
            role="alert"
            className="border-l-4 border-failed-ink bg-failed-tint px-3 py-2 text-sm font-bold text-failed-ink"
          >
            {serverMessage}
          </p>
        )}
        <div className="flex flex-col gap-1">
          <label htmlFor="new-title" className="text-sm font-bold">
            Lift title
          </label>
          <input
            id="new-title"
            autoFocus
            placeholder="e.g. Set clarifier drive unit, tank 3"
            aria-invalid={errors.title ? true : undefined}
            aria-describedby={errors.title ? 'new-title-error' : undefined}
            className={input}
            {...register('title')}
          />
          {errors.title && (
            <p id="new-title-error" className="text-[13px] font-bold text-failed-ink">
              {errors.title.message}
            </p>
          )}
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor="new-site" className="text-sm font-bold">
            Site
          </label>
          <select
            id="new-site"
            aria-invalid={errors.siteId ? true : undefined}
            aria-describedby={errors.siteId ? 'new-site-error' : undefined}
            className={input}
            {...register('siteId')}
          >
            <option value="">Choose a site…</option>
            {sites.data.items.map((site) => (
              <option key={site.id} value={site.id}>
                {site.name} ({site.code}) — {site.owner}
              </option>
            ))}
          </select>
          {sites.data.items.length === 0 && (
            <p className="text-[13px] text-ink-soft">
              No site accepts packages from your organisation yet. Ask the site owner’s desk administrator.
            </p>
          )}
          {errors.siteId && (
            <p id="new-site-error" className="text-[13px] font-bold text-failed-ink">
              {errors.siteId.message}
            </p>
          )}
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor="new-date" className="text-sm font-bold">
            Planned lift date <span className="font-normal text-ink-soft">(optional)</span>
          </label>
          <input
            id="new-date"
            type="date"
            className={`${input} max-w-[12rem]`}
            {...register('plannedLiftDate')}
          />
        </div>
        <div className="flex gap-2">
          <Button type="submit" variant="primary" disabled={create.isPending}>
            {create.isPending && <Spinner />}
            {create.isPending ? 'Creating…' : 'Create and enter the lift data'}
          </Button>
          <Link
            to="/packages"
            className="inline-flex h-9 items-center px-3 text-sm font-bold text-verdigris underline"
          >
            Cancel
          </Link>
        </div>
      </form>
    </>
  );
}
