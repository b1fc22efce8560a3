import { z } from 'zod';
import { jobStageSchema } from './jobs';

/** GET /api/schedule?weekStart=YYYY-MM-DD (a Monday; any date is moved back to its Monday). */
export const scheduleQuerySchema = z.object({
  weekStart: z.iso.date({ error: 'use a date like 2027-01-04' }).optional(),
});

export const scheduleJobSchema = z.object({
  id: z.string(),
  reference: z.string(),
  stage: jobStageSchema,
  customerName: z.string(),
  town: z.string(),
  postcode: z.string(),
  installDate: z.string().nullable(),
  installerId: z.string().nullable(),
  /** Net area to insulate over all spaces, from the latest takeoffs; null when unknown. */
  areaM2: z.number().nullable(),
});
export type ScheduleJob = z.infer<typeof scheduleJobSchema>;

export const capacitySchema = z.object({
  maxJobsPerDay: z.number().int().min(1).max(20),
  maxAreaM2PerDay: z.number().min(1).max(10_000),
});
export type Capacity = z.infer<typeof capacitySchema>;

export const dayLoadSchema = z.object({
  installerId: z.string(),
  date: z.string(),
  jobs: z.number().int(),
  areaM2: z.number(),
  overCapacity: z.boolean(),
});

export const scheduleWeekSchema = z.object({
  weekStart: z.string(),
  days: z.array(z.string()),
  installers: z.array(z.object({ id: z.string(), name: z.string() })),
  jobs: z.array(scheduleJobSchema),
  /** Accepted jobs waiting for a date and an installer. */
  unscheduled: z.array(scheduleJobSchema),
  loads: z.array(dayLoadSchema),
  capacity: capacitySchema,
});
export type ScheduleWeek = z.infer<typeof scheduleWeekSchema>;

/** POST /api/schedule/assign */
export const assignBodySchema = z.object({
  jobId: z.uuid({ error: 'choose a job' }),
  installerId: z.uuid({ error: 'choose an installer' }),
  date: z.iso.date({ error: 'use a date like 2027-01-31' }),
  /** Book even though the installer's day is then over capacity. */
  allowOverCapacity: z.boolean().optional().default(false),
});
export type AssignBody = z.input<typeof assignBodySchema>;

export const assignResultSchema = z.object({
  jobId: z.string(),
  stage: jobStageSchema,
  installDate: z.string(),
  installerId: z.string(),
  warnings: z.array(z.string()),
  emailed: z.array(z.string()),
});
export type AssignResult = z.infer<typeof assignResultSchema>;

/** Company settings for installs: day capacity and what the handover pack states. */
export const installSettingsSchema = capacitySchema.extend({
  /** Show R-values (SI and imperial) in the handover pack. */
  handoverRValues: z.boolean(),
  /** Add a signed receipt of the insulation installed (type, area, thickness, R-value). */
  handoverReceipt: z.boolean(),
});
export type InstallSettings = z.infer<typeof installSettingsSchema>;
export const installSettingsPatchSchema = installSettingsSchema.partial();
