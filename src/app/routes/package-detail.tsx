// /packages/:id: the package for every role (read-only but for the contractor's draft
// actions): its facts, the check run live while it runs, the recomputed results with the
// discrepancies first, the plots, the files and the revision history.
import { actionAllowed } from '@shared/rules/package-status';
import { readStoredResult } from '@shared/engineering/stored-result';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { homeFor, useCurrentUser } from '@/lib/auth';
import { isApiError } from '@/lib/api-client';
import { PageHeader } from '@/components/layouts/page-header';
import { EmptyState, ErrorPanel } from '@/components/ui/panel-message';
import { PageLoading } from '@/components/ui/page-loading';
import { Button, buttonClasses } from '@/components/ui/button';
import { usePackage } from '@/features/packages/api/get-package';
import { useDuplicatePackage } from '@/features/packages/api/duplicate-package';
import { PackageHeading } from '@/features/packages/components/package-heading';
import { CheckProgress } from '@/features/packages/components/detail/check-progress';
import { RevisionTimeline } from '@/features/packages/components/detail/revision-timeline';
import { PackageResults } from '@/features/packages/components/detail/package-results';
import { DeleteDraftButton } from '@/features/packages/components/detail/delete-draft-button';
import { DecisionPanel } from '@/features/returns/components/decision-panel';
import { AssignPanel } from '@/features/review-desk/components/assign-panel';
import { FileRow } from '@/features/packages/components/editor/documents-step';
import { DocumentUnits } from '@/features/packages/components/detail/document-units';
import { ReturnsPanel } from '@/features/returns/components/returns-panel';
import { ResubmissionPanel } from '@/features/returns/components/resubmission-panel';
import { LibraryUsesPanel } from '@/features/library/components/library-uses-panel';

export default function PackageDetailRoute() {
  const { id = '' } = useParams();
  const navigate = useNavigate();
  const { data: user } = useCurrentUser();
  const detail = usePackage(id);
  const duplicate = useDuplicatePackage();
  if (!user) return null;

  const back = (
    <Link to={homeFor(user)} className="font-bold text-verdigris underline underline-offset-2">
      Back to your list
    </Link>
  );

  if (detail.isPending) return <PageLoading label="Loading the package" />;
  if (detail.isError) {
    const notFound = isApiError(detail.error) && (detail.error.status === 404 || detail.error.status === 400);
    return (
      <>
        <PageHeader title="Lift package" />
        <ErrorPanel
          title={notFound ? 'No such package in your list' : 'The package could not be loaded'}
          message={
            notFound
              ? 'This package does not exist, or it belongs to an organisation or site you do not work with.'
              : isApiError(detail.error)
                ? detail.error.message
                : 'Something went wrong while loading the package.'
          }
          action={back}
        />
      </>
    );
  }

  const data = detail.data;
  const current = data.current;
  const contractor = user.role === 'contractor';
  const editable = contractor && current.state === 'draft';
  const result = readStoredResult(current.results);
  const plan = current.files.filter((file) => file.kind === 'lift_plan');
  const supporting = current.files.filter((file) => file.kind === 'supporting');
  // Returned for changes: answer the findings and start the next revision; while that
  // revision is a draft, the findings stay in view.
  const resubmission =
    actionAllowed('start_next_revision', data.package.status) &&
    (data.package.decision === 'revise_and_resubmit' || data.package.decision === 'rejected')
      ? 'returned'
      : current.state === 'draft' && current.number > 1
        ? 'revising'
        : null;

  return (
    <>
      <PackageHeading pkg={data.package} />
      {contractor && (
        <div className="-mt-2 mb-3 flex flex-wrap items-center gap-2">
          {editable && (
            <Link to={`/packages/${id}/edit`} className={buttonClasses('primary', 'sm')}>
              Continue editing revision {current.number}
            </Link>
          )}
          <Button
            size="sm"
            disabled={duplicate.isPending}
            onClick={() =>
              duplicate.mutate(id, { onSuccess: (copy) => navigate(`/packages/${copy.package.id}/edit`) })
            }
          >
            {duplicate.isPending ? 'Duplicating…' : 'Duplicate as a new draft'}
          </Button>
          {data.package.status === 'draft' && current.number === 1 && (
            <DeleteDraftButton pkg={data.package} documents={current.files.length} />
          )}
          {duplicate.isError && (
            <span role="alert" className="text-[13px] font-bold text-fail-ink">
              {isApiError(duplicate.error) ? duplicate.error.message : 'The package could not be duplicated.'}
            </span>
          )}
        </div>
      )}

      {!contractor && current.state === 'submitted' && (
        <div data-print="hide" className="-mt-2 mb-3 flex flex-wrap items-center gap-2">
          {user.role === 'engineer' && data.package.engineer?.id === user.id ? (
            <Link to={`/packages/${id}/review`} className={buttonClasses('primary', 'sm')}>
              Open review workspace
            </Link>
          ) : (
            <Link to={`/packages/${id}/review`} className={buttonClasses('secondary', 'sm')}>
              Open pages
            </Link>
          )}
        </div>
      )}

      {contractor && resubmission && (
        <div className="mb-4">
          <ResubmissionPanel
            packageId={id}
            decision={data.package.decision}
            conditions={data.decision?.conditions}
            revisionNumber={current.number}
            mode={resubmission}
          />
        </div>
      )}

      <CheckProgress packageId={id} check={current.check} />

      <div className="grid items-start gap-4 xl:grid-cols-[minmax(0,1fr)_20rem]">
        <div className="flex min-w-0 flex-col gap-4">
          <LibraryUsesPanel packageId={id} ownFleet={contractor} />
          {result ? (
            <PackageResults result={result} inputs={current.inputs} system={user.unitSystem} />
          ) : current.check.status === 'queued' || current.check.status === 'running' ? null : (
            <EmptyState title={current.state === 'draft' ? 'Not submitted yet' : 'No check results yet'}>
              <p>
                {current.state === 'draft'
                  ? editable
                    ? 'The independent check runs when you submit this revision; the editor shows a live check while you type.'
                    : 'The contractor has not submitted this revision yet. The independent check runs on submit.'
                  : 'The results appear here when the check run has finished.'}
              </p>
            </EmptyState>
          )}
        </div>
        <aside className="flex flex-col gap-4">
          {data.decision && !(contractor && resubmission === 'returned') && (
            <DecisionPanel decision={data.decision} />
          )}
          <ReturnsPanel
            packageId={id}
            status={data.package.status}
            decision={data.package.decision}
            canIssue={user.role === 'reviewer'}
            revisions={data.revisions}
          />
          {!contractor && current.state === 'submitted' && (
            <AssignPanel pkg={data.package} canAssign={user.role === 'reviewer'} />
          )}
          <DocumentUnits units={data.documentUnits} />
          <section aria-labelledby="files-title" className="border border-rule bg-sheet">
            <h2 id="files-title" className="border-b border-rule px-3 py-2 text-[14px] font-bold">
              Documents of revision {current.number}
            </h2>
            {current.files.length === 0 ? (
              <p className="px-3 py-3 text-[13px] text-ink-soft">
                No documents yet.{editable && ' Add the lift plan PDF in the editor’s Documents step.'}
              </p>
            ) : (
              <ul className="text-[13px]">
                {plan.map((file) => (
                  <FileRow key={file.id} packageId={id} file={file} />
                ))}
                {supporting.map((file) => (
                  <FileRow key={file.id} packageId={id} file={file} />
                ))}
              </ul>
            )}
          </section>
          <RevisionTimeline detail={data} />
        </aside>
      </div>
    </>
  );
}
