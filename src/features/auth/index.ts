// What other features may use of sign-in besides its api/: the signed-in user.
export { useCurrentUser } from './use-current-user';
