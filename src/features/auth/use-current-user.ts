import { createContext, useContext } from 'react';
import type { Me } from '../../../shared/api/auth';
import { useMe } from './api/get-me';

/**
 * The user the sign-in guard let in. Pages read it from here rather than from the query alone: when
 * the session ends, the cached user turns null a moment before the guard redirects, and the page
 * must not crash in that moment.
 */
export const CurrentUserContext = createContext<Me | null>(null);

/** The signed-in user inside the signed-in routes (the guard has already loaded it). */
export function useCurrentUser(): Me {
  const fromGuard = useContext(CurrentUserContext);
  const { data } = useMe();
  const user = fromGuard ?? data;
  if (!user) throw new Error('useCurrentUser is only for pages behind the sign-in guard');
  return user;
}
