// /admin/organisations — the lifting contractors and site owners on the desk: add one,
// rename one, and see how many people each has.
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { PageHeader } from '@/components/layouts/page-header';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/panel-message';
import { useOrganisations } from '@/features/admin/api/organisations';
import { AdminTable, ListStates, type AdminColumn } from '@/features/admin/components/admin-table';
import { NewOrganisationForm, RenameOrganisationForm } from '@/features/admin/components/organisation-forms';
import { ORGANISATION_KIND_LABELS } from '@/features/admin/lib/labels';

const COLUMNS: AdminColumn[] = [
  { label: 'Name' },
  { label: 'Kind', className: 'w-[180px]' },
  { label: 'People', className: 'w-[90px] text-right' },
  { label: 'Actions', className: 'w-[110px]', hidden: true },
];

export default function AdminOrganisationsRoute() {
  const organisations = useOrganisations();
  const [renaming, setRenaming] = useState<string | null>(null);
  const items = [...(organisations.data?.items ?? [])].sort(
    (a, b) => a.kind.localeCompare(b.kind) || a.name.localeCompare(b.name),
  );

  return (
    <>
      <PageHeader
        title="Organisations"
        context="Lifting contractors submit lift packages; site owners run the sites, the coordinators and the engineers of record."
      />
      <div className="grid grid-cols-1 gap-5 xl:grid-cols-[minmax(0,1fr)_380px]">
        <section aria-label="Organisations on the desk" className="min-w-0">
          <ListStates
            query={organisations}
            loading="Loading organisations"
            failed="Organisations could not be loaded"
            isEmpty={() => items.length === 0}
            empty={
              <EmptyState title="No organisations yet">
                <p>Add the site owner first, then each lifting contractor that will submit lift packages.</p>
              </EmptyState>
            }
          >
            {() => (
              <AdminTable caption="Organisations" columns={COLUMNS}>
                {items.map((organisation) => (
                  <tr
                    key={organisation.id}
                    className="border-b border-rule last:border-b-0 even:bg-sheet-alt/60"
                  >
                    <td className="px-3 py-2">
                      {renaming === organisation.id ? (
                        <RenameOrganisationForm
                          organisation={organisation}
                          onDone={() => setRenaming(null)}
                        />
                      ) : (
                        <span className="font-bold">{organisation.name}</span>
                      )}
                    </td>
                    <td className="px-3 py-2">{ORGANISATION_KIND_LABELS[organisation.kind]}</td>
                    <td className="tabular px-3 py-2 text-right">
                      <Link
                        to={`/admin/people?organisationId=${organisation.id}`}
                        className="font-bold text-verdigris hover:underline"
                        aria-label={`${organisation.people} people at ${organisation.name}`}
                      >
                        {organisation.people}
                      </Link>
                    </td>
                    <td className="px-3 py-2 text-right">
                      {renaming !== organisation.id && (
                        <Button
                          size="sm"
                          variant="quiet"
                          aria-label={`Rename ${organisation.name}`}
                          onClick={() => setRenaming(organisation.id)}
                        >
                          Rename
                        </Button>
                      )}
                    </td>
                  </tr>
                ))}
              </AdminTable>
            )}
          </ListStates>
        </section>
        <div className="self-start">
          <NewOrganisationForm />
        </div>
      </div>
    </>
  );
}
