import { z } from 'zod';
import { emailSchema, passwordSchema, roleSchema } from './common';

export const loginBodySchema = z.object({ email: emailSchema, password: z.string().min(1, { error: 'enter your password' }).max(200) });
export type LoginBody = z.infer<typeof loginBodySchema>;

/** The signed-in user as the client sees it. */
export const meSchema = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  organisation: z.object({ id: z.string(), name: z.string() }),
});
export type Me = z.infer<typeof meSchema>;

/** Set a password from an invite or reset link. */
export const setPasswordBodySchema = z.object({ token: z.string().min(10).max(500), password: passwordSchema });
export type SetPasswordBody = z.infer<typeof setPasswordBodySchema>;

export const requestResetBodySchema = z.object({ email: emailSchema });
export type RequestResetBody = z.infer<typeof requestResetBodySchema>;

/** Client paths that e-mailed links open, with `?token=...` (the server builds the links). */
export const AUTH_LINK_PATHS = { invite: '/set-password', reset: '/reset-password' } as const;
