import { z } from 'zod';
import { emailSchema, roleSchema } from './common';

export const userSchema = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  active: z.boolean(),
  /** False until the invited user has set a password. */
  hasPassword: z.boolean(),
  createdAt: z.string(),
});
export type User = z.infer<typeof userSchema>;

export const inviteUserBodySchema = z.object({
  email: emailSchema,
  name: z.string().trim().min(1, { error: 'enter a name' }).max(120),
  role: roleSchema,
});
export type InviteUserBody = z.infer<typeof inviteUserBodySchema>;

export const updateUserBodySchema = z.object({ name: z.string().trim().min(1).max(120), role: roleSchema, active: z.boolean() }).partial();
export type UpdateUserBody = z.infer<typeof updateUserBodySchema>;
