import { z } from 'zod';
import { taxClassSchema } from './settings';

/** Quote stages. `superseded` marks an older version after a sent quote was edited (the old one is kept). */
export const QUOTE_STATUSES = ['draft', 'sent', 'accepted', 'declined', 'expired', 'superseded'] as const;
export const quoteStatusSchema = z.enum(QUOTE_STATUSES);
export type QuoteStatus = z.infer<typeof quoteStatusSchema>;

export const lineKindSchema = z.enum(['material', 'extra', 'labour', 'charge', 'custom']);

/** A line as the office edits it. Money in minor units; quantity to three decimals. */
export const quoteLineBodySchema = z.object({
  kind: lineKindSchema.default('custom'),
  description: z.string().trim().min(1, { error: 'describe the line' }).max(300),
  quantity: z
    .number({ error: 'enter a quantity' })
    .min(0, { error: 'quantity cannot be negative' })
    .max(100_000)
    .refine((q) => Math.abs(q * 1000 - Math.round(q * 1000)) < 1e-6, { error: 'use at most three decimals' }),
  unit: z.string().trim().min(1).max(20).default('each'),
  unitPriceMinor: z.number({ error: 'enter a price' }).int({ error: 'price must be whole minor units' }).min(-100_000_000).max(100_000_000),
  unitCostMinor: z.number().int().min(0).max(100_000_000).default(0),
  taxClass: taxClassSchema,
  productId: z.string().max(80).nullable().optional(),
  extraKind: z.string().max(40).nullable().optional(),
  altQuantity: z.number().min(0).max(100_000).nullable().optional(),
  note: z.string().max(300).default(''),
});
export type QuoteLineBody = z.input<typeof quoteLineBodySchema>;

export const quoteLineSchema = quoteLineBodySchema.extend({
  id: z.string(),
  position: z.number().int(),
  netMinor: z.number().int(),
  costMinor: z.number().int(),
  rateBp: z.number().int(),
  taxMinor: z.number().int(),
});
export type QuoteLine = z.infer<typeof quoteLineSchema>;

export const taxBucketSchema = z.object({ rateBp: z.number().int(), netMinor: z.number().int(), taxMinor: z.number().int() });

export const quoteTotalsSchema = z.object({
  netMinor: z.number().int(),
  taxByRate: z.array(taxBucketSchema),
  taxMinor: z.number().int(),
  grossMinor: z.number().int(),
  costMinor: z.number().int(),
  marginMinor: z.number().int(),
  marginBp: z.number().int(),
});
export type QuoteTotalsBody = z.infer<typeof quoteTotalsSchema>;

export const quoteSavingSchema = z.object({
  kwhPerYear: z.number(),
  minorPerYear: z.number().int(),
  paybackYears: z.number().nullable(),
});

/** A deposit asked on acceptance (shared/quote/deposit.ts): amount in minor units, and the percentage when it is one. */
export const depositTermsSchema = z.object({ amountMinor: z.number().int(), percentBp: z.number().int().nullable() });

export const quoteSchema = z.object({
  id: z.string(),
  jobId: z.string(),
  number: z.string(),
  version: z.number().int(),
  status: quoteStatusSchema,
  currency: z.string(),
  locale: z.string(),
  issueDate: z.string(),
  validUntil: z.string(),
  lines: z.array(quoteLineSchema),
  totals: quoteTotalsSchema,
  saving: quoteSavingSchema.nullable(),
  /** The deposit the customer is asked when accepting, under the company's current payment settings; null when none. */
  deposit: depositTermsSchema.nullable(),
  /** The dated tax rates the quote was priced with (frozen with the quote), for live previews. */
  taxRates: z.array(z.object({ taxClass: taxClassSchema, rateBp: z.number().int(), validFrom: z.string(), label: z.string().optional() })),
  personHours: z.number(),
  siteHours: z.number(),
  warnings: z.array(z.string()),
  cautions: z.array(z.string()),
  customerBeforeInstall: z.array(z.string()),
  notes: z.string(),
  sentAt: z.string().nullable(),
  acceptedAt: z.string().nullable(),
  acceptedName: z.string().nullable(),
  declinedAt: z.string().nullable(),
  declineReason: z.string().nullable(),
  /** Older and newer versions of the same quote number. */
  versions: z.array(z.object({ id: z.string(), version: z.number().int(), status: quoteStatusSchema })),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Quote = z.infer<typeof quoteSchema>;

export const quoteSummarySchema = quoteSchema
  .pick({
    id: true,
    number: true,
    version: true,
    status: true,
    currency: true,
    issueDate: true,
    validUntil: true,
    sentAt: true,
  })
  .extend({ grossMinor: z.number().int() });
export type QuoteSummary = z.infer<typeof quoteSummarySchema>;

/** POST /api/jobs/:id/quotes — empty body builds from the saved takeoffs. */
export const createQuoteBodySchema = z.object({ notes: z.string().max(5000).optional() }).default({});

/** PATCH /api/quotes/:id — replaces the lines and/or edits the header. Editing a sent quote makes a new version. */
export const quotePatchSchema = z.object({
  lines: z.array(quoteLineBodySchema).max(200).optional(),
  validUntil: z.iso.date({ error: 'use a date like 2027-01-31' }).optional(),
  notes: z.string().max(5000).optional(),
});
export type QuotePatch = z.input<typeof quotePatchSchema>;

export const sendQuoteBodySchema = z.object({ message: z.string().max(2000).optional() }).default({});

/** The customer's view through the private link (no costs, no margin). */
export const publicQuoteSchema = z.object({
  status: quoteStatusSchema,
  number: z.string(),
  version: z.number().int(),
  company: z.object({ name: z.string(), email: z.string(), phone: z.string(), address: z.string() }),
  customerName: z.string(),
  propertyAddress: z.string(),
  currency: z.string(),
  locale: z.string(),
  issueDate: z.string(),
  validUntil: z.string(),
  lines: z.array(
    z.object({
      description: z.string(),
      quantity: z.number(),
      unit: z.string(),
      unitPriceMinor: z.number().int(),
      netMinor: z.number().int(),
      rateBp: z.number().int(),
    }),
  ),
  totals: quoteTotalsSchema.pick({ netMinor: true, taxByRate: true, taxMinor: true, grossMinor: true }),
  saving: quoteSavingSchema.nullable(),
  deposit: depositTermsSchema.nullable(),
  cautions: z.array(z.string()),
  customerBeforeInstall: z.array(z.string()),
  terms: z.string(),
  acceptedName: z.string().nullable(),
  acceptedAt: z.string().nullable(),
  declinedAt: z.string().nullable(),
});
export type PublicQuote = z.infer<typeof publicQuoteSchema>;

export const acceptQuoteBodySchema = z.object({
  name: z.string().trim().min(2, { error: 'type your full name to accept' }).max(200),
  acceptTerms: z.literal(true, { error: 'confirm that you accept the terms' }),
});
export type AcceptQuoteBody = z.infer<typeof acceptQuoteBodySchema>;

export const declineQuoteBodySchema = z.object({ reason: z.string().trim().max(2000).optional().default('') });
export type DeclineQuoteBody = z.input<typeof declineQuoteBodySchema>;

/** Why a private link does not open a quote; the public page explains each in plain words. */
export const LINK_PROBLEMS = ['invalid', 'expired', 'used', 'replaced', 'withdrawn'] as const;
export type LinkProblem = (typeof LINK_PROBLEMS)[number];
