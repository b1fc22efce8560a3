import { z } from 'zod';

export const spaceBodySchema = z.object({ name: z.string().trim().min(1, { error: 'name the space' }).max(120) });
export type SpaceBody = z.infer<typeof spaceBodySchema>;

/** PUT /api/spaces/:id/plan — `plan` is checked against the plan schema by the server. */
export const savePlanBodySchema = z.object({ plan: z.unknown(), baseRevision: z.number().int().min(0), note: z.string().trim().max(500).optional() });

export const revisionSummarySchema = z.object({
  revision: z.number().int(),
  author: z.object({ id: z.string(), name: z.string() }).nullable(),
  createdAt: z.string(),
  note: z.string().optional(),
});
export type RevisionSummary = z.infer<typeof revisionSummarySchema>;

/** POST /api/jobs/:id/spaces — an optional first plan becomes revision 1. */
export const spaceCreateBodySchema = spaceBodySchema.extend({ plan: z.unknown().optional() });
export type SpaceCreateBody = z.input<typeof spaceCreateBodySchema>;

/** PATCH /api/spaces/:id */
export const spacePatchSchema = z.object({
  name: spaceBodySchema.shape.name.optional(),
  position: z.number().int().min(0).max(1000).optional(),
});
export type SpacePatch = z.infer<typeof spacePatchSchema>;

/** GET /api/spaces/:id (the plan itself is at /api/spaces/:id/plan). */
export const spaceSchema = z.object({
  id: z.string(),
  jobId: z.string(),
  jobReference: z.string(),
  name: z.string(),
  position: z.number().int(),
  latestRevision: z.number().int().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Space = z.infer<typeof spaceSchema>;

/** POST /api/spaces/:id/revisions/:rev/restore — with `baseRevision`, refused (409) when stale. */
export const restoreRevisionBodySchema = z.object({ baseRevision: z.number().int().min(0).optional() });
