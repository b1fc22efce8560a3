import { z } from 'zod';
import { ROLES } from '../auth/roles';

/** Database ids are UUID strings. */
export const idSchema = z.uuid();
export const idParamsSchema = z.object({ id: idSchema });

/** The one error body every API error returns. */
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    details: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
  }),
});
export type ApiError = z.infer<typeof apiErrorSchema>;

export const emailSchema = z
  .email({ error: 'enter a valid e-mail address' })
  .max(254)
  .transform((s) => s.toLowerCase());
export const passwordSchema = z.string().min(10, { error: 'use at least 10 characters' }).max(200);

/** One of the company roles (shared/auth/roles.ts). */
export const roleSchema = z.enum(ROLES);
