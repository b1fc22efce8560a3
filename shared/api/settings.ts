import { z } from 'zod';
import { EAVES_MODES } from '../plan/plan-schema';
import { addressSchema } from './customers';

/**
 * Tax classes a quote line can carry. `energy_saving` is for installing energy-saving materials
 * in homes (some places zero- or reduce-rate them for a period, e.g. UK VAT Notice 708/6);
 * `standard` is everything else on the job.
 */
export const TAX_CLASSES = ['energy_saving', 'standard'] as const;
export const taxClassSchema = z.enum(TAX_CLASSES);
export type TaxClass = z.infer<typeof taxClassSchema>;
export const TAX_CLASS_LABELS: Record<TaxClass, string> = {
  energy_saving: 'Installed energy-saving materials',
  standard: 'Standard',
};

/** The kinds of extra a quote can add from the plan's site checks and exclusions. */
export const EXTRA_KINDS = [
  'hatch_kit',
  'tank_jacket',
  'pipe_lagging',
  'downlight_cover',
  'eaves_tray',
  'walkway_board',
  'board_leg',
  'disposal',
  'other',
] as const;
export const extraKindSchema = z.enum(EXTRA_KINDS);
export type ExtraKind = z.infer<typeof extraKindSchema>;
export const EXTRA_KIND_LABELS: Record<ExtraKind, string> = {
  hatch_kit: 'Hatch insulation and draught-seal kit',
  tank_jacket: 'Tank jacket',
  pipe_lagging: 'Pipe lagging (per metre)',
  downlight_cover: 'Downlight cover',
  eaves_tray: 'Eaves ventilation tray',
  walkway_board: 'Walkway board',
  board_leg: 'Board-raising leg',
  disposal: 'Disposal',
  other: 'Other',
};

export const currencySchema = z
  .string()
  .trim()
  .regex(/^[A-Z]{3}$/, { error: 'use a three-letter currency code such as GBP' });

const minor = (what: string) =>
  z
    .number({ error: `enter ${what}` })
    .int({ error: `${what} must be a whole number of minor units` })
    .min(0)
    .max(1_000_000_000);

/** A roll product in the company catalogue. Lengths in mm, prices in minor units per roll. */
export const productBodySchema = z.object({
  name: z.string().trim().min(1, { error: 'name the product' }).max(160),
  supplierCode: z.string().trim().max(60).default(''),
  thicknessMm: z.number().positive({ error: 'thickness must be above 0 mm' }).max(500),
  rollWidthMm: z.number().positive({ error: 'roll width must be above 0 mm' }).max(3000),
  /** How many lanes the roll is split into (1 = not split). */
  lanes: z.number().int().min(1).max(6).default(1),
  rollLengthMm: z.number().positive({ error: 'roll length must be above 0 mm' }).max(50_000),
  coverageM2: z.number().positive({ error: 'coverage must be above 0 m²' }).max(100),
  lambdaWmK: z.number().min(0.015, { error: 'conductivity below 0.015 W/mK is not a roll product' }).max(0.1),
  unitPriceMinor: minor('the unit price'),
  unitCostMinor: minor('the unit cost').default(0),
  taxClass: taxClassSchema.default('energy_saving'),
  /** Layer roles the product may be used for. */
  roles: z
    .array(z.enum(['base', 'cross']))
    .min(1, { error: 'choose at least one layer role' })
    .default(['base', 'cross']),
  active: z.boolean().default(true),
});
export type ProductBody = z.input<typeof productBodySchema>;
export const productSchema = productBodySchema.extend({ id: z.string() });
export type Product = z.infer<typeof productSchema>;

/** An extra item (kit, cover, board, disposal) with its price and fitting time. */
export const extraBodySchema = z.object({
  kind: extraKindSchema,
  name: z.string().trim().min(1, { error: 'name the extra' }).max(160),
  unit: z.enum(['each', 'm', 'job']).default('each'),
  unitPriceMinor: minor('the unit price'),
  unitCostMinor: minor('the unit cost').default(0),
  /** Fitting time per unit for one person, minutes; added to the labour. */
  minutesPerUnit: z.number().min(0).max(600).default(0),
  taxClass: taxClassSchema.default('standard'),
  active: z.boolean().default(true),
});
export type ExtraBody = z.input<typeof extraBodySchema>;
export const extraSchema = extraBodySchema.extend({ id: z.string() });
export type Extra = z.infer<typeof extraSchema>;

/** A tax rate for one class, in basis points (2000 = 20%), applying from `validFrom` (inclusive). */
export const taxRateBodySchema = z.object({
  taxClass: taxClassSchema,
  rateBp: z.number().int().min(0).max(10_000, { error: 'a rate above 100% is not allowed' }),
  validFrom: z.iso.date({ error: 'use a date like 2027-04-01' }),
  label: z.string().trim().max(120).default(''),
});
export type TaxRateBody = z.input<typeof taxRateBodySchema>;
export const taxRateSchema = taxRateBodySchema.extend({ id: z.string() });
export type TaxRate = z.infer<typeof taxRateSchema>;

