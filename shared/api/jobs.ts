import { z } from 'zod';
import { addressSchema, customerSchema } from './customers';

/** Job stages in order (PRODUCT.md, Vocabulary); `declined` may follow `quoted`. */
export const JOB_STAGES = ['enquiry', 'surveyed', 'quoted', 'accepted', 'scheduled', 'installed', 'closed', 'declined'] as const;
export const jobStageSchema = z.enum(JOB_STAGES);
export type JobStage = z.infer<typeof jobStageSchema>;

export const jobBodySchema = z.object({
  customerId: z.uuid({ error: 'choose a customer' }),
  propertyAddress: addressSchema,
  stage: jobStageSchema.default('enquiry'),
  assignedInstallerId: z.uuid().nullable().optional(),
  installDate: z.iso.date({ error: 'use a date like 2027-01-31' }).nullable().optional(),
  accessNotes: z.string().max(2000).optional().default(''),
  notes: z.string().max(5000).optional().default(''),
});
export type JobBody = z.input<typeof jobBodySchema>;
export const jobPatchSchema = jobBodySchema.partial();
export type JobPatch = z.input<typeof jobPatchSchema>;

export const JOB_SORTS = ['updated', 'created', 'stage', 'customer', 'installDate'] as const;
export const jobListQuerySchema = z.object({
  q: z.string().max(200).optional(),
  stage: jobStageSchema.optional(),
  sort: z.enum(JOB_SORTS).default('updated'),
  dir: z.enum(['asc', 'desc']).default('desc'),
});
export type JobListQuery = z.input<typeof jobListQuerySchema>;

export const spaceSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  latestRevision: z.number().int().nullable(),
  updatedAt: z.string(),
});
export type SpaceSummary = z.infer<typeof spaceSummarySchema>;

export const jobSchema = z.object({
  id: z.string(),
  reference: z.string(),
  customer: customerSchema.pick({ id: true, name: true, email: true, phone: true }),
  propertyAddress: addressSchema,
  stage: jobStageSchema,
  assignedInstaller: z.object({ id: z.string(), name: z.string() }).nullable(),
  installDate: z.string().nullable(),
  accessNotes: z.string(),
  notes: z.string(),
  spaces: z.array(spaceSummarySchema),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Job = z.infer<typeof jobSchema>;
