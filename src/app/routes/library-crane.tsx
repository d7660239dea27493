// /library/cranes/:id: one crane of the fleet, its fixed data and configurations.
import { Link, useParams } from 'react-router-dom';
import { useCurrentUser } from '@/lib/auth';
import { PageHeader } from '@/components/layouts/page-header';
import { useCrane } from '@/features/library/api/cranes';
import { CraneView } from '@/features/library/components/crane-view';

export default function LibraryCraneRoute() {
  const { id = '' } = useParams();
  const { data: user } = useCurrentUser();
  const crane = useCrane(id);
  if (!user) return null;
  return (
    <>
      <PageHeader
        title={crane.data ? `Crane ${crane.data.fleetNumber}` : 'Crane'}
        context={
          <Link to="/library" className="text-verdigris underline underline-offset-2">
            ← Fleet library
          </Link>
        }
      />
      <CraneView id={id} system={user.unitSystem} />
    </>
  );
}
