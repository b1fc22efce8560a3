import { z } from 'zod';

export const addressSchema = z.object({
  line1: z.string().trim().min(1, { error: 'enter the first line of the address' }).max(200),
  line2: z.string().trim().max(200).optional().default(''),
  town: z.string().trim().min(1, { error: 'enter the town' }).max(120),
  postcode: z.string().trim().min(1, { error: 'enter the postcode' }).max(20),
});
export type Address = z.infer<typeof addressSchema>;

const customerFieldsSchema = z.object({
  name: z.string().trim().min(1, { error: 'enter the customer name' }).max(200),
  email: z.union([z.email({ error: 'enter a valid e-mail address' }).max(254), z.literal('')]),
  phone: z.string().trim().max(40),
  address: addressSchema,
});

export const customerBodySchema = customerFieldsSchema.extend({
  email: customerFieldsSchema.shape.email.optional().default(''),
  phone: customerFieldsSchema.shape.phone.optional().default(''),
});
export type CustomerBody = z.input<typeof customerBodySchema>;

export const customerSchema = customerBodySchema.extend({ id: z.string(), createdAt: z.string() });
export type Customer = z.infer<typeof customerSchema>;

/** PATCH body: only the fields sent change (no defaults filled in; see jobPatchSchema). */
export const customerPatchSchema = customerFieldsSchema.partial();
export type CustomerPatch = z.input<typeof customerPatchSchema>;

export const customerListQuerySchema = z.object({ q: z.string().max(200).optional() });
export type CustomerListQuery = z.infer<typeof customerListQuerySchema>;
