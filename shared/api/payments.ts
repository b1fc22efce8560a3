import { z } from 'zod';

/** How a company asks for a deposit when a customer accepts a quote. */
export const DEPOSIT_MODES = ['none', 'percent', 'fixed'] as const;
export const depositModeSchema = z.enum(DEPOSIT_MODES);
export type DepositMode = z.infer<typeof depositModeSchema>;

/**
 * Office settings for payments, as the office edits them. `depositPercentBp` is basis points
 * (2500 = 25 %); `depositFixedMinor` is integer minor units (pence). Keys are never here: they come
 * from the server's environment.
 */
export const paymentSettingsBodySchema = z
  .object({
    depositMode: depositModeSchema,
    depositPercentBp: z.number().int().min(1, { error: 'enter a percentage above 0' }).max(10000, { error: 'at most 100 %' }).nullable().default(null),
    depositFixedMinor: z.number().int().min(1, { error: 'enter an amount above 0' }).max(100_000_000).nullable().default(null),
    paymentTermsDays: z.number().int().min(0).max(365, { error: 'at most 365 days' }),
  })
  .superRefine((v, ctx) => {
    if (v.depositMode === 'percent' && v.depositPercentBp == null)
      ctx.addIssue({ code: 'custom', path: ['depositPercentBp'], message: 'enter the deposit percentage' });
    if (v.depositMode === 'fixed' && v.depositFixedMinor == null)
      ctx.addIssue({ code: 'custom', path: ['depositFixedMinor'], message: 'enter the deposit amount' });
  });
export type PaymentSettingsBody = z.input<typeof paymentSettingsBodySchema>;

/** The settings as read back: the body plus the company's currency (from the company settings). */
export const paymentSettingsSchema = z.object({
  depositMode: depositModeSchema,
  depositPercentBp: z.number().int().nullable(),
  depositFixedMinor: z.number().int().nullable(),
  paymentTermsDays: z.number().int(),
  currency: z.string(),
});
export type PaymentSettings = z.infer<typeof paymentSettingsSchema>;

/** What the settings page shows besides the editable values. */
export const paymentSettingsViewSchema = z.object({
  settings: paymentSettingsSchema,
  /** 'service' when real keys are set in the environment; 'local' when a local stand-in is used */
  provider: z.enum(['service', 'local', 'off']),
  /** false when card payments are switched off (production without keys) */
  enabled: z.boolean(),
});
export type PaymentSettingsView = z.infer<typeof paymentSettingsViewSchema>;

/** `refunded`: the service took the money but it was not counted (expired or replaced checkout, a second deposit) and was paid back automatically. */
export const PAYMENT_STATUSES = ['open', 'paid', 'expired', 'refunded'] as const;
export const PAYMENT_PURPOSES = ['deposit', 'balance'] as const;

/** One attempt to collect money through the hosted checkout. */
export const paymentSchema = z.object({
  id: z.string(),
  purpose: z.enum(PAYMENT_PURPOSES),
  status: z.enum(PAYMENT_STATUSES),
  amountMinor: z.number().int(),
  currency: z.string(),
  jobId: z.string().nullable(),
  quoteId: z.string().nullable(),
  invoiceId: z.string().nullable(),
  paidAt: z.string().nullable(),
  createdAt: z.string(),
});
export type Payment = z.infer<typeof paymentSchema>;

/** Deposit state of one quote, for the quote and job pages. */
export const depositStatusSchema = z.object({
  quoteId: z.string(),
  /** none: no deposit is asked; due: asked and not paid yet; paid */
  state: z.enum(['none', 'due', 'paid']),
  amountMinor: z.number().int(),
  currency: z.string(),
  paidAt: z.string().nullable(),
  attempts: z.number().int(),
});
export type DepositStatus = z.infer<typeof depositStatusSchema>;

/** One entry of a job's money timeline. */
export const paymentTimelineEntrySchema = z.object({
  at: z.string(),
  kind: z.enum(['deposit-paid', 'invoice-issued', 'invoice-paid', 'credit-note-issued', 'refund']),
  text: z.string(),
  amountMinor: z.number().int(),
  currency: z.string(),
});
export type PaymentTimelineEntry = z.infer<typeof paymentTimelineEntrySchema>;

/** GET /api/payments/public/deposit/:link — the customer's view right after accepting. */
export const publicDepositSchema = z.object({
  state: z.enum(['none', 'due', 'paid']),
  amountMinor: z.number().int(),
  currency: z.string(),
  paidAt: z.string().nullable(),
  /** our deposit page (same origin), when a deposit is due on an accepted quote */
  payUrl: z.string().nullable(),
});
export type PublicDeposit = z.infer<typeof publicDepositSchema>;

/** The customer's signed quote link in a path (`/pay/deposit/:link`, `/api/payments/public/deposit/:link`). */
export const quoteLinkParamsSchema = z.object({ link: z.string().min(10).max(500) });

/** A private pay token in a path (`/pay/invoice/:token`, `/pay/done/:token`, …): 32 characters as issued, at most 64 accepted. */
export const payTokenParamsSchema = z.object({ token: z.string().min(1).max(64) });
