import { z } from 'zod';
import { actualsBodySchema } from './actuals';
import { addressSchema } from './customers';
import { jobStageSchema } from './jobs';
import { ACTUALS_PARTS, extraKindSchema } from './settings';

/**
 * The installer's job sheet: everything needed on site and nothing about money.
 * The server builds it field by field (never by copying a takeoff or job row), so a price, cost
 * or margin added elsewhere cannot leak into an installer's response.
 */

const pointMm = z.tuple([z.number(), z.number()]);

export const sheetStripSchema = z.object({
  /** Stable id within the space: `${layerKey}:${number}`. */
  id: z.string(),
  number: z.number().int(),
  /** Label drawn on the plan and in the cut list, e.g. `B7` or `C1.7`. */
  label: z.string(),
  layerKey: z.string(),
  lengthMm: z.number(),
  widthMm: z.number(),
  /** Where the strip lies, plan millimetres: usually one polygon, several where it forks around an obstacle. */
  polygons: z.array(z.array(pointMm)),
  /** A point inside the strip for its label, plan millimetres. */
  labelAt: pointMm,
});
export type SheetStrip = z.infer<typeof sheetStripSchema>;

export const sheetLayerSchema = z.object({
  key: z.string(),
  role: z.enum(['base', 'cross']),
  label: z.string(),
  productName: z.string(),
  thicknessMm: z.number(),
  areaM2: z.number(),
  /** Lay direction, degrees from the plan's x axis (y down). */
  layDirectionDeg: z.number(),
  strips: z.array(sheetStripSchema),
});
export type SheetLayer = z.infer<typeof sheetLayerSchema>;

/**
 * One piece to cut from a roll lane. A strip longer than a roll is cut in several pieces; the cut
 * tick is per piece (`id` = `${stripId}/${piece}`), the laid tick per strip.
 */
export const sheetCutSchema = z.object({
  id: z.string(),
  stripId: z.string(),
  stripNumber: z.number().int(),
  stripLabel: z.string(),
  piece: z.number().int(),
  pieceCount: z.number().int(),
  lengthMm: z.number(),
  /** Width to cut where it is less than the lane (cut lengthwise), mm; absent for a full-width cut. */
  widthMm: z.number().optional(),
  /** Cut from an offcut of this lane rather than the roll itself: which one (`roll 2 lane 1 end`, `lengthwise rest of C1.9`…). */
  fromOffcut: z.string().optional(),
});
export type SheetCut = z.infer<typeof sheetCutSchema>;

/** One roll of the cut list: its lanes and, per lane, the pieces in laying order. */
export const sheetRollSchema = z.object({
  layerKey: z.string(),
  rollNo: z.number().int(),
  productName: z.string(),
  lanes: z.array(
    z.object({
      lane: z.number().int(),
      widthMm: z.number(),
      cuts: z.array(sheetCutSchema),
      offcutMm: z.number(),
      /** Whether the end left is worth keeping (at least the minimum usable length) or only fills slivers. */
      offcutKeep: z.boolean().optional(),
    }),
  ),
});
export type SheetRoll = z.infer<typeof sheetRollSchema>;

export const sheetCheckSchema = z.object({ code: z.string(), title: z.string(), detail: z.string() });
export type SheetCheck = z.infer<typeof sheetCheckSchema>;

export const sheetSpaceSchema = z.object({
  id: z.string(),
  name: z.string(),
  revision: z.number().int().nullable(),
  /** Geometry only, for drawing: outline, eaves edges, joists, exclusions. */
  plan: z
    .object({
      outline: z.array(pointMm),
      eavesEdges: z.array(z.number().int()),
      eavesGapMm: z.number(),
      joists: z.object({ angleDeg: z.number(), centresMm: z.number(), widthMm: z.number(), offsetMm: z.number() }),
      exclusions: z.array(z.object({ kind: z.string(), label: z.string(), polygon: z.array(pointMm).nullable(), at: pointMm.nullable() })),
    })
    .nullable(),
  netAreaM2: z.number().nullable(),
  uValueBefore: z.number().nullable(),
  uValueAfter: z.number().nullable(),
  /** The U-values named (ISO 6946 insulated area and whole ceiling, RdSAP default) and what the target is judged on; null without a takeoff. */
  thermalText: z.string().nullable().default(null),
  layers: z.array(sheetLayerSchema),
  rolls: z.array(sheetRollSchema),
  checks: z.array(sheetCheckSchema),
  /** Set when the space has no plan or its takeoff could not be computed. */
  problem: z.string().nullable(),
});
export type SheetSpace = z.infer<typeof sheetSpaceSchema>;

export const vanLoadSchema = z.object({
  rolls: z.array(z.object({ productId: z.string(), productName: z.string(), thicknessMm: z.number(), count: z.number().int() })),
  extras: z.array(z.object({ code: extraKindSchema, label: z.string(), quantity: z.number(), unit: z.string() })),
});
export type VanLoad = z.infer<typeof vanLoadSchema>;

export const TICK_KINDS = ['strip-cut', 'strip-laid', 'check'] as const;
export const tickKindSchema = z.enum(TICK_KINDS);
export type TickKind = z.infer<typeof tickKindSchema>;

