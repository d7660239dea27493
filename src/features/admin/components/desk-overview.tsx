// The desk administrator's home: one card per thing they run — organisations, sites,
// people, review policies and the mail outbox — each with the figure that says whether
// it needs attention, and the way in.
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { plural } from '@/lib/format';
import { useOrganisations } from '../api/organisations';
import { useAdminSites } from '../api/sites';
import { usePeople } from '../api/people';
import { useMail } from '../api/mail';

function Card({
  title,
  to,
  action,
  figure,
  children,
  attention,
}: {
  title: string;
  to: string;
  action: string;
  figure: ReactNode;
  children?: ReactNode;
  attention?: boolean;
}) {
  return (
    <section
      aria-label={title}
      className={`flex flex-col border bg-sheet px-4 py-3 ${attention ? 'border-failed-edge border-t-4 border-t-failed-ink' : 'border-rule border-t-4 border-t-ink'}`}
    >
      <h2 className="text-[12.5px] font-bold uppercase tracking-[0.08em] text-ink-soft">{title}</h2>
      <p className="mt-1 text-[26px] font-black leading-none tabular">{figure}</p>
      <div className="mt-1.5 flex-1 text-[13px] leading-snug text-ink-soft">{children}</div>
      <Link to={to} className="mt-2.5 text-[13.5px] font-bold text-verdigris hover:underline">
        {action} →
      </Link>
    </section>
  );
}

const pending = '…';

/** What a card shows while its figure loads, or when it could not be loaded. */
function figureOr(value: number | undefined, failed: boolean) {
  return value ?? (failed ? '—' : pending);
}

export function DeskOverview() {
  const organisations = useOrganisations();
  const sites = useAdminSites();
  const people = usePeople({});
  const failed = useMail({ status: 'failed', page: 1 });
  const queued = useMail({ status: 'queued', page: 1 });

  const orgs = organisations.data?.items;
  const siteItems = sites.data?.items;
  const peopleItems = people.data?.items;
  const count = (state: string) => peopleItems?.filter((person) => person.state === state).length ?? 0;
  const withoutCoordinators = siteItems?.filter((site) => site.reviewers.length === 0) ?? [];
  const failedTotal = failed.data?.total ?? 0;

  return (
    <div className="grid grid-cols-1 gap-3 sm:grid-cols-2 xl:grid-cols-5">
      <Card
        title="Organisations"
        to="/admin/organisations"
        action="Manage organisations"
        figure={figureOr(orgs?.length, organisations.isError)}
      >
        {orgs && (
          <>
            {plural(orgs.filter((org) => org.kind === 'contractor').length, 'lifting contractor')},{' '}
            {plural(orgs.filter((org) => org.kind === 'owner').length, 'site owner')}
          </>
        )}
      </Card>
      <Card
        title="Sites"
        to="/admin/sites"
        action="Sites and coordinators"
        figure={figureOr(siteItems?.length, sites.isError)}
        attention={withoutCoordinators.length > 0}
      >
        {siteItems &&
          (withoutCoordinators.length > 0 ? (
            <span className="font-bold text-failed-ink">
              <span aria-hidden="true">▲ </span>
              {withoutCoordinators.map((site) => site.name).join(', ')}{' '}
              {withoutCoordinators.length === 1 ? 'has' : 'have'} no lift coordinator
            </span>
          ) : (
            'Every site has at least one lift coordinator.'
          ))}
      </Card>
      <Card
        title="People"
        to="/admin/people"
        action="Invite and manage people"
        figure={figureOr(peopleItems && count('active'), people.isError)}
      >
        {peopleItems && (
          <>
            active; {plural(count('invited'), 'invitation')} open
            {count('invite_expired') > 0 && (
              <>
                ,{' '}
                <strong className="text-caution-ink">
                  {plural(count('invite_expired'), 'expired link')}
                </strong>
              </>
            )}
            , {count('deactivated')} deactivated
          </>
        )}
      </Card>
      <Card
        title="Review policies"
        to="/admin/sites"
        action="Limits per site"
        figure={figureOr(siteItems?.length, sites.isError)}
      >
        {!siteItems ? null : siteItems.length > 0 ? (
          <ul className="flex flex-col">
            {siteItems.slice(0, 3).map((site) => (
              <li key={site.id}>
                <Link to={`/admin/sites/${site.id}/policy`} className="text-ink hover:underline">
                  {site.name}
                </Link>{' '}
                <span className="tabular">· v{site.policyVersion}</span>
              </li>
            ))}
            {siteItems.length > 3 && <li>and {siteItems.length - 3} more</li>}
          </ul>
        ) : (
          'Each site checks lifts against its own limits.'
        )}
      </Card>
      <Card
        title="Mail outbox"
        to={failedTotal > 0 ? '/admin/mail?status=failed' : '/admin/mail'}
        action={failedTotal > 0 ? 'See failed messages' : 'Open the outbox'}
        figure={figureOr(failed.data?.total, failed.isError)}
        attention={failedTotal > 0}
      >
        {failed.data && (
          <>
            {failedTotal === 1 ? 'message' : 'messages'} failed
            {queued.data && <>; {queued.data.total} waiting to send</>}
          </>
        )}
      </Card>
    </div>
  );
}
