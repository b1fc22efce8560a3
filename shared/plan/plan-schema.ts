import { z } from 'zod';
import { PLAN_LIMITS } from './plan-limits';

/** The only plan format this version reads and writes. */
export const PLAN_FORMAT = 'quiltline-plan/1' as const;

const coordinateSchema = z.number().finite().min(-PLAN_LIMITS.coordinateMm).max(PLAN_LIMITS.coordinateMm);
/** A point in plan space: [x, y] in millimetres, y pointing down as on a screen; within ±`PLAN_LIMITS.coordinateMm`. */
export const pointSchema = z.tuple([coordinateSchema, coordinateSchema]);
export type PointMm = z.infer<typeof pointSchema>;

/** Kinds of area or point not to be covered; each has its own site rule and default clearance. */
export const EXCLUSION_KINDS = ['hatch', 'tank', 'chimney', 'flue', 'boarded', 'downlight', 'other'] as const;
/** One of `EXCLUSION_KINDS`. */
export const exclusionKindSchema = z.enum(EXCLUSION_KINDS);
/** A kind of exclusion. */
export type ExclusionKind = z.infer<typeof exclusionKindSchema>;

/** What happens to a boarded area: raise the boards and insulate under them, or leave it boarded. */
export const BOARDED_TREATMENTS = ['raise', 'leave'] as const;
/** One of `BOARDED_TREATMENTS`. */
export type BoardedTreatment = (typeof BOARDED_TREATMENTS)[number];

/** How the eaves air path is kept open: insulation kept back by a gap, or eaves ventilators with the insulation over the wall plate. */
export const EAVES_MODES = ['gap', 'ventilators'] as const;
/** One of `EAVES_MODES`. */
export type EavesMode = (typeof EAVES_MODES)[number];

/** The roof over the loft, for the ventilation checks and the eaves ventilator count (all optional). */
export const roofSchema = z.object({
  shape: z.enum(['gable', 'hipped', 'mono-pitch']).optional(),
  /** Roof pitch, degrees from horizontal. */
  pitchDeg: z.number().min(0).max(90).optional(),
  /** Rafter centres along the eaves, mm; the joist centres when absent (ceiling joists usually sit beside the rafters). */
  rafterCentresMm: z.number().positive().max(2000).optional(),
});

/** What the surveyor noted in the loft that the drawing cannot show (all optional). */
export const siteNotesSchema = z.object({
  /** Extract-fan ducts running through the loft. */
  extractFanDucts: z.number().int().min(0).max(50).optional(),
  /** Some downlights are low-voltage, with transformers in the loft. */
  lowVoltageDownlights: z.boolean().optional(),
  /** Water pipes run through the loft (pipes with no tank still need lagging). */
  waterPipes: z.boolean().optional(),
});

/** An area not to be covered: a polygon, or a point (`at`) for things like downlights. */
export const exclusionSchema = z
  .object({
    kind: exclusionKindSchema,
    label: z.string().max(120).optional(),
    polygon: z.array(pointSchema).min(3).max(PLAN_LIMITS.exclusionCorners).optional(),
    at: pointSchema.optional(),
    /** Extra clearance around this exclusion, mm; when absent the kind's default applies. */
    clearanceMm: z.number().min(0).max(2000).optional(),
    /**
     * Boarded areas only: `raise` lifts the boards on legs above the new depth and insulates under
     * them (the area joins the layers); `leave` (the default when absent) keeps it boarded and uninsulated.
     */
    boards: z.enum(BOARDED_TREATMENTS).optional(),
  })
  .refine((e) => (e.polygon ? !e.at : !!e.at), {
    message: 'an exclusion has either a polygon or a point (at), not both or neither',
  })
  .refine((e) => !e.boards || e.kind === 'boarded', { message: 'only a boarded area can say whether its boards are raised (boards)', path: ['boards'] });
/** A parsed exclusion. */
export type Exclusion = z.infer<typeof exclusionSchema>;

/** The ceiling joists: direction, spacing and size, mm. */
export const joistsSchema = z.object({
  /** Direction the joists run, degrees from the plan's x axis. */
  angleDeg: z.number().finite().min(-3600).max(3600),
  centresMm: z.number().positive().max(2000),
  widthMm: z.number().positive().max(500),
  depthMm: z.number().positive().max(1000),
  /** Perpendicular offset of the first joist centre from the plan origin, mm. */
  offsetMm: coordinateSchema.default(0),
});
/** Parsed joists (offset defaults to 0). */
export type Joists = z.infer<typeof joistsSchema>;

/** Condition of the existing insulation; the takeoff counts only part of a poor layer. */
export const CONDITIONS = ['good', 'compressed', 'damp', 'patchy', 'none'] as const;
/** Existing insulation: depth (mm), condition and optional conductivity. */
export const existingSchema = z.object({
  depthMm: z.number().min(0).max(1000),
  condition: z.enum(CONDITIONS).default('good'),
  /** Thermal conductivity of the existing insulation, W/mK; a default applies when absent. */
  lambda: z.number().positive().max(1).optional(),
});
/** Parsed existing insulation. */
export type Existing = z.infer<typeof existingSchema>;

/** What the new insulation must reach: a total depth (mm) or a U-value (W/m²K). */
export const targetSchema = z.union([
  z.object({ depthMm: z.number().positive().max(1000) }).strict(),
  z.object({ uValue: z.number().positive().max(5) }).strict(),
]);
/** A parsed target. */
export type Target = z.infer<typeof targetSchema>;

/** Optional background underlay: an uploaded image placed in plan space. */
export const backgroundSchema = z.object({
  url: z.string().max(2000),
  /** Millimetres per image pixel, from a two-point calibration. */
  mmPerPx: z.number().positive().max(1e6),
  originMm: pointSchema.default([0, 0]),
  opacity: z.number().min(0).max(1).default(0.5),
  locked: z.boolean().default(false),
});

/** Product choices per layer role; ids refer to the company catalogue. */
export const productChoiceSchema = z.object({
  baseProductId: z.string().max(80).optional(),
  crossProductIds: z.array(z.string().max(80)).max(4).optional(),
});

/** The whole `quiltline-plan/1` file; unknown formats are refused with a clear message. */
export const planSchema = z.object({
  format: z.literal(PLAN_FORMAT, {
    error: (issue) => `unknown plan format ${JSON.stringify(issue.input)}: this version reads "${PLAN_FORMAT}"`,
  }),
  name: z.string().min(1).max(120),
  outline: z.array(pointSchema).max(PLAN_LIMITS.outlineCorners),
  eavesEdges: z.array(z.number().int().min(0)).max(PLAN_LIMITS.outlineCorners).default([]),
  eavesGapMm: z.number().min(0).max(500).default(50),
  /** How the eaves air path is kept open; the company's default when absent. */
  eavesMode: z.enum(EAVES_MODES).optional(),
  roof: roofSchema.optional(),
  site: siteNotesSchema.optional(),
  joists: joistsSchema,
  exclusions: z.array(exclusionSchema).max(PLAN_LIMITS.exclusions).default([]),
  existing: existingSchema.default({ depthMm: 0, condition: 'none' }),
  target: targetSchema.default({ depthMm: 270 }),
  background: backgroundSchema.optional(),
  products: productChoiceSchema.optional(),
  notes: z.string().max(5000).optional(),
});
/** A plan after parsing (defaults filled in). */
export type Plan = z.infer<typeof planSchema>;
/** A plan as written in a file (defaults may be missing). */
export type PlanInput = z.input<typeof planSchema>;