export const tickSchema = z.object({
  kind: tickKindSchema,
  spaceId: z.string(),
  ref: z.string(),
  done: z.boolean(),
  /** For a check that cannot be done: why (required to finish without it). */
  reason: z.string(),
  by: z.object({ id: z.string(), name: z.string() }),
  at: z.string(),
});
export type Tick = z.infer<typeof tickSchema>;

export const tickBodySchema = z.object({
  kind: tickKindSchema,
  spaceId: z.uuid({ error: 'choose a space' }),
  ref: z.string().trim().min(1).max(120),
  done: z.boolean(),
  reason: z.string().trim().max(1000).optional().default(''),
  /** When the installer ticked it (it may be sent later from an offline queue). */
  at: z.iso.datetime({ offset: true }).optional(),
});
export type TickBody = z.input<typeof tickBodySchema>;

export const noteSchema = z.object({
  id: z.string(),
  spaceId: z.string().nullable(),
  text: z.string(),
  by: z.object({ id: z.string(), name: z.string() }),
  at: z.string(),
});
export type JobNote = z.infer<typeof noteSchema>;

export const noteBodySchema = z.object({
  text: z.string().trim().min(1, { error: 'write the note first' }).max(4000),
  spaceId: z.uuid().nullable().optional(),
  at: z.iso.datetime({ offset: true }).optional(),
});
export type NoteBody = z.input<typeof noteBodySchema>;

export const PHOTO_STAGES = ['before', 'during', 'after'] as const;
export const photoStageSchema = z.enum(PHOTO_STAGES);
export type PhotoStage = z.infer<typeof photoStageSchema>;

/** The text fields sent beside the multipart `photo` file. */
export const photoFieldsSchema = z.object({
  spaceId: z.uuid({ error: 'choose the space the photo shows' }),
  stage: photoStageSchema,
  caption: z.string().trim().max(500).optional().default(''),
  takenAt: z.iso.datetime({ offset: true }).optional(),
});

export const photoSchema = z.object({
  id: z.string(),
  spaceId: z.string(),
  stage: photoStageSchema,
  caption: z.string(),
  widthPx: z.number().int(),
  heightPx: z.number().int(),
  url: z.string(),
  thumbUrl: z.string(),
  by: z.object({ id: z.string(), name: z.string() }),
  at: z.string(),
});
export type JobPhoto = z.infer<typeof photoSchema>;

export const finishBodySchema = z.object({
  /** A written reason per unticked check, keyed `${spaceId}:${code}`. */
  reasons: z.record(z.string(), z.string().trim().max(1000)).optional().default({}),
  /** What was really used on site; what must be in it is the company's setting (nothing by default). */
  actuals: actualsBodySchema.optional(),
});
export type FinishBody = z.input<typeof finishBodySchema>;

export const completionSchema = z.object({
  by: z.object({ id: z.string(), name: z.string() }),
  at: z.string(),
  handoverUrl: z.string(),
});

export const jobSheetSchema = z.object({
  job: z.object({
    id: z.string(),
    reference: z.string(),
    stage: jobStageSchema,
    installDate: z.string().nullable(),
    propertyAddress: addressSchema,
    accessNotes: z.string(),
    notes: z.string(),
    customer: z.object({ name: z.string(), phone: z.string() }),
    installer: z.object({ id: z.string(), name: z.string() }).nullable(),
  }),
  spaces: z.array(sheetSpaceSchema),
  vanLoad: vanLoadSchema,
  cautions: z.array(z.string()),
  ticks: z.array(tickSchema),
  notes: z.array(noteSchema),
  photos: z.array(photoSchema),
  completion: completionSchema.nullable(),
  /**
   * What the company asks the installer to record before finishing (settings `actualsRequired`).
   * A part the job has nothing for (no extras in the van load) is not asked for.
   */
  actualsRequired: z.array(z.enum(ACTUALS_PARTS)).default([]),
  /**
   * Once the job is marked installed: what is recorded as used (empty lists and version 0 when
   * nothing was), its version for a correction (`PUT /api/jobs/:id/actuals`), and whether this
   * user may correct it now. Null before the job is finished.
   */
  actuals: actualsBodySchema.extend({ version: z.number().int(), editable: z.boolean() }).nullable().default(null),
});
export type JobSheet = z.infer<typeof jobSheetSchema>;

/** One row of the installer's home list. */
export const myJobSchema = z.object({
  id: z.string(),
  reference: z.string(),
  stage: jobStageSchema,
  installDate: z.string().nullable(),
  customerName: z.string(),
  propertyAddress: addressSchema,
  spaceCount: z.number().int(),
});
export type MyJob = z.infer<typeof myJobSchema>;

/** Header that makes a POST safe to repeat: the first result is stored and replayed. */
export const IDEMPOTENCY_HEADER = 'Idempotency-Key';
export const idempotencyKeySchema = z.string().regex(/^[A-Za-z0-9_-]{8,100}$/, { error: 'Idempotency-Key must be 8–100 letters, digits, - or _' });
