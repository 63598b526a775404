import { Navigate } from 'react-router-dom';
import { useSignedInUser } from '../../lib/signed-in-user';
import { homePathFor } from '../navigation';

export function HomeRedirect() {
  const user = useSignedInUser();
  return <Navigate to={homePathFor(user.role)} replace />;
}
