import { Navigate } from 'react-router-dom';
import { useCurrentUser } from '../../features/auth/use-current-user';
import { homePathFor } from '../nav-items';

/** "/" sends each role to its own start page. */
export default function HomeRedirect() {
  return <Navigate to={homePathFor(useCurrentUser())} replace />;
}