/** Labour: laying speed per layer role, rate per person-hour, crew and minimum charge. */
export const labourSettingsSchema = z.object({
  baseM2PerHour: z.number().positive({ error: 'enter the base-layer laying speed' }).max(200),
  crossM2PerHour: z.number().positive({ error: 'enter the cross-layer laying speed' }).max(200),
  hourlyRateMinor: minor('the hourly rate'),
  hourlyCostMinor: minor('the hourly cost').default(0),
  crewSize: z.number().int().min(1).max(10),
  minimumChargeMinor: minor('the minimum charge').default(0),
  /** Labour is rounded up to this many minutes (per line). */
  roundUpMinutes: z.number().int().min(1).max(240).default(15),
  taxClass: taxClassSchema.default('energy_saving'),
});
export type LabourSettings = z.infer<typeof labourSettingsSchema>;

/** How many extras the plan implies, where the plan alone cannot say (common practice; editable). */
export const extraRulesSchema = z.object({
  pipeLaggingMPerTank: z.number().min(0).max(50).default(3),
  walkwayBoardsPerTank: z.number().int().min(0).max(20).default(3),
  boardLegsPerM2: z.number().min(0).max(20).default(4),
  disposalPerJob: z.number().int().min(0).max(10).default(1),
  eavesTrays: z.boolean().default(true),
});
export type ExtraRules = z.infer<typeof extraRulesSchema>;

/** What a company may ask installers to record on finishing a job (none by default). */
export const ACTUALS_PARTS = ['rolls', 'hours', 'extras'] as const;
export type ActualsPart = (typeof ACTUALS_PARTS)[number];

export const companySettingsBodySchema = z.object({
  companyName: z.string().trim().min(1, { error: 'enter the company name' }).max(200),
  address: addressSchema,
  email: z.union([z.email({ error: 'enter a valid e-mail address' }).max(254), z.literal('')]).default(''),
  phone: z.string().trim().max(40).default(''),
  taxNumber: z.string().trim().max(40).default(''),
  terms: z.string().max(10_000).default(''),
  validityDays: z.number().int().min(1, { error: 'a quote must be valid for at least one day' }).max(365),
  currency: currencySchema,
  locale: z.string().trim().min(2).max(20).default('en-GB'),
  /** Heating degree days a year, K·day (UK standard year, base 15.5 °C: about 2,462). */
  degreeDays: z.number().min(0).max(10_000),
  /** Fuel price in minor units per kWh; may have decimals (6.5 = 6.5 p/kWh). */
  fuelPriceMinorPerKwh: z.number().min(0).max(10_000),
  /** Seasonal efficiency of the heating system, 0–1 (a condensing gas boiler is about 0.85–0.90). */
  heatingEfficiency: z.number().gt(0).max(5),
  /** Waste allowance for the rule-of-thumb roll count, as a fraction (0.1 = 10%). */
  wasteAllowance: z.number().min(0).max(1),
  /**
   * Minimum usable offcut length for the roll plan, mm: no butt-jointed piece is shorter and only
   * longer offcuts are kept for other strips. 500 by default (common practice: a shorter length
   * of roll does not stay butted tight and is fiddly to place between joists).
   */
  minOffcutMm: z
    .number({ error: 'enter the minimum usable offcut length' })
    .min(100, { error: 'at least 100 mm' })
    .max(3000, { error: 'at most 3000 mm' })
    .default(500),
  /** Which roll count a quote prices by default. */
  rollCountMethod: z.enum(['packing', 'area']).default('packing'),
  /**
   * How the eaves air path is kept open on plans that do not choose: `gap` keeps the insulation
   * back from the eaves, `ventilators` fits an eaves ventilator in each rafter space and runs the
   * insulation over the wall plate (BS 5250:2021; BRE BR 262). Default `gap`.
   */
  eavesMode: z.enum(EAVES_MODES, { error: 'choose a gap or eaves ventilators' }).default('gap'),
  /**
   * Insulation the company's hatch kit puts on the lid, mm (at the takeoff's existing-layer
   * conductivity). Credited in the whole-ceiling U-value only while an active hatch kit is in the
   * catalogue, so the U-value reflects what the quote's kit provides; 0 = not given, no credit.
   */
  hatchKitInsulationMm: z
    .number({ error: 'enter the hatch kit insulation depth' })
    .min(0, { error: 'at least 0 mm' })
    .max(300, { error: 'at most 300 mm' })
    .default(0),
  labour: labourSettingsSchema,
  /** Which actuals an installer must record to finish a job: rolls used, hours on site, extras used. */
  actualsRequired: z.array(z.enum(ACTUALS_PARTS)).max(3).default([]),
  extraRules: extraRulesSchema.default({
    pipeLaggingMPerTank: 3,
    walkwayBoardsPerTank: 3,
    boardLegsPerM2: 4,
    disposalPerJob: 1,
    eavesTrays: true,
  }),
});
export type CompanySettingsBody = z.input<typeof companySettingsBodySchema>;
export const companySettingsSchema = companySettingsBodySchema.extend({ hasLogo: z.boolean() });
export type CompanySettings = z.infer<typeof companySettingsSchema>;
