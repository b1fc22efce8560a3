import { z } from 'zod';

export const spaceBodySchema = z.object({ name: z.string().trim().min(1, { error: 'name the space' }).max(120) });
export type SpaceBody = z.infer<typeof spaceBodySchema>;

/** PUT /api/spaces/:id/plan — `plan` is checked against the plan schema by the server. */
export const savePlanBodySchema = z.object({ plan: z.unknown(), baseRevision: z.number().int().min(0) });

export const revisionSummarySchema = z.object({
  revision: z.number().int(),
  author: z.object({ id: z.string(), name: z.string() }).nullable(),
  createdAt: z.string(),
  note: z.string().optional(),
});
export type RevisionSummary = z.infer<typeof revisionSummarySchema>;
