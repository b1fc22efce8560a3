import { z } from 'zod';
import { taxClassSchema } from './settings';

/** Where an invoice line came from. */
export const INVOICE_LINE_SOURCES = ['quote', 'variation', 'credit'] as const;

/**
 * One line as the office enters it (a variation found on site, or a credit note line), shaped like a
 * quote line: money in minor units, quantity to three decimals, and the tax class whose rate on the
 * invoice date applies (the same rule as the quote).
 */
export const invoiceLineInputSchema = z.object({
  description: z.string().trim().min(1, { error: 'describe the line' }).max(300),
  quantity: z
    .number({ error: 'enter a quantity' })
    .gt(0, { error: 'quantity must be above 0' })
    .max(100_000)
    .refine((q) => Math.abs(q * 1000 - Math.round(q * 1000)) < 1e-6, { error: 'use at most three decimals' }),
  unit: z.string().trim().min(1).max(20).default('each'),
  unitPriceMinor: z.number({ error: 'enter a price' }).int({ error: 'price must be whole minor units' }).min(-100_000_000).max(100_000_000),
  taxClass: taxClassSchema,
});
export type InvoiceLineInput = z.input<typeof invoiceLineInputSchema>;

export const invoiceLineSchema = z.object({
  id: z.string(),
  position: z.number().int(),
  source: z.enum(INVOICE_LINE_SOURCES),
  description: z.string(),
  quantity: z.number(),
  unit: z.string(),
  unitPriceMinor: z.number().int(),
  taxClass: z.string().nullable(),
  rateBp: z.number().int(),
  netMinor: z.number().int(),
  taxMinor: z.number().int(),
  grossMinor: z.number().int(),
});
export type InvoiceLine = z.infer<typeof invoiceLineSchema>;

/** Office creates the invoice of an installed job: the accepted quote plus these variations. */
export const invoiceCreateSchema = z.object({
  jobId: z.uuid({ error: 'choose a job' }),
  variations: z.array(invoiceLineInputSchema).max(100).optional().default([]),
  notes: z.string().max(2000).optional().default(''),
  /** e-mail the PDF and pay link to the customer right away */
  send: z.boolean().optional().default(true),
});
export type InvoiceCreate = z.input<typeof invoiceCreateSchema>;

/** Only an unpaid invoice can change; a paid one is corrected with a credit note. */
export const invoicePatchSchema = z.object({
  variations: z.array(invoiceLineInputSchema).max(100).optional(),
  notes: z.string().max(2000).optional(),
  dueDate: z.iso.date({ error: 'use a date like 2027-01-31' }).optional(),
});
export type InvoicePatch = z.input<typeof invoicePatchSchema>;

export const creditNoteCreateSchema = z.object({
  reason: z.string().trim().min(1, { error: 'say why' }).max(500),
  lines: z.array(invoiceLineInputSchema).min(1, { error: 'add at least one line' }).max(100),
  /** pay the credit back to the card the invoice was paid with */
  refund: z.boolean().optional().default(false),
});
export type CreditNoteCreate = z.input<typeof creditNoteCreateSchema>;

export const INVOICE_STATUSES = ['issued', 'paid'] as const;

export const invoiceSummarySchema = z.object({
  id: z.string(),
  kind: z.enum(['invoice', 'credit_note']),
  number: z.string(),
  jobId: z.string(),
  jobReference: z.string(),
  customerName: z.string(),
  status: z.enum(INVOICE_STATUSES),
  overdue: z.boolean(),
  issueDate: z.string(),
  dueDate: z.string().nullable(),
  currency: z.string(),
  grossMinor: z.number().int(),
  balanceMinor: z.number().int(),
  paidAt: z.string().nullable(),
});
export type InvoiceSummary = z.infer<typeof invoiceSummarySchema>;

export const invoiceSchema = invoiceSummarySchema.extend({
  quoteId: z.string().nullable(),
  quoteReference: z.string().nullable(),
  creditedInvoiceId: z.string().nullable(),
  creditedInvoiceNumber: z.string().nullable(),
  customerEmail: z.string(),
  billingAddress: z.array(z.string()),
  lines: z.array(invoiceLineSchema),
  netMinor: z.number().int(),
  taxMinor: z.number().int(),
  /** tax by rate, for the PDF and the books */
  taxByRate: z.array(z.object({ rateBp: z.number().int(), netMinor: z.number().int(), taxMinor: z.number().int() })),
  depositMinor: z.number().int(),
  creditedMinor: z.number().int(),
  notes: z.string(),
  reason: z.string(),
  creditNotes: z.array(invoiceSummarySchema),
  sentAt: z.string().nullable(),
  payUrl: z.string().nullable(),
});
export type Invoice = z.infer<typeof invoiceSchema>;

export const invoiceListQuerySchema = z.object({
  status: z.enum(['issued', 'paid', 'overdue']).optional(),
  jobId: z.uuid().optional(),
});
export type InvoiceListQuery = z.input<typeof invoiceListQuerySchema>;
