// Choosing a site's lift coordinators: they receive its packages' "submitted" e-mails and
// see its whole queue. Only active coordinators of the administrator's own organisation
// can be chosen; the server refuses anyone else and names them.
import { useState } from 'react';
import { isApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { FormAlert } from '@/components/ui/form-field';
import { PageLoading, Spinner } from '@/components/ui/page-loading';
import { usePeople } from '../api/people';
import { useSetSiteReviewers, type AdminSite } from '../api/sites';

export function ReviewersDialog({
  site,
  organisationId,
  organisationName,
  onClose,
}: {
  site: AdminSite;
  organisationId: string;
  organisationName: string;
  onClose: () => void;
}) {
  const people = usePeople({ organisationId, role: 'reviewer', state: 'active' });
  const save = useSetSiteReviewers();
  const [chosen, setChosen] = useState<ReadonlySet<string>>(() => new Set(site.reviewers.map((r) => r.id)));

  const candidates = (people.data?.items ?? []).filter(
    (person) => person.organisation.id === organisationId && person.role === 'reviewer' && person.active,
  );
  // Someone already on the site but no longer an active coordinator is listed so they can be removed.
  const stale = site.reviewers.filter((reviewer) => !candidates.some((person) => person.id === reviewer.id));

  const toggle = (id: string) =>
    setChosen((current) => {
      const next = new Set(current);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });

  const failure = save.error;
  const alert = failure
    ? isApiError(failure) && failure.fields.length > 0
      ? failure.fields.map((field) => field.message).join(' ')
      : failure.message
    : null;

  return (
    <Dialog
      title={`Lift coordinators for ${site.name}`}
      description={`They see the site's whole queue and receive an e-mail when a package is submitted. Only active lift coordinators of ${organisationName} can be chosen.`}
      onClose={onClose}
    >
      <div className="flex flex-col gap-3">
        {alert && <FormAlert>{alert}</FormAlert>}
        {people.isPending ? (
          <PageLoading label="Loading coordinators" />
        ) : people.isError ? (
          <FormAlert>{people.error.message}</FormAlert>
        ) : candidates.length === 0 && stale.length === 0 ? (
          <p className="text-sm text-ink-soft">
            {organisationName} has no active lift coordinators yet. Invite one on the People page; they can be
            added here once they have set their password.
          </p>
        ) : (
          <fieldset className="flex max-h-[50vh] flex-col overflow-y-auto border border-rule">
            <legend className="sr-only">Lift coordinators</legend>
            {[...candidates, ...stale.map((r) => ({ ...r, stale: true as const }))].map((person) => (
              <label
                key={person.id}
                className="flex cursor-pointer items-center gap-2.5 border-b border-rule px-3 py-2 text-sm last:border-b-0 hover:bg-sheet-alt"
              >
                <input
                  type="checkbox"
                  className="size-4 accent-verdigris"
                  checked={chosen.has(person.id)}
                  onChange={() => toggle(person.id)}
                />
                <span className="flex-1">
                  <span className="font-bold">{person.name}</span>{' '}
                  <span className="text-[12.5px] text-ink-soft">{person.email}</span>
                </span>
                {'stale' in person && (
                  <span className="text-[12px] font-bold text-caution-ink">
                    No longer an active coordinator
                  </span>
                )}
              </label>
            ))}
          </fieldset>
        )}
        <div className="flex items-center justify-between gap-2 border-t border-rule pt-3">
          <span className="text-[13px] text-ink-soft">{chosen.size} chosen</span>
          <div className="flex gap-2">
            <Button onClick={onClose}>Cancel</Button>
            <Button
              variant="primary"
              disabled={save.isPending}
              onClick={() => save.mutate({ id: site.id, userIds: [...chosen] }, { onSuccess: onClose })}
            >
              {save.isPending && <Spinner />}
              {save.isPending ? 'Saving…' : 'Save coordinators'}
            </Button>
          </div>
        </div>
      </div>
    </Dialog>
  );
}
