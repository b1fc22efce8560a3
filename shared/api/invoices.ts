import { z } from 'zod';

/** Where an invoice line came from. */
export const INVOICE_LINE_SOURCES = ['quote', 'variation', 'credit'] as const;

/**
 * One line as entered: quantity in thousandths (1500 = 1.5) so totals stay integer;
 * unit price in minor units; tax rate in basis points (2000 = 20 %, 500 = 5 %, 0 = zero-rated).
 */
export const invoiceLineInputSchema = z.object({
  description: z.string().trim().min(1, { error: 'describe the line' }).max(300),
  quantityMilli: z.number().int().min(1, { error: 'quantity must be above 0' }).max(1_000_000_000),
  unitPriceMinor: z.number().int().min(-100_000_000).max(100_000_000),
  taxRateBp: z.number().int().min(0).max(10000),
});
export type InvoiceLineInput = z.infer<typeof invoiceLineInputSchema>;

export const invoiceLineSchema = invoiceLineInputSchema.extend({
  id: z.string(),
  position: z.number().int(),
  source: z.enum(INVOICE_LINE_SOURCES),
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
  totalMinor: z.number().int(),
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
  taxBreakdown: z.array(z.object({ rateBp: z.number().int(), netMinor: z.number().int(), taxMinor: z.number().int() })),
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
