import { z } from 'zod';
import { addressSchema, customerSchema } from './customers';

/** Job stages in order; `declined` may follow `quoted`. */
export const JOB_STAGES = ['enquiry', 'surveyed', 'quoted', 'accepted', 'scheduled', 'installed', 'closed', 'declined'] as const;
export const jobStageSchema = z.enum(JOB_STAGES);
export type JobStage = z.infer<typeof jobStageSchema>;

/** Job fields without defaults; the create and patch schemas derive from it. */
const jobFieldsSchema = z.object({
  customerId: z.uuid({ error: 'choose a customer' }),
  propertyAddress: addressSchema,
  stage: jobStageSchema,
  assignedInstallerId: z.uuid({ error: 'choose an installer' }).nullable(),
  installDate: z.iso.date({ error: 'use a date like 2027-01-31' }).nullable(),
  accessNotes: z.string().max(2000),
  notes: z.string().max(5000),
});

export const jobBodySchema = jobFieldsSchema.extend({
  stage: jobStageSchema.default('enquiry'),
  assignedInstallerId: jobFieldsSchema.shape.assignedInstallerId.optional(),
  installDate: jobFieldsSchema.shape.installDate.optional(),
  accessNotes: jobFieldsSchema.shape.accessNotes.optional().default(''),
  notes: jobFieldsSchema.shape.notes.optional().default(''),
});
export type JobBody = z.input<typeof jobBodySchema>;
/**
 * PATCH body: only the fields sent are changed. Built from the default-free fields on purpose —
 * `jobBodySchema.partial()` would fill `stage: 'enquiry'` into every patch (zod 4 applies defaults
 * inside optional).
 */
export const jobPatchSchema = jobFieldsSchema.partial();
export type JobPatch = z.input<typeof jobPatchSchema>;

export const JOB_SORTS = ['updated', 'created', 'stage', 'customer', 'installDate'] as const;
/** Jobs per page of GET /api/jobs unless `limit` says otherwise, and the most one page may hold. */
export const JOB_PAGE_DEFAULT = 50;
export const JOB_PAGE_MAX = 100;
export const jobListQuerySchema = z.object({
  q: z.string().max(200).optional(),
  stage: jobStageSchema.optional(),
  /** Only jobs assigned to this installer (office/estimator filter). */
  installerId: z.uuid().optional(),
  sort: z.enum(JOB_SORTS).default('updated'),
  dir: z.enum(['asc', 'desc']).default('desc'),
  /** Jobs per page (default 50, at most 100). */
  limit: z.coerce.number().int().min(1).max(JOB_PAGE_MAX).default(JOB_PAGE_DEFAULT),
  /** `nextCursor` of the previous page, for the page after it (same q, filters, sort and dir). */
  cursor: z.string().max(500).optional(),
});
export type JobListQuery = z.input<typeof jobListQuerySchema>;

export const spaceSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  latestRevision: z.number().int().nullable(),
  /** When the latest revision was saved (ISO); null when no plan was saved yet. */
  latestRevisionAt: z.string().nullable(),
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

/**
 * GET /api/jobs: one page of the list, in the order asked. `nextCursor` is null on the last page;
 * `count` counts every job matching the search and filters.
 */
export const jobListPageSchema = z.object({ jobs: z.array(jobSchema), nextCursor: z.string().nullable(), count: z.number().int() });
export type JobListPage = z.infer<typeof jobListPageSchema>;

/** One entry of a job's timeline (GET /api/jobs/:id/events), oldest first. */
export const jobEventSchema = z.object({
  id: z.string(),
  kind: z.string(),
  data: z.record(z.string(), z.unknown()),
  user: z.object({ id: z.string(), name: z.string() }).nullable(),
  createdAt: z.string(),
});
export type JobEvent = z.infer<typeof jobEventSchema>;

/** The installers an office user may assign (GET /api/jobs/installers). */
export const installerOptionSchema = z.object({ id: z.string(), name: z.string() });
export type InstallerOption = z.infer<typeof installerOptionSchema>;
