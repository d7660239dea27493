// /library: the contractor's fleet library — cranes, their configurations and load charts.
import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { useCurrentUser } from '@/lib/auth';
import { Button } from '@/components/ui/button';
import { PageHeader } from '@/components/layouts/page-header';
import { FleetView } from '@/features/library/components/fleet-view';
import { CraneForm } from '@/features/library/components/crane-form';

export default function LibraryRoute() {
  const { data: user } = useCurrentUser();
  const [adding, setAdding] = useState(false);
  const navigate = useNavigate();
  if (!user) return null;
  return (
    <>
      <PageHeader
        title="Fleet library"
        context={`The cranes of ${user.organisation.name}, each configuration with its load chart, entered once for every package.`}
        actions={
          !adding && (
            <Button variant="primary" onClick={() => setAdding(true)}>
              + Add a crane
            </Button>
          )
        }
      />
      {adding && (
        <div className="mb-4">
          <CraneForm system={user.unitSystem} onDone={(id) => navigate(`/library/cranes/${id}`)} />
        </div>
      )}
      <FleetView />
    </>
  );
}
