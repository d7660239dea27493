// "/": send each person to the page their role works from.
import { Navigate } from 'react-router-dom';
import { homeFor, useCurrentUser } from '@/lib/auth';

export default function HomeRoute() {
  const { data: user } = useCurrentUser();
  if (!user) return null;
  return <Navigate to={homeFor(user)} replace />;
}
