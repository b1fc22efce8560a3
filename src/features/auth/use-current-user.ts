import type { Me } from '../../../shared/api/auth';
import { useMe } from './api/get-me';

/** The signed-in user inside the signed-in routes (the guard has already loaded it). */
export function useCurrentUser(): Me {
  const { data } = useMe();
  if (!data) throw new Error('useCurrentUser is only for pages behind the sign-in guard');
  return data;
}
